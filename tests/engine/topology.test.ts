/**
 * Cohomology of the constant sheaf on standard spaces against published
 * values. Source for every expected value: A. Hatcher, Algebraic Topology
 * (2002), ch. 2 (homology of spheres, surfaces, projective spaces) and §3.1
 * (universal coefficients, for the passage to cohomology over a field).
 * A constant sheaf of dimension d multiplies every entry by d.
 */
import { describe, expect, test } from 'vitest';
import { cohomology, type CohomologyReport } from '../../shared/engine';
import {
  constantSheaf,
  cycle,
  disc,
  kleinBottle,
  point,
  projectivePlane,
  solidSimplex,
  sphere2,
  sphere3,
  torus,
  wedgeOfCircles,
  type FieldOption,
  type Simplices,
} from './fixtures/triangulations';

type FieldName = 'rational' | 'GF(2)' | 'GF(3)' | 'real';
const FIELDS: Record<FieldName, FieldOption> = {
  rational: { kind: 'rational' },
  'GF(2)': { kind: 'prime', p: 2 },
  'GF(3)': { kind: 'prime', p: 3 },
  real: { kind: 'real' },
};
const METHODS = ['morse', 'direct'] as const;

interface Row {
  space: string;
  build: () => Simplices;
  /** Published dims over the rationals; `gf2` / `gf3` only where they differ. */
  rational: number[];
  gf2?: number[];
  gf3?: number[];
}

// Hatcher 2002, ch. 2 and §3.1: one row per line of the table of standard spaces.
const ROWS: Row[] = [
  { space: 'point', build: point, rational: [1] },
  { space: 'disc (triangulated square)', build: () => disc(2), rational: [1, 0, 0] },
  { space: 'solid 3-simplex', build: () => solidSimplex(3), rational: [1, 0, 0, 0] },
  { space: 'circle (cycle graph C_3)', build: () => cycle(3), rational: [1, 1] },
  { space: 'circle (cycle graph C_7)', build: () => cycle(7), rational: [1, 1] },
  { space: '2-sphere (boundary of a tetrahedron)', build: sphere2, rational: [1, 0, 1] },
  { space: 'torus (5×5 grid)', build: () => torus(5), rational: [1, 2, 1] },
  { space: 'torus (6×6 grid)', build: () => torus(6), rational: [1, 2, 1] },
  { space: 'Klein bottle (5×5 grid)', build: () => kleinBottle(5), rational: [1, 1, 0], gf2: [1, 2, 1], gf3: [1, 1, 0] },
  { space: 'Klein bottle (6×6 grid)', build: () => kleinBottle(6), rational: [1, 1, 0], gf2: [1, 2, 1], gf3: [1, 1, 0] },
  { space: 'real projective plane (hemi-icosahedron)', build: projectivePlane, rational: [1, 0, 0], gf2: [1, 1, 1], gf3: [1, 0, 0] },
  { space: '3-sphere (boundary of a 4-simplex)', build: sphere3, rational: [1, 0, 0, 1] },
  { space: 'wedge of 1 circle', build: () => wedgeOfCircles(1), rational: [1, 1] },
  { space: 'wedge of 4 circles', build: () => wedgeOfCircles(4), rational: [1, 4] },
];

/** Expected dims over a field; the real field only where the table says "same". */
function expected(row: Row, field: FieldName): number[] | undefined {
  const same = row.gf2 === undefined && row.gf3 === undefined;
  if (field === 'rational') return row.rational;
  if (field === 'GF(2)') return row.gf2 ?? row.rational;
  if (field === 'GF(3)') return row.gf3 ?? row.rational;
  return same ? row.rational : undefined;
}

const alternating = (v: number[]) => v.reduce((s, x, k) => s + (k % 2 === 0 ? x : -x), 0);

function run(s: Simplices, dim: number, field: FieldName, method: (typeof METHODS)[number]): CohomologyReport {
  return cohomology(constantSheaf(s, dim), { method, field: FIELDS[field] });
}

