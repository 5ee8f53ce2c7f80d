/**
 * The pin-jointed frame kit on the examples of check-values.md
 * ("Pin-jointed frameworks"), each imported from CSV:
 * (mechanisms with rigid motions, self-stresses) = (dim H^0, dim H^1) after
 * S. Pellegrino, C. R. Calladine, IJSS 22 (1986) 409–428; the count
 * m − s = d·j − b (free-standing) after J. C. Maxwell, Phil. Mag. 27 (1864)
 * 294–299 and C. R. Calladine, IJSS 14 (1978) 161–172; generic Laman
 * frameworks rigid after G. Laman, J. Eng. Math. 4 (1970) 331–340; the
 * octahedron rigid after Cauchy (1813) and Dehn (1916).
 */
import { describe, expect, test } from 'vitest';
import { analyseFrame, readFrameCsv, type Frame, type FrameReport } from '../../shared/kits';

type Point = number[];

function csv(points: Point[], bars: [number, number][], fixed: Record<number, string> = {}): [string, string] {
  const d = points[0].length;
  const head = d === 2 ? 'id,x,y,fixed' : 'id,x,y,z,fixed';
  const joints = points.map((p, i) => `J${i},${p.join(',')},${fixed[i] ?? ''}`);
  return [`${head}\n${joints.join('\n')}\n`, `id,from,to\n${bars.map(([a, b], i) => `B${i},J${a},J${b}`).join('\n')}\n`];
}

