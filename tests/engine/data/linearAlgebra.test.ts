/**
 * The engine's own sparse and small dense linear algebra, each checked
 * against ml-matrix (an independent implementation) within a tolerance,
 * plus the invariants of each decomposition (Golub & Van Loan, Matrix
 * Computations: A = LDLᵀ solves, QR least squares, A V = V Λ).
 */
import { EigenvalueDecomposition, Matrix, solve } from 'ml-matrix';
import { describe, expect, test } from 'vitest';
import {
  csrAdd,
  csrFromTriplets,
  csrMatTVec,
  csrMatVec,
  csrMultiply,
  csrTranspose,
  DenseQR,
  orthonormalise,
  principalBasis,
  SparseCholesky,
  symmetricEigen,
  dot,
} from '../../../shared/engine';
import { maxAbsDiff, prng, toMatrix } from './helpers';

function randomSparse(rows: number, cols: number, density: number, rand: () => number) {
  const r: number[] = [];
  const c: number[] = [];
  const v: number[] = [];
  for (let i = 0; i < rows; i++) for (let j = 0; j < cols; j++) if (rand() < density) (r.push(i), c.push(j), v.push(rand() * 2 - 1));
  return csrFromTriplets(rows, cols, r, c, v);
}

/** The weighted Laplacian of a random graph on n vertices with `pieces` components. */
function graphLaplacian(n: number, pieces: number, rand: () => number) {
  const r: number[] = [];
  const c: number[] = [];
  const v: number[] = [];
  const piece = (i: number) => i % pieces;
  const edge = (a: number, b: number, w: number) => {
    r.push(a, b, a, b);
    c.push(a, b, b, a);
    v.push(w, w, -w, -w);
  };
  for (let i = pieces; i < n; i++) edge(i, i - pieces, 0.5 + rand()); // a spanning path per piece
  for (let k = 0; k < n; k++) {
    const a = Math.floor(rand() * n);
    const b = Math.floor(rand() * n);
    if (a !== b && piece(a) === piece(b)) edge(a, b, 0.5 + rand());
  }
  return csrFromTriplets(n, n, r, c, v);
}

describe('CSR matrices', () => {
  const rand = prng(11);
  const A = randomSparse(7, 5, 0.4, rand);
  const B = randomSparse(5, 6, 0.4, rand);
  test('products, transposes and sums agree with dense ml-matrix arithmetic', () => {
    const w = [1, 2, 0.5, 3, 0.25];
    const diff = (X: Matrix, Y: Matrix) => maxAbsDiff(X.to1DArray(), Y.to1DArray());
    expect(diff(toMatrix(csrMultiply(A, B)), toMatrix(A).mmul(toMatrix(B)))).toBeLessThan(1e-14);
    const AwB = toMatrix(A).mmul(Matrix.diag(w)).mmul(toMatrix(B));
    expect(diff(toMatrix(csrMultiply(A, B, w)), AwB)).toBeLessThan(1e-14);
    expect(toMatrix(csrTranspose(A)).to2DArray()).toEqual(toMatrix(A).transpose().to2DArray());
    expect(diff(toMatrix(csrAdd(A, A, 2, -1)), toMatrix(A))).toBeLessThan(1e-15);
    const x = [1, -2, 3, 0.5, 4];
    expect(maxAbsDiff(csrMatVec(A, x), toMatrix(A).mmul(Matrix.columnVector(x)).to1DArray())).toBeLessThan(1e-14);
    const y = [1, 2, 3, 4, 5, 6, 7];
    expect(maxAbsDiff(csrMatTVec(A, y), toMatrix(A).transpose().mmul(Matrix.columnVector(y)).to1DArray())).toBeLessThan(1e-14);
  });
  test('triplets: duplicates are summed and cancelling entries dropped', () => {
    const M = csrFromTriplets(2, 2, [0, 0, 1, 1], [1, 1, 0, 0], [2, 3, 1, -1]);
    expect(Array.from(M.rowPtr)).toEqual([0, 1, 1]);
    expect(Array.from(M.val)).toEqual([5]);
  });
});

