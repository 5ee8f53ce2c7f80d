/**
 * Pin-jointed bar frameworks as sheaves over the real field: stalk R^d on
 * each joint (displacement), R on each bar (elongation), and the map from
 * either end joint to the bar the bar's unit direction as a 1×d row. The
 * coboundary is then the compatibility (rigidity) matrix, H^0 = mechanisms
 * including the d(d+1)/2 rigid-body motions, H^1 = states of self-stress.
 *
 * Sources: J. C. Maxwell (1864), Phil. Mag. 27, 294–299, with C. R. Calladine
 * (1978), IJSS 14, 161–172 (m − s = d·j − b); S. Pellegrino and C. R. Calladine
 * (1986), IJSS 22, 409–428 (m and s from the rank of the equilibrium matrix);
 * G. Laman (1970), J. Eng. Math. 4, 331–340; A. Cauchy (1813) and M. Dehn (1916).
 */
import { describe, expect, test } from 'vitest';
import { cohomology, type ModelFile } from '../../shared/engine';

type Point = number[];
type Bar = [number, number];
const METHODS = ['morse', 'direct'] as const;
const REAL = { kind: 'real' } as const;

/** The framework sheaf of joints at `points` joined by `bars`. */
function framework(points: Point[], bars: Bar[]): ModelFile {
  const d = points[0].length;
  const entries: NonNullable<ModelFile['maps']>['entries'] = [];
  for (const [p, q] of bars) {
    const [a, b] = p < q ? [p, q] : [q, p];
    const diff = points[b].map((x, k) => x - points[a][k]);
    const len = Math.hypot(...diff);
    const row = diff.map((x) => x / len);
    entries.push({ face: [a], coface: [a, b], matrix: [row] }, { face: [b], coface: [a, b], matrix: [row] });
  }
  return {
    format: 'gluefield.sheaf',
    version: 1,
    field: REAL,
    simplices: [...points.map((_, i) => [i]), ...bars.map(([p, q]) => [p, q])],
    stalks: { default: d, cells: bars.map(([p, q]) => ({ cell: [p, q], dim: 1 })) },
    maps: { default: 'zero', entries },
  };
}