describe('constant sheaf of dimension 1 on standard spaces (Hatcher 2002, ch. 2 / §3.1)', () => {
  for (const row of ROWS) {
    for (const field of Object.keys(FIELDS) as FieldName[]) {
      const want = expected(row, field);
      if (!want) continue;
      for (const method of METHODS) {
        test(`${row.space} over ${field} has dims ${want.join(',')} (${method})`, () => {
          const r = run(row.build(), 1, field, method);
          expect(r.dims).toEqual(want); // Hatcher 2002, ch. 2 / §3.1
          expect(r.euler).toBe(alternating(r.dims));
          expect(r.euler).toBe(alternating(r.cochainDims));
          expect(r.method).toBe(method);
        });
      }
      test(`${row.space} over ${field}: morse and direct agree, Morse complex keeps the Euler characteristic`, () => {
        const m = run(row.build(), 1, field, 'morse');
        const d = run(row.build(), 1, field, 'direct');
        expect(m.dims).toEqual(d.dims);
        expect(m.euler).toBe(d.euler);
        expect(m.morse).toBeDefined();
        expect(d.morse).toBeUndefined();
        expect(alternating(m.morse!.criticalCochainDims)).toBe(m.euler);
      });
    }
  }
});

// A constant sheaf of dimension d multiplies every entry (Hatcher 2002, §3.1:
// cohomology commutes with finite direct sums of coefficients).
const HIGHER: { space: string; build: () => Simplices; dim: number; fields: FieldName[] }[] = [
  { space: 'circle (cycle graph C_7)', build: () => cycle(7), dim: 3, fields: ['rational', 'GF(2)', 'real'] },
  { space: '2-sphere (boundary of a tetrahedron)', build: sphere2, dim: 2, fields: ['rational', 'GF(3)', 'real'] },
  { space: 'torus (5×5 grid)', build: () => torus(5), dim: 2, fields: ['rational', 'GF(2)'] },
  { space: 'Klein bottle (5×5 grid)', build: () => kleinBottle(5), dim: 2, fields: ['rational', 'GF(2)', 'GF(3)'] },
  { space: 'real projective plane (hemi-icosahedron)', build: projectivePlane, dim: 3, fields: ['rational', 'GF(2)', 'GF(3)'] },
  { space: 'wedge of 4 circles', build: () => wedgeOfCircles(4), dim: 2, fields: ['rational', 'GF(3)'] },
];

describe('constant sheaf of dimension d multiplies every entry by d (Hatcher 2002, §3.1)', () => {
  for (const h of HIGHER) {
    const row = ROWS.find((r) => r.space === h.space)!;
    for (const field of h.fields) {
      const want = expected(row, field)!.map((x) => h.dim * x);
      for (const method of METHODS) {
        test(`${h.space} with stalk dimension ${h.dim} over ${field} has dims ${want.join(',')} (${method})`, () => {
          const r = run(h.build(), h.dim, field, method);
          expect(r.dims).toEqual(want); // Hatcher 2002, ch. 2 / §3.1, times d
          expect(r.euler).toBe(alternating(r.dims));
          if (method === 'morse') expect(alternating(r.morse!.criticalCochainDims)).toBe(r.euler);
        });
      }
      test(`${h.space} with stalk dimension ${h.dim} over ${field}: morse and direct agree`, () => {
        expect(run(h.build(), h.dim, field, 'morse').dims).toEqual(run(h.build(), h.dim, field, 'direct').dims);
      });
    }
  }
});

describe('the triangulations are what they claim (textbook constructions)', () => {
  test('torus and Klein bottle grids have n², 3n², 2n² cells after closure', () => {
    for (const n of [5, 6]) {
      for (const s of [torus(n), kleinBottle(n)]) {
        expect(cohomology(constantSheaf(s), { method: 'direct' }).cells).toEqual([n * n, 3 * n * n, 2 * n * n]);
      }
    }
  });

  test('real projective plane has 6 vertices, 15 edges, 10 triangles and every edge on two triangles', () => {
    const t = projectivePlane();
    expect(cohomology(constantSheaf(t), { method: 'direct' }).cells).toEqual([6, 15, 10]);
    const count = new Map<string, number>();
    for (const [a, b, c] of t) for (const e of [[a, b], [a, c], [b, c]]) count.set(e.join(), (count.get(e.join()) ?? 0) + 1);
    expect([...count.values()].every((k) => k === 2)).toBe(true);
  });

  test('spheres are simplex boundaries: 4 and 5 facets', () => {
    expect(sphere2()).toHaveLength(4);
    expect(sphere3()).toHaveLength(5);
    expect(sphere3().every((f) => f.length === 4)).toBe(true);
  });
});