describe('SparseCholesky (minimum-degree LDLᵀ)', () => {
  test('solves a sparse symmetric positive definite system as ml-matrix does', () => {
    const rand = prng(3);
    const n = 60;
    const L = graphLaplacian(n, 1, rand);
    const shift = csrFromTriplets(n, n, [0, 7, 33], [0, 7, 33], [1, 2, 0.5]); // grounding makes it definite
    const A = csrAdd(L, shift);
    const b = Array.from({ length: n }, () => rand() - 0.5);
    const chol = new SparseCholesky(A);
    expect(chol.rank).toBe(n);
    expect(chol.isSingular()).toBe(false);
    const ref = solve(toMatrix(A), Matrix.columnVector(b)).to1DArray();
    expect(maxAbsDiff(chol.solve(b), ref)).toBeLessThan(1e-9);
  });

  test('a graph Laplacian with 3 components has nullity 3, and the null vectors are in the kernel', () => {
    const rand = prng(5);
    const L = graphLaplacian(45, 3, rand);
    const chol = new SparseCholesky(L);
    expect(chol.nullity).toBe(3);
    for (const z of chol.nullVectors()) expect(Math.max(...csrMatVec(L, z).map(Math.abs))).toBeLessThan(1e-9);
    // A right-hand side in the range (sums zero on each component) is solved exactly.
    const x = Array.from({ length: 45 }, () => rand());
    const b = csrMatVec(L, x);
    expect(maxAbsDiff(csrMatVec(L, chol.solve(b)), b)).toBeLessThan(1e-9);
  });

  test('finishes a nearly full matrix densely: a 100 × 100 Gram matrix of rank 90 has nullity 10 and solves in its range', () => {
    const rand = prng(77);
    const n = 100;
    const G = Array.from({ length: 90 }, () => Array.from({ length: n }, () => rand() - 0.5));
    const r: number[] = [];
    const c: number[] = [];
    const v: number[] = [];
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) (r.push(i), c.push(j), v.push(G.reduce((s, g) => s + g[i] * g[j], 0)));
    const A = csrFromTriplets(n, n, r, c, v);
    const chol = new SparseCholesky(A, { tolerance: 1e-9 });
    expect(chol.nullity).toBe(10);
    const x = Array.from({ length: n }, () => rand());
    const b = csrMatVec(A, x);
    expect(maxAbsDiff(csrMatVec(A, chol.solve(b)), b)).toBeLessThan(1e-8);
    for (const z of chol.nullVectors()) expect(Math.max(...csrMatVec(A, z).map(Math.abs)) / Math.max(...z.map(Math.abs))).toBeLessThan(1e-8);
  });

  test('keeps the fill of a long path at zero (minimum degree eliminates from the ends)', () => {
    const n = 2000;
    const r: number[] = [];
    const c: number[] = [];
    const v: number[] = [];
    for (let i = 0; i < n; i++) {
      r.push(i);
      c.push(i);
      v.push(i === 0 ? 3 : 2);
      if (i + 1 < n) (r.push(i, i + 1), c.push(i + 1, i), v.push(-1, -1));
    }
    const chol = new SparseCholesky(csrFromTriplets(n, n, r, c, v));
    expect(chol.factorEntries).toBe(n - 1);
  });
});

describe('DenseQR (Householder, column pivoting)', () => {
  test('least squares agrees with ml-matrix on an overdetermined system', () => {
    const rand = prng(9);
    const m = 12;
    const n = 4;
    const a = Array.from({ length: m * n }, () => rand() - 0.5);
    const b = Array.from({ length: m }, () => rand());
    const qr = new DenseQR(a, m, n);
    expect(qr.rank).toBe(4);
    const A = new Matrix(Array.from({ length: m }, (_, i) => a.slice(i * n, i * n + n)));
    const ref = solve(A, Matrix.columnVector(b)).to1DArray();
    expect(maxAbsDiff(qr.solve(b), ref)).toBeLessThan(1e-12);
  });
  test('a repeated column is found: rank 2 of 3', () => {
    const qr = new DenseQR([1, 2, 1, 0, 1, 0, 1, 1, 1, 2, 0, 2], 4, 3);
    expect(qr.rank).toBe(2);
    expect(qr.isFullRank()).toBe(false);
  });
});

describe('symmetricEigen (cyclic Jacobi)', () => {
  test('eigenvalues agree with ml-matrix and A v = λ v', () => {
    const rand = prng(21);
    const n = 9;
    const a = new Float64Array(n * n);
    for (let i = 0; i < n; i++) for (let j = i; j < n; j++) a[i * n + j] = a[j * n + i] = rand() - 0.5;
    const { values, vectors } = symmetricEigen(a, n);
    const ref = new EigenvalueDecomposition(new Matrix(Array.from({ length: n }, (_, i) => Array.from(a.slice(i * n, i * n + n)))), { assumeSymmetric: true });
    expect(maxAbsDiff(values, [...ref.realEigenvalues].sort((x, y) => x - y))).toBeLessThan(1e-12);
    for (let j = 0; j < n; j++) {
      const v = Array.from({ length: n }, (_, i) => vectors[i * n + j]);
      const Av = Array.from({ length: n }, (_, i) => v.reduce((s, x, k) => s + a[i * n + k] * x, 0));
      expect(maxAbsDiff(Av, v.map((x) => values[j] * x))).toBeLessThan(1e-12);
    }
  });
});

describe('orthonormal bases', () => {
  test('orthonormalise drops a dependent vector; principalBasis keeps the dominant directions', () => {
    const q = orthonormalise([[1, 0, 0], [1, 1, 0], [2, 1, 0]]);
    expect(q).toHaveLength(2);
    expect(Math.abs(dot(q[0], q[1]))).toBeLessThan(1e-15);
    const p = principalBasis([[1, 0, 0], [0, 1e-12, 0], [0, 0, 1]], 2);
    expect(p).toHaveLength(2);
    for (const v of p) expect(Math.abs(v[1])).toBeLessThan(1e-9);
  });
});