/** Deterministic pseudo-random numbers (mulberry32) for generic coordinates. */
function prng(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * A Laman graph on j joints by Henneberg steps: start from one bar, then
 * alternately add a joint with two bars (type 1) or split an existing bar
 * through a new joint joined to a third joint (type 2). Every step keeps
 * b = 2j − 3 and the subset count; the test also checks the count directly.
 */
function henneberg(j: number, rand: () => number): Bar[] {
  const bars: Bar[] = [[0, 1]];
  for (let v = 2; v < j; v++) {
    if (v >= 3 && v % 2 === 1) {
      const [a, b] = bars.splice(Math.floor(rand() * bars.length), 1)[0];
      const others = Array.from({ length: v }, (_, i) => i).filter((i) => i !== a && i !== b);
      const c = others[Math.floor(rand() * others.length)];
      bars.push([a, v], [b, v], [c, v]);
    } else {
      const a = Math.floor(rand() * v);
      const b = (a + 1 + Math.floor(rand() * (v - 1))) % v;
      bars.push([a, v], [b, v]);
    }
  }
  return bars;
}

/** Laman's condition: every subset of j' ≥ 2 joints spans at most 2j' − 3 bars. */
function satisfiesLamanCount(j: number, bars: Bar[]): boolean {
  for (let mask = 0; mask < 1 << j; mask++) {
    let size = 0;
    for (let i = 0; i < j; i++) if (mask & (1 << i)) size++;
    if (size < 2) continue;
    const spanned = bars.filter(([a, b]) => mask & (1 << a) && mask & (1 << b)).length;
    if (spanned > 2 * size - 3) return false;
  }
  return true;
}

interface Example {
  name: string;
  points: Point[];
  bars: Bar[];
  /** Published (mechanisms, self-stresses) = (dim H^0, dim H^1). */
  dims: [number, number];
  source: string;
}

const SQUARE: Point[] = [[0, 0], [1, 0], [1, 1], [0, 1]];
const SQUARE_BARS: Bar[] = [[0, 1], [1, 2], [2, 3], [0, 3]];
const LINE: Point[] = [[0, 0], [1, 0], [2, 0]];
const rand = prng(19700331);
const LAMAN_J = 8;
const LAMAN_BARS = henneberg(LAMAN_J, rand);
const LAMAN_POINTS: Point[] = Array.from({ length: LAMAN_J }, () => [rand() * 10 - 5, rand() * 10 - 5]);
const OCTAHEDRON: Point[] = [[1, 0, 0], [-1, 0, 0], [0, 1, 0], [0, -1, 0], [0, 0, 1], [0, 0, -1]];
const OCTAHEDRON_BARS: Bar[] = [];
for (let a = 0; a < 6; a++) for (let b = a + 1; b < 6; b++) if (Math.floor(a / 2) !== Math.floor(b / 2)) OCTAHEDRON_BARS.push([a, b]);

const PC = 'Pellegrino–Calladine 1986';
const EXAMPLES: Example[] = [
  { name: 'plane triangle', points: [[0, 0], [1, 0], [0.3, 0.8]], bars: [[0, 1], [1, 2], [0, 2]], dims: [3, 0], source: PC },
  { name: 'plane square without diagonal', points: SQUARE, bars: SQUARE_BARS, dims: [4, 0], source: PC },
  { name: 'plane square with one diagonal', points: SQUARE, bars: [...SQUARE_BARS, [0, 2]], dims: [3, 0], source: PC },
  { name: 'plane square with both diagonals', points: SQUARE, bars: [...SQUARE_BARS, [0, 2], [1, 3]], dims: [3, 1], source: PC },
  { name: 'three collinear joints, two bars', points: LINE, bars: [[0, 1], [1, 2]], dims: [4, 0], source: PC },
  { name: 'triangle with collinear joints', points: LINE, bars: [[0, 1], [1, 2], [0, 2]], dims: [4, 1], source: PC },
  { name: `generic Laman framework on ${LAMAN_J} joints`, points: LAMAN_POINTS, bars: LAMAN_BARS, dims: [3, 0], source: 'Laman 1970' },
  { name: 'octahedron in space', points: OCTAHEDRON, bars: OCTAHEDRON_BARS, dims: [6, 0], source: 'Cauchy 1813 / Dehn 1916' },
];

const alternating = (v: number[]) => v.reduce((s, x, k) => s + (k % 2 === 0 ? x : -x), 0);

describe('pin-jointed frameworks: (mechanisms, self-stresses) = (dim H^0, dim H^1)', () => {
  test('the Laman example satisfies the hypotheses of Laman 1970: b = 2j − 3 and the subset count', () => {
    expect(LAMAN_BARS).toHaveLength(2 * LAMAN_J - 3);
    expect(new Set(LAMAN_BARS.map(([a, b]) => [Math.min(a, b), Math.max(a, b)].join())).size).toBe(LAMAN_BARS.length);
    expect(satisfiesLamanCount(LAMAN_J, LAMAN_BARS)).toBe(true);
  });

  test('the octahedron has 6 joints and 12 bars (Cauchy 1813 / Dehn 1916)', () => {
    expect(OCTAHEDRON_BARS).toHaveLength(12);
  });

  for (const ex of EXAMPLES) {
    const d = ex.points[0].length;
    const j = ex.points.length;
    const b = ex.bars.length;
    for (const method of METHODS) {
      test(`${ex.name} (d=${d}) has ${ex.dims[0]} mechanisms and ${ex.dims[1]} self-stresses (${ex.source}; ${method})`, () => {
        const r = cohomology(framework(ex.points, ex.bars), { method, field: REAL });
        expect(r.dims).toEqual(ex.dims); // the source named in the test title
        expect(r.numericallyUncertain).not.toBe(true);
      });
      test(`${ex.name}: mechanisms − self-stresses = d·j − b (Maxwell 1864 / Calladine 1978; ${method})`, () => {
        const r = cohomology(framework(ex.points, ex.bars), { method, field: REAL });
        expect(r.dims[0] - r.dims[1]).toBe(d * j - b);
        expect(r.euler).toBe(d * j - b);
        expect(r.euler).toBe(alternating(r.dims));
        if (method === 'morse') expect(alternating(r.morse!.criticalCochainDims)).toBe(r.euler);
      });
    }
    test(`${ex.name}: morse and direct agree`, () => {
      const m = cohomology(framework(ex.points, ex.bars), { method: 'morse', field: REAL });
      const dr = cohomology(framework(ex.points, ex.bars), { method: 'direct', field: REAL });
      expect(m.dims).toEqual(dr.dims);
      expect(m.euler).toBe(dr.euler);
    });
    test(`${ex.name}: at least the d(d+1)/2 rigid-body motions are mechanisms (${PC})`, () => {
      const r = cohomology(framework(ex.points, ex.bars), { method: 'direct', field: REAL });
      expect(r.dims[0]).toBeGreaterThanOrEqual((d * (d + 1)) / 2);
    });
  }

  test('generic Laman frameworks from other seeds are rigid too: (3, 0) (Laman 1970)', () => {
    for (const seed of [1, 2, 3]) {
      const r2 = prng(seed);
      const j = 6 + seed;
      const bars = henneberg(j, r2);
      const pts = Array.from({ length: j }, () => [r2() * 10 - 5, r2() * 10 - 5]);
      expect(satisfiesLamanCount(j, bars)).toBe(true);
      for (const method of METHODS) expect(cohomology(framework(pts, bars), { method, field: REAL }).dims).toEqual([3, 0]);
    }
  });
});
