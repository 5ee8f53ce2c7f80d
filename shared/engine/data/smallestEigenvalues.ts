import { csrMatVec, csrAdd, csrFromTriplets, type CsrMatrix } from './CsrMatrix';
import { dot, norm, orthonormalise } from './orthonormalise';
import { SparseCholesky } from './SparseCholesky';
import { symmetricEigen } from './symmetricEigen';

export interface EigenOptions {
  /** Converged when ‖L x − λ x‖ ≤ tolerance · ‖L‖ for each wanted pair (default 1e-9). */
  tolerance?: number;
  maxIterations?: number;
  /** Seed of the start block (deterministic by default). */
  seed?: number;
}

export interface SmallestEigen {
  /** The `count` smallest eigenvalues, increasing. */
  values: Float64Array;
  /** Orthonormal eigenvectors, one per value. */
  vectors: Float64Array[];
  /** ‖L x − λ x‖ per pair. */
  residuals: Float64Array;
  /** Every wanted pair met the tolerance. */
  converged: boolean;
  iterations: number;
  /** The row-sum bound on ‖L‖ the tolerance is relative to. */
  scale: number;
}

/** Below this size the whole matrix is diagonalised densely. */
const DENSE_SIZE = 120;

/**
 * The smallest eigenvalues of a symmetric positive semidefinite sparse
 * matrix (a sheaf Laplacian) by shift-and-invert subspace iteration with
 * Rayleigh–Ritz (Saad, Numerical Methods for Large Eigenvalue Problems,
 * ch. 5): a block of vectors is repeatedly multiplied by (L + σI)⁻¹ through
 * one sparse factorisation, σ a millionth of ‖L‖, so multiple and zero
 * eigenvalues converge together. Small matrices are diagonalised densely.
 */
export function smallestEigenvalues(L: CsrMatrix, count: number, options: EigenOptions = {}): SmallestEigen {
  const n = L.rows;
  if (L.cols !== n) throw new RangeError(`a ${L.rows}×${L.cols} matrix is not square`);
  count = Math.max(0, Math.min(count, n));
  const tol = options.tolerance ?? 1e-9;
  let scale = 0;
  for (let r = 0; r < n; r++) {
    let s = 0;
    for (let e = L.rowPtr[r]; e < L.rowPtr[r + 1]; e++) s += Math.abs(L.val[e]);
    scale = Math.max(scale, s);
  }
  const block = Math.min(n, count + Math.max(6, count));
  if (n <= DENSE_SIZE || block * 2 >= n) return dense(L, count, scale);
  const shift = 1e-6 * (scale || 1);
  const diag = csrFromTriplets(n, n, Int32Array.from({ length: n }, (_, i) => i), Int32Array.from({ length: n }, (_, i) => i), new Float64Array(n).fill(shift));
  const chol = new SparseCholesky(csrAdd(L, diag), { tolerance: 1e-15 });
  const rand = mulberry32(options.seed ?? 0x9e3779b9);
  const randomVector = () => Float64Array.from({ length: n }, () => rand() - 0.5);
  let X = orthonormalise(Array.from({ length: block }, randomVector));
  const maxIt = options.maxIterations ?? 300;
  let values: Float64Array = new Float64Array(block);
  let residuals = new Float64Array(block).fill(Infinity);
  let iterations = 0;
  for (; iterations < maxIt; ) {
    iterations++;
    let Y = orthonormalise(X.map((x) => chol.solve(x)));
    while (Y.length < block) Y = orthonormalise([...Y, randomVector()]);
    const LY = Y.map((y) => csrMatVec(L, y));
    const H = new Float64Array(block * block);
    for (let i = 0; i < block; i++) for (let j = i; j < block; j++) H[i * block + j] = H[j * block + i] = dot(Y[i], LY[j]);
    const eig = symmetricEigen(H, block);
    values = eig.values;
    X = combine(Y, eig.vectors, block);
    const LX = combine(LY, eig.vectors, block);
    residuals = Float64Array.from(X, (x, i) => {
      const r = LX[i].slice();
      for (let t = 0; t < n; t++) r[t] -= values[i] * x[t];
      return norm(r);
    });
    let done = true;
    for (let i = 0; i < count; i++) if (!(residuals[i] <= tol * (scale || 1))) done = false;
    if (done) break;
  }
  const converged = residuals.subarray(0, count).every((r) => r <= tol * (scale || 1));
  return { values: values.slice(0, count), vectors: X.slice(0, count), residuals: residuals.slice(0, count), converged, iterations, scale };
}

function dense(L: CsrMatrix, count: number, scale: number): SmallestEigen {
  const n = L.rows;
  const A = new Float64Array(n * n);
  for (let r = 0; r < n; r++) for (let e = L.rowPtr[r]; e < L.rowPtr[r + 1]; e++) A[r * n + L.col[e]] += L.val[e];
  const { values, vectors } = symmetricEigen(A, n);
  const vecs: Float64Array[] = [];
  const residuals = new Float64Array(count);
  for (let j = 0; j < count; j++) {
    const v = new Float64Array(n);
    for (let i = 0; i < n; i++) v[i] = vectors[i * n + j];
    const Lv = csrMatVec(L, v);
    for (let i = 0; i < n; i++) Lv[i] -= values[j] * v[i];
    residuals[j] = norm(Lv);
    vecs.push(v);
  }
  return { values: values.slice(0, count), vectors: vecs, residuals, converged: true, iterations: 0, scale };
}

/** Columns of Y·V: vector j is Σ_i V[i][j] Y_i. */
function combine(Y: Float64Array[], V: Float64Array, p: number): Float64Array[] {
  const n = Y[0].length;
  const out: Float64Array[] = [];
  for (let j = 0; j < p; j++) {
    const w = new Float64Array(n);
    for (let i = 0; i < p; i++) {
      const f = V[i * p + j];
      if (f === 0) continue;
      const y = Y[i];
      for (let t = 0; t < n; t++) w[t] += f * y[t];
    }
    out.push(w);
  }
  return out;
}

/** A small deterministic PRNG (mulberry32) for the start block. */
function mulberry32(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
