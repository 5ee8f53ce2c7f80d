/**
 * Local systems (locally constant sheaves) on a circle. Source: A. Hatcher,
 * Algebraic Topology (2002), §3.H (local coefficients): on a circle with
 * monodromy T, H^0 = ker(T − I) and H^1 = coker(T − I).
 */
import { describe, expect, test } from 'vitest';
import { Fraction } from 'fraction.js';
import { cohomology, sections, type ModelFile } from '../../shared/engine';
import { cycle, type FieldOption } from './fixtures/triangulations';

type Matrix = (number | string)[][];
const METHODS = ['morse', 'direct'] as const;
const RATIONAL: FieldOption = { kind: 'rational' };
const REAL: FieldOption = { kind: 'real' };

/**
 * The circle C_m with stalk R^n everywhere and identity maps, except that
 * the map from vertex `face` into the closing edge [0, m−1] is T.
 */
function circleWithMonodromy(T: Matrix, m = 5, face: 0 | 'last' = 'last'): ModelFile {
  const v = face === 0 ? 0 : m - 1;
  return {
    format: 'gluefield.sheaf',
    version: 1,
    simplices: cycle(m),
    stalks: { default: T.length },
    maps: { default: 'identity', entries: [{ face: [v], coface: [0, m - 1], matrix: T }] },
  };
}

interface Example {
  name: string;
  T: Matrix;
  dims: [number, number];
  real?: boolean;
}

// Hatcher 2002, §3.H: the four examples; dims = (dim ker(T − I), dim coker(T − I)).
const EXAMPLES: Example[] = [
  { name: 'rotation by 90°', T: [[0, -1], [1, 0]], dims: [0, 0], real: true },
  { name: 'reflection diag(1, −1)', T: [[1, 0], [0, -1]], dims: [1, 1] },
  { name: '−I in dimension 1 (Möbius twist)', T: [[-1]], dims: [0, 0] },
  { name: 'shear [[1,1],[0,1]]', T: [[1, 1], [0, 1]], dims: [1, 1] },
];

const alternating = (v: number[]) => v.reduce((s, x, k) => s + (k % 2 === 0 ? x : -x), 0);

describe('circle with monodromy T: H^0 = ker(T − I), H^1 = coker(T − I) (Hatcher 2002, §3.H)', () => {
  for (const ex of EXAMPLES) {
    const fields: [string, FieldOption][] = [['rational', RATIONAL]];
    if (ex.real) fields.push(['real', REAL]);
    for (const [fname, field] of fields) {
      for (const method of METHODS) {
        test(`${ex.name} over ${fname} has dims ${ex.dims.join(',')} (${method})`, () => {
          const r = cohomology(circleWithMonodromy(ex.T), { method, field });
          expect(r.dims).toEqual(ex.dims); // Hatcher 2002, §3.H
          expect(r.euler).toBe(alternating(r.dims));
          if (method === 'morse') expect(alternating(r.morse!.criticalCochainDims)).toBe(r.euler);
        });
      }
      test(`${ex.name} over ${fname}: morse and direct agree`, () => {
        const m = cohomology(circleWithMonodromy(ex.T), { method: 'morse', field });
        const d = cohomology(circleWithMonodromy(ex.T), { method: 'direct', field });
        expect(m.dims).toEqual(d.dims);
        expect(m.euler).toBe(d.euler);
      });
    }
    test(`${ex.name}: the answer does not depend on which edge end or how long the circle is (Hatcher 2002, §3.H)`, () => {
      for (const m of [3, 4, 8]) {
        for (const face of [0, 'last'] as const) {
          for (const method of METHODS) {
            expect(cohomology(circleWithMonodromy(ex.T, m, face), { method }).dims).toEqual(ex.dims);
          }
        }
      }
    });
  }

  test('rotation by 90° written as floating cos/sin over the real field has dims 0,0 (Hatcher 2002, §3.H)', () => {
    const c = Math.cos(Math.PI / 2);
    const s = Math.sin(Math.PI / 2);
    for (const method of METHODS) {
      expect(cohomology(circleWithMonodromy([[c, -s], [s, c]]), { method, field: REAL }).dims).toEqual([0, 0]);
    }
  });

  test('trivial monodromy T = I in dimension 2 has dims 2,2 (Hatcher 2002, §3.H: ker 0 = coker 0 = R^2)', () => {
    for (const method of METHODS) {
      expect(cohomology(circleWithMonodromy([[1, 0], [0, 1]]), { method }).dims).toEqual([2, 2]);
    }
  });
});

// ---- Global sections, checked in the test from the model itself ----

const frac = (x: number | string) => new Fraction(x);
const key = (c: number[]) => [...c].sort((a, b) => a - b).join(',');

function stalkDim(model: ModelFile, cell: number[]): number {
  const hit = model.stalks?.cells?.find((c) => key(c.cell) === key(cell));
  return hit ? hit.dim : (model.stalks?.default ?? 1);
}

/** F(face ◁ coface) read from the model file, as exact fractions. */
function restriction(model: ModelFile, face: number[], coface: number[]): Fraction[][] {
  const rows = stalkDim(model, coface);
  const cols = stalkDim(model, face);
  const entry = model.maps?.entries?.find((e) => key(e.face) === key(face) && key(e.coface) === key(coface));
  const diag = (c: Fraction) =>
    Array.from({ length: rows }, (_, i) => Array.from({ length: cols }, (_, j) => (i === j ? c : frac(0))));
  if (entry && 'matrix' in entry) return entry.matrix.map((r) => r.map(frac));
  if (entry) return diag(frac(entry.scalar));
  return diag(frac(model.maps?.default === 'zero' ? 0 : 1));
}

const apply = (M: Fraction[][], x: Fraction[]) =>
  M.map((row) => row.reduce((s, a, j) => s.add(a.mul(x[j])), frac(0)));

describe('H^0 basis vectors are global sections (Hatcher 2002, §3.H: H^0 = sections fixed by the monodromy)', () => {
  for (const ex of EXAMPLES) {
    for (const method of METHODS) {
      test(`${ex.name}: sections(…, 0) returns ${ex.dims[0]} nonzero vectors with F(b◁e)x_b = F(a◁e)x_a on every edge (${method})`, () => {
        const model = circleWithMonodromy(ex.T);
        const sec = sections(model, 0, { method, field: RATIONAL });
        expect(sec.dim).toBe(ex.dims[0]);
        expect(sec.basis).toHaveLength(ex.dims[0]);
        const at = new Map(sec.cells.map((c, i) => [key(c), i]));
        for (const vec of sec.basis) {
          const x = (v: number) => vec[at.get(String(v))!].map(frac);
          expect(vec.flat().some((t) => !frac(t).equals(0))).toBe(true);
          for (const [a, b] of model.simplices.map((e) => [...e].sort((p, q) => p - q))) {
            const lhs = apply(restriction(model, [b], [a, b]), x(b));
            const rhs = apply(restriction(model, [a], [a, b]), x(a));
            lhs.forEach((l, i) => expect(l.sub(rhs[i]).equals(0)).toBe(true));
          }
        }
      });
    }
  }
});
