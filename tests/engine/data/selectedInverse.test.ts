/**
 * Entries of A⁻¹ on the factor's pattern (Takahashi et al. 1973) against
 * the full inverse from ml-matrix, an independent dense implementation.
 */
import { inverse, Matrix } from 'ml-matrix';
import { describe, expect, test } from 'vitest';
import { csrAdd, csrFromTriplets, SelectedInverse, SparseCholesky, type CsrMatrix } from '../../../shared/engine';
import { prng, toMatrix } from './helpers';

/** Every (i, j) the selected inverse must hold: the diagonal and the entries of A. */
function patternError(A: CsrMatrix, Z: SelectedInverse): number {
  const ref = inverse(toMatrix(A));
  let worst = 0;
  let scale = 0;
  for (let i = 0; i < A.rows; i++) {
    scale = Math.max(scale, Math.abs(ref.get(i, i)));
    worst = Math.max(worst, Math.abs(Z.diagonal[i] - ref.get(i, i)));
    for (let e = A.rowPtr[i]; e < A.rowPtr[i + 1]; e++) worst = Math.max(worst, Math.abs(Z.entry(i, A.col[e]) - ref.get(i, A.col[e])));
  }
  return worst / scale;
}

/** A square grid's Laplacian grounded at a few nodes: fill-in, and a dense finish once the rest is full enough. */
function groundedGrid(side: number, rand: () => number): CsrMatrix {
  const n = side * side;
  const r: number[] = [];
  const c: number[] = [];
  const v: number[] = [];
  const edge = (a: number, b: number) => {
    const w = 0.5 + rand();
    r.push(a, b, a, b);
    c.push(a, b, b, a);
    v.push(w, w, -w, -w);
  };
  for (let i = 0; i < side; i++)
    for (let j = 0; j < side; j++) {
      if (j + 1 < side) edge(i * side + j, i * side + j + 1);
      if (i + 1 < side) edge(i * side + j, (i + 1) * side + j);
    }
  const ground = csrFromTriplets(n, n, [0, n - 1, (n / 2) | 0], [0, n - 1, (n / 2) | 0], [1, 2, 0.5]);
  return csrAdd(csrFromTriplets(n, n, r, c, v), ground);
}

describe('SelectedInverse', () => {
  test('a grounded 12 × 12 grid (sparse elimination with fill): every pattern entry matches ml-matrix inverse to 1e-10', () => {
    const A = groundedGrid(12, prng(21));
    const Z = new SelectedInverse(new SparseCholesky(A));
    expect(patternError(A, Z)).toBeLessThan(1e-10);
  });

  test('a grounded 20 × 20 grid reaches the dense finish and still matches (relative 1e-9)', () => {
    const A = groundedGrid(20, prng(22));
    const chol = new SparseCholesky(A);
    // More entries than a sparse-only factor of a grid this size could keep below a quarter fill.
    expect(chol.factorEntries).toBeGreaterThan(400);
    expect(patternError(A, new SelectedInverse(chol))).toBeLessThan(1e-9);
  });

  test('a full 80 × 80 positive definite matrix (all dense) matches', () => {
    const rand = prng(23);
    const n = 80;
    const G = Matrix.rand(n + 10, n, { random: rand });
    const M = G.transpose().mmul(G);
    const r: number[] = [];
    const c: number[] = [];
    const v: number[] = [];
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) (r.push(i), c.push(j), v.push(M.get(i, j)));
    const A = csrFromTriplets(n, n, r, c, v);
    expect(patternError(A, new SelectedInverse(new SparseCholesky(A)))).toBeLessThan(1e-8);
  });

  test('a singular matrix has no inverse; a pair off the pattern is refused', () => {
    const path = csrFromTriplets(3, 3, [0, 0, 1, 1, 1, 2, 2], [0, 1, 0, 1, 2, 1, 2], [1, -1, -1, 2, -1, -1, 1]);
    expect(() => new SelectedInverse(new SparseCholesky(path))).toThrow(RangeError);
    // A diagonal matrix: no off-diagonal pattern at all; Z = diag(1/2, 1/4).
    const Z = new SelectedInverse(new SparseCholesky(csrFromTriplets(2, 2, [0, 1], [0, 1], [2, 4])));
    expect(Array.from(Z.diagonal)).toEqual([0.5, 0.25]);
    expect(() => Z.entry(0, 1)).toThrow(/not on the pattern/);
  });
});
