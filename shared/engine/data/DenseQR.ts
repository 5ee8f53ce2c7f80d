/**
 * Householder QR with column pivoting of a small dense m×n matrix
 * (row-major), computed once in the constructor: A P = Q R. Used for the
 * least-squares fits on a basis of global sections, where n is dim H^0.
 */
export class DenseQR {
  readonly m: number;
  readonly n: number;
  /** Numerical rank: diagonal entries of R above `tolerance · |R₁₁|`. */
  readonly rank: number;
  /** Column of A in position j of R. */
  readonly permutation: Int32Array;
  private readonly qr: Float64Array;
  private readonly rDiag: Float64Array;

  constructor(a: ArrayLike<number>, m: number, n: number, tolerance = 1e-10) {
    if (a.length !== m * n) throw new RangeError(`expected ${m}×${n} = ${m * n} entries, got ${a.length}`);
    this.m = m;
    this.n = n;
    const qr = Float64Array.from(a);
    const perm = Int32Array.from({ length: n }, (_, j) => j);
    const norms = new Float64Array(n);
    for (let j = 0; j < n; j++) for (let i = 0; i < m; i++) norms[j] += qr[i * n + j] ** 2;
    const rDiag = new Float64Array(Math.min(m, n));
    let rank = 0;
    let first = 0;
    for (let k = 0; k < Math.min(m, n); k++) {
      // Pivot: the remaining column of largest norm (recomputed: sizes here are small).
      let best = k;
      let bestNorm = -1;
      for (let j = k; j < n; j++) {
        let s = 0;
        for (let i = k; i < m; i++) s += qr[i * n + j] ** 2;
        norms[j] = s;
        if (s > bestNorm) {
          bestNorm = s;
          best = j;
        }
      }
      if (best !== k) {
        for (let i = 0; i < m; i++) [qr[i * n + k], qr[i * n + best]] = [qr[i * n + best], qr[i * n + k]];
        [perm[k], perm[best]] = [perm[best], perm[k]];
      }
      const norm = Math.sqrt(Math.max(bestNorm, 0));
      if (k === 0) first = norm;
      if (norm === 0 || norm <= tolerance * first) break;
      const alpha = qr[k * n + k] > 0 ? -norm : norm;
      // v = x − alpha e1, stored in place of the column below the diagonal.
      qr[k * n + k] -= alpha;
      let vNorm2 = 0;
      for (let i = k; i < m; i++) vNorm2 += qr[i * n + k] ** 2;
      if (vNorm2 > 0) {
        for (let j = k + 1; j < n; j++) {
          let s = 0;
          for (let i = k; i < m; i++) s += qr[i * n + k] * qr[i * n + j];
          const f = (2 * s) / vNorm2;
          for (let i = k; i < m; i++) qr[i * n + j] -= f * qr[i * n + k];
        }
      }
      rDiag[k] = alpha;
      rank++;
    }
    this.qr = qr;
    this.rDiag = rDiag;
    this.rank = rank;
    this.permutation = perm;
  }

  isFullRank(): boolean {
    return this.rank === this.n;
  }

  /**
   * The least-squares solution of A x ≈ b. When A is rank deficient, the
   * basic solution: components beyond the rank (in pivot order) are 0.
   */
  solve(b: ArrayLike<number>): Float64Array {
    const { m, n, qr, rank, rDiag } = this;
    if (b.length !== m) throw new RangeError(`right-hand side has ${b.length} entries, expected ${m}`);
    const y = Float64Array.from(b);
    for (let k = 0; k < rank; k++) {
      let vNorm2 = 0;
      let s = 0;
      for (let i = k; i < m; i++) {
        vNorm2 += qr[i * n + k] ** 2;
        s += qr[i * n + k] * y[i];
      }
      if (vNorm2 === 0) continue;
      const f = (2 * s) / vNorm2;
      for (let i = k; i < m; i++) y[i] -= f * qr[i * n + k];
    }
    const z = new Float64Array(n);
    for (let k = rank - 1; k >= 0; k--) {
      let s = y[k];
      for (let j = k + 1; j < rank; j++) s -= qr[k * n + j] * z[j];
      z[k] = s / rDiag[k];
    }
    const x = new Float64Array(n);
    for (let j = 0; j < n; j++) x[this.permutation[j]] = z[j];
    return x;
  }
}
