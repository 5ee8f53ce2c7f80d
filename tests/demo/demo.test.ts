/**
 * The invented demo scenarios compute to the cohomology they were designed
 * for. The designs are ours; the facts that fix the numbers are not:
 * graph cohomology of the constant sheaf (Hatcher 2002, ch. 2: H^0 counts
 * components, H^1 = edges − vertices + components), Maxwell (1864) with
 * Calladine (1978) for the truss count, and Hansen–Ghrist (2019) for
 * rotations around a cycle.
 */
import { describe, expect, test } from 'vitest';
import { cohomology, readModel, type ModelFile } from '../../shared/engine';
import {
  demoModels,
  footbridgeFrame,
  footbridgeFrameWithExtraDiagonal,
  ridgeLineRing,
  weatherStationRing,
  weatherStationRingConsistent,
} from '../../shared/demo';

const METHODS = ['morse', 'direct'] as const;

interface Design {
  build: () => ModelFile;
  dims: number[];
  why: string;
}

const DESIGNS: Record<string, Design> = {
  'ridge-line-ring': {
    build: ridgeLineRing,
    dims: [1, 3],
    why: 'connected graph, 12 links − 10 stations + 1 = 3 independent loops (Hatcher 2002, ch. 2)',
  },
  'footbridge-frame': {
    build: footbridgeFrame,
    dims: [0, 0],
    why: 'Maxwell–Calladine: mechanisms − self-stresses = 2j − b − supports = 18 − 15 − 3 = 0, and the Warren truss is rigid',
  },
  'footbridge-frame-extra-diagonal': {
    build: footbridgeFrameWithExtraDiagonal,
    dims: [0, 1],
    why: 'Maxwell–Calladine: 2j − b − supports = 18 − 16 − 3 = −1 with no mechanism, so one self-stress',
  },
  'weather-station-ring': {
    build: weatherStationRing,
    dims: [0, 0],
    why: 'the rotations round the ring multiply to 4.35°, not the identity, so ker(T − I) = 0 (Hansen–Ghrist 2019; Hatcher §3.H)',
  },
  'weather-station-ring-consistent': {
    build: weatherStationRingConsistent,
    dims: [2, 2],
    why: 'the rotations multiply to the identity: H^0 = R^2 and H^1 = coker(0) = R^2 (Hansen–Ghrist 2019; Hatcher §3.H)',
  },
};

const alternating = (v: number[]) => v.reduce((s, x, k) => s + (k % 2 === 0 ? x : -x), 0);

describe('demo scenarios', () => {
  test('demoModels() lists every designed scenario once, each with a name and a label on every vertex', () => {
    const demos = demoModels();
    expect(demos.map((d) => d.key).sort()).toEqual(Object.keys(DESIGNS).sort());
    for (const { model } of demos) {
      expect(model.name).toBeTruthy();
      expect(model.vertices?.length).toBeGreaterThan(0);
      for (const v of model.vertices!) {
        expect(v.label).toBeTruthy();
        expect(Number.isFinite(v.x) && Number.isFinite(v.y)).toBe(true);
      }
    }
  });

  for (const [key, design] of Object.entries(DESIGNS)) {
    test(`${key}: readModel accepts it with no problems`, () => {
      expect(readModel(design.build()).problems).toEqual([]);
    });
    for (const method of METHODS) {
      test(`${key} has dims ${JSON.stringify(design.dims)} (${design.why}; ${method})`, () => {
        const r = cohomology(design.build(), { method });
        expect(r.dims).toEqual(design.dims);
        expect(r.euler).toBe(alternating(r.dims));
        expect(r.numericallyUncertain).not.toBe(true);
      });
    }
  }

  test('ridge line stations are labelled RL-01 … RL-10', () => {
    expect(ridgeLineRing().vertices!.map((v) => v.label)).toEqual(
      Array.from({ length: 10 }, (_, i) => `RL-${String(i + 1).padStart(2, '0')}`),
    );
  });

  test('footbridge: 9 joints, 15 bars, 3 support constraints, so the Euler characteristic is 2j − b − 3 = 0 (Maxwell 1864 / Calladine 1978)', () => {
    const m = footbridgeFrame();
    const joints = m.simplices.filter((s) => s.length === 1).length;
    const bars = m.simplices.filter((s) => s.length === 2).length;
    expect([joints, bars]).toEqual([9, 15]);
    const r = cohomology(m);
    expect(r.cochainDims).toEqual([2 * joints - 3, bars]);
    expect(r.euler).toBe(2 * joints - bars - 3);
  });

  test('weather ring: stalk R^2 on six stations and six links, the frames of a ring (Hansen–Ghrist 2019)', () => {
    const r = cohomology(weatherStationRing());
    expect(r.cells).toEqual([6, 6]);
    expect(r.cochainDims).toEqual([12, 12]);
    expect(r.field).toBe('rational');
  });

  test('weather rings: GF(10007) and the reals agree with the rationals (integer-over-5^k entries, 5 invertible mod 10007)', () => {
    for (const field of [{ kind: 'prime', p: 10007 } as const, { kind: 'real' } as const]) {
      expect(cohomology(weatherStationRing(), { field }).dims).toEqual([0, 0]);
      expect(cohomology(weatherStationRingConsistent(), { field }).dims).toEqual([2, 2]);
    }
  });
});