function frameOf(points: Point[], bars: [number, number][], fixed: Record<number, string> = {}): Frame {
  const r = readFrameCsv(...csv(points, bars, fixed));
  if (!r.frame) throw new Error(JSON.stringify(r.problems));
  return r.frame;
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

/** A Laman graph by Henneberg steps (each keeps b = 2j − 3 and the subset count). */
function henneberg(j: number, rand: () => number): [number, number][] {
  const bars: [number, number][] = [[0, 1]];
  for (let v = 2; v < j; v++) {
    if (v >= 3 && v % 2 === 1) {
      const [a, b] = bars.splice(Math.floor(rand() * bars.length), 1)[0];
      const others = Array.from({ length: v }, (_, i) => i).filter((i) => i !== a && i !== b);
      bars.push([a, v], [b, v], [others[Math.floor(rand() * others.length)], v]);
    } else {
      const a = Math.floor(rand() * v);
      const b = (a + 1 + Math.floor(rand() * (v - 1))) % v;
      bars.push([a, v], [b, v]);
    }
  }
  return bars;
}

const SQUARE: Point[] = [[0, 0], [1, 0], [1, 1], [0, 1]];
const SQUARE_BARS: [number, number][] = [[0, 1], [1, 2], [2, 3], [0, 3]];
const LINE: Point[] = [[0, 0], [1, 0], [2, 0]];
const rand = prng(1970);
const LAMAN_POINTS: Point[] = Array.from({ length: 9 }, () => [rand() * 10, rand() * 10]);
const LAMAN_BARS = henneberg(9, rand);
const OCTAHEDRON: Point[] = [[1, 0, 0], [-1, 0, 0], [0, 1, 0], [0, -1, 0], [0, 0, 1], [0, 0, -1]];
const OCTAHEDRON_BARS: [number, number][] = [];
for (let a = 0; a < 6; a++) for (let b = a + 1; b < 6; b++) if (Math.floor(a / 2) !== Math.floor(b / 2)) OCTAHEDRON_BARS.push([a, b]);

const PC = 'Pellegrino–Calladine 1986';
const EXAMPLES: { name: string; points: Point[]; bars: [number, number][]; dims: [number, number]; source: string }[] = [
  { name: 'plane triangle', points: [[0, 0], [1, 0], [0.3, 0.8]], bars: [[0, 1], [1, 2], [0, 2]], dims: [3, 0], source: PC },
  { name: 'square without diagonal', points: SQUARE, bars: SQUARE_BARS, dims: [4, 0], source: PC },
  { name: 'square with one diagonal', points: SQUARE, bars: [...SQUARE_BARS, [0, 2]], dims: [3, 0], source: PC },
  { name: 'square with both diagonals', points: SQUARE, bars: [...SQUARE_BARS, [0, 2], [1, 3]], dims: [3, 1], source: PC },
  { name: 'three collinear joints, two bars', points: LINE, bars: [[0, 1], [1, 2]], dims: [4, 0], source: PC },
  { name: 'triangle with collinear joints', points: LINE, bars: [[0, 1], [1, 2], [0, 2]], dims: [4, 1], source: PC },
  { name: 'generic Laman framework on 9 joints', points: LAMAN_POINTS, bars: LAMAN_BARS, dims: [3, 0], source: 'Laman 1970' },
  { name: 'octahedron in space', points: OCTAHEDRON, bars: OCTAHEDRON_BARS, dims: [6, 0], source: 'Cauchy 1813 / Dehn 1916' },
];

/** δ⁰ᵀ t at every joint, written out from the geometry: Σ over bars at the joint of t · (unit vector away from it). */
function equilibriumResidual(frame: Frame, t: Record<string, number>): number {
  const pos = new Map(frame.joints.map((j) => [j.id, j.position]));
  const force = new Map(frame.joints.map((j) => [j.id, j.position.map(() => 0)]));
  for (const bar of frame.bars) {
    const a = pos.get(bar.from)!;
    const b = pos.get(bar.to)!;
    const len = Math.hypot(...b.map((x, k) => x - a[k]));
    b.forEach((x, k) => {
      const u = (x - a[k]) / len;
      force.get(bar.from)![k] += t[bar.id] * u;
      force.get(bar.to)![k] -= t[bar.id] * u;
    });
  }
  let worst = 0;
  for (const j of frame.joints) j.fixed.forEach((held, k) => held || (worst = Math.max(worst, Math.abs(force.get(j.id)![k]))));
  return worst;
}

/** First-order elongation of each bar under displacements u: (u_to − u_from) · unit vector. */
function largestElongation(frame: Frame, u: Record<string, number[]>): number {
  const pos = new Map(frame.joints.map((j) => [j.id, j.position]));
  let worst = 0;
  for (const bar of frame.bars) {
    const a = pos.get(bar.from)!;
    const b = pos.get(bar.to)!;
    const len = Math.hypot(...b.map((x, k) => x - a[k]));
    const e = b.reduce((s, x, k) => s + ((x - a[k]) / len) * (u[bar.to][k] - u[bar.from][k]), 0);
    worst = Math.max(worst, Math.abs(e));
  }
  return worst;
}

describe('check-values frameworks through the frame kit', () => {
  for (const ex of EXAMPLES) {
    const d = ex.points[0].length;
    const frame = frameOf(ex.points, ex.bars);
    const r: FrameReport = analyseFrame(frame);
    const j = ex.points.length;
    const b = ex.bars.length;
    test(`${ex.name}: (dim H^0, dim H^1) = (${ex.dims}) (${ex.source})`, () => {
      expect(r.dims).toEqual(ex.dims);
      expect(r.numericallyUncertain).toBe(false);
    });
    test(`${ex.name}: mechanisms − self-stresses = d·j − b (Maxwell 1864 / Calladine 1978)`, () => {
      expect(r.dims[0] - r.dims[1]).toBe(d * j - b);
      expect(r.maxwellCalladine.count).toBe(d * j - b);
      expect(r.mechanisms + r.rigidMotions - r.selfStresses).toBe(d * j - b);
    });
    test(`${ex.name}: all d(d+1)/2 rigid-body motions are counted apart from the mechanisms (${PC})`, () => {
      expect(r.rigidMotions).toBe((d * (d + 1)) / 2);
      expect(r.mechanisms).toBe(ex.dims[0] - (d * (d + 1)) / 2);
      expect(r.mechanismModes).toHaveLength(r.mechanisms);
      expect(r.selfStressStates).toHaveLength(r.selfStresses);
    });
    test(`${ex.name}: self-stress states are in equilibrium and mechanism modes keep every bar length to first order`, () => {
      for (const t of r.selfStressStates) expect(equilibriumResidual(frame, t)).toBeLessThan(1e-9);
      for (const u of r.mechanismModes) expect(largestElongation(frame, u)).toBeLessThan(1e-9);
    });
  }

  test('the collinear triangle: geometry, not counting, decides, and the report says so (check-values.md)', () => {
    const r = analyseFrame(frameOf(LINE, [[0, 1], [1, 2], [0, 2]]));
    expect(r.maxwellCalladine.countPredicts).toEqual({ mechanisms: 0, selfStresses: 0 });
    expect(r.maxwellCalladine.agrees).toBe(false);
    expect(r.maxwellCalladine.explanation).toMatch(/geometry gives 1 and 1/);
    expect(r.classification.summary).toMatch(/statically indeterminate to degree 1, kinematically indeterminate to degree 1/);
    // The middle joint moves across the line; the bars carry 1 : 1 : −1 in self-stress.
    const [mode] = r.mechanismModes;
    expect(mode.J1[1]).toBeCloseTo(1, 9);
    expect(mode.J0[1]).toBeCloseTo(-0.5, 9);
    expect(mode.J2[1]).toBeCloseTo(-0.5, 9);
    expect(r.selfStressStates[0]).toEqual({ B0: 1, B1: 1, B2: -1 });
    // Three collinear joints and two bars: the count alone says 4 as well, so the count agrees.
    expect(analyseFrame(frameOf(LINE, [[0, 1], [1, 2]])).maxwellCalladine.agrees).toBe(true);
  });

  test('square with both diagonals: the self-stress loads sides and diagonals in opposite senses, in ratio 1 : √2', () => {
    const r = analyseFrame(frameOf(SQUARE, [...SQUARE_BARS, [0, 2], [1, 3]]));
    const t = r.selfStressStates[0];
    for (const side of ['B0', 'B1', 'B2', 'B3']) expect(t[side] / t.B4).toBeCloseTo(-1 / Math.SQRT2, 9);
    expect(t.B5).toBeCloseTo(t.B4, 9);
    expect(r.classification.summary).toMatch(/statically indeterminate to degree 1, kinematically determinate/);
  });
});

describe('supports', () => {
  test('a pinned and a roller support leave no rigid motion: the footbridge Warren truss is determinate (2·9 − 15 − 3 = 0)', () => {
    const points: Point[] = [[0, 0], [6, 0], [12, 0], [18, 0], [24, 0], [3, 4], [9, 4], [15, 4], [21, 4]];
    const bars: [number, number][] = [[0, 1], [1, 2], [2, 3], [3, 4], [5, 6], [6, 7], [7, 8], [0, 5], [1, 5], [1, 6], [2, 6], [2, 7], [3, 7], [3, 8], [4, 8]];
    const r = analyseFrame(frameOf(points, bars, { 0: 'xy', 4: 'y' }));
    expect(r.constraints).toBe(3);
    expect(r.dims).toEqual([0, 0]);
    expect(r.rigidMotions).toBe(0);
    expect(r.classification.summary).toBe('statically determinate, kinematically determinate');
    expect(r.maxwellCalladine.count).toBe(0);
    expect(r.caution).toMatch(/first-order.*licensed engineers/s);
  });
  test('a single pin allows one rigid motion, the rotation about it; a roller alone allows two', () => {
    const tri: Point[] = [[0, 0], [4, 0], [1, 3]];
    const bars: [number, number][] = [[0, 1], [1, 2], [0, 2]];
    const pinned = analyseFrame(frameOf(tri, bars, { 0: 'xy' }));
    expect([pinned.dims[0], pinned.rigidMotions, pinned.mechanisms]).toEqual([1, 1, 0]);
    expect(pinned.classification.summary).toMatch(/supports still allow 1 rigid-body motion$/);
    const roller = analyseFrame(frameOf(tri, bars, { 1: 'y' }));
    expect([roller.dims[0], roller.rigidMotions, roller.mechanisms]).toEqual([2, 2, 0]);
  });
  test('in space, a straight two-bar frame has 5 rigid motions (turning about its own line moves no joint) and 1 mechanism', () => {
    const r = analyseFrame(frameOf([[0, 0, 0], [1, 0, 0], [2, 0, 0]], [[0, 1], [1, 2]]));
    // 3·3 − 2 = 7 = dim H^0: the 5 motions that move joints, plus the middle joint's 2 sideways modes.
    expect(r.dims).toEqual([7, 0]);
    expect(r.rigidMotions).toBe(5);
    expect(r.mechanisms).toBe(2);
  });
});

describe('bad geometry is rejected with a located problem', () => {
  test.each([
    ['id,x,y\nA,0,0\nB,0,0\n', 'id,from,to\n1,A,B\n', /joints\.csv line 3: joints "A" and "B" coincide/],
    ['id,x,y\nA,0,0\nB,1,0\n', 'id,from,to\n1,A,C\n', /bars\.csv line 2: bar "1" ends at a missing joint "C"/],
    ['id,x,y\nA,0,0\nB,1,0\n', 'id,from,to\n1,A,A\n', /bar "1" has zero length/],
    ['id,x,y\nA,0,0\nB,1,0\n', 'id,from,to\n1,A,B\n2,B,A\n', /bars "1" and "2" both join/],
    ['id,x,y\nA,0,zero\n', 'id,from,to\n', /y of joint "A" "zero" is not a number/],
    ['id,x,y,fixed\nA,0,0,xz\n', 'id,from,to\n', /"z" is not an axis of a plane/],
    ['id,x\nA,0\n', 'id,from,to\n', /missing column "y"/],
    ['id,x,y\nA,0,0\nA,1,1\n', 'id,from,to\n', /joint "A" is listed twice/],
  ])('%#', (joints, bars, message) => {
    const r = readFrameCsv(joints, bars);
    expect(r.frame).toBeUndefined();
    expect(`${r.problems[0].where}: ${r.problems[0].message}`).toMatch(message);
  });
});
