export interface SymmetricEigen {
  /** Eigenvalues, increasing. */
  values: Float64Array;
  /** Eigenvectors as columns, row-major n×n: vector j is `vectors[i*n + j]` for i = 0 … n−1. */
  vectors: Float64Array;
}

/**
 * All eigenvalues and eigenvectors of a small dense symmetric matrix
 * (row-major n×n) by the cyclic Jacobi method, rotating until the
 * off-diagonal part is negligible (Golub & Van Loan, Matrix Computations,
 * §8.5). Meant for Rayleigh–Ritz blocks and small Laplacians.
 */
export function symmetricEigen(a: ArrayLike<number>, n: number): SymmetricEigen {
  if (a.length !== n * n) throw new RangeError(`expected ${n}×${n} entries, got ${a.length}`);
  const A = Float64Array.from(a);
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const s = (A[i * n + j] + A[j * n + i]) / 2;
      A[i * n + j] = A[j * n + i] = s;
    }
  }
  const V = new Float64Array(n * n);
  for (let i = 0; i < n; i++) V[i * n + i] = 1;
  let total = 0;
  for (let i = 0; i < n * n; i++) total += A[i] * A[i];
  const floor = 1e-30 * total;
  for (let sweep = 0; sweep < 100; sweep++) {
    let off = 0;
    for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) off += A[i * n + j] ** 2;
    if (off <= floor || off === 0) break;
    for (let p = 0; p < n; p++) {
      for (let q = p + 1; q < n; q++) {
        const apq = A[p * n + q];
        if (apq === 0) continue;
        const theta = (A[q * n + q] - A[p * n + p]) / (2 * apq);
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1);
        const s = t * c;
        for (let k = 0; k < n; k++) {
          const akp = A[k * n + p];
          const akq = A[k * n + q];
          A[k * n + p] = c * akp - s * akq;
          A[k * n + q] = s * akp + c * akq;
        }
        for (let k = 0; k < n; k++) {
          const apk = A[p * n + k];
          const aqk = A[q * n + k];
          A[p * n + k] = c * apk - s * aqk;
          A[q * n + k] = s * apk + c * aqk;
        }
        for (let k = 0; k < n; k++) {
          const vkp = V[k * n + p];
          const vkq = V[k * n + q];
          V[k * n + p] = c * vkp - s * vkq;
          V[k * n + q] = s * vkp + c * vkq;
        }
      }
    }
  }
  const order = Array.from({ length: n }, (_, i) => i).sort((i, j) => A[i * n + i] - A[j * n + j]);
  const values = Float64Array.from(order, (i) => A[i * n + i]);
  const vectors = new Float64Array(n * n);
  order.forEach((src, dst) => {
    for (let k = 0; k < n; k++) vectors[k * n + dst] = V[k * n + src];
  });
  return { values, vectors };
}
