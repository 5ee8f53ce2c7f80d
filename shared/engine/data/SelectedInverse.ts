import type { SparseCholesky } from './SparseCholesky';

/**
 * The entries of A⁻¹ on the pattern of a sparse LDLᵀ factor of A (its
 * diagonal, and every pair (i, j) that is an entry of L, which includes
 * every entry of A), computed once in the constructor without forming
 * A⁻¹: K. Takahashi, J. Fagan, M.-S. Chen, "Formation of a sparse bus
 * impedance matrix and its application to short circuit study", 8th PICA
 * Conference (1973), from memory. With Z = A⁻¹ and unit L, for each step s
 * in reverse order (p = order[s], k and k' running over column s of L):
 *
 *     Z[k', p] = −Σ_k L[k, s] · Z[k, k']
 *     Z[p, p]  = 1 / D[s] − Σ_k L[k, s] · Z[k, p]
 *
 * Every Z[k, k'] needed is on the pattern already, because the unknowns of
 * one column of L form a clique in the rest of the factor. The work is of
 * the order of the factorisation's, so cofactors of adjusted quantities
 * (redundancy numbers, standard deviations) stay affordable on nets with
 * many thousands of unknowns.
 */
export class SelectedInverse {
  readonly n: number;
  /** Z[i, i] per unknown. */
  readonly diagonal: Float64Array;
  /** Z[lIdx[e], order[s]] for every entry e of column s of L. */
  private readonly zVal: Float64Array;
  private readonly chol: SparseCholesky;

  /** Throws RangeError for a singular factor: its inverse does not exist. */
  constructor(chol: SparseCholesky) {
    if (chol.isSingular()) throw new RangeError(`the matrix is singular (nullity ${chol.nullity}); it has no inverse`);
    const { order, pivot, lPtr, lIdx, lVal } = chol.factor;
    const n = chol.n;
    this.n = n;
    this.chol = chol;
    const diagonal = new Float64Array(n);
    const zVal = new Float64Array(lIdx.length);
    // Position of each unknown within the column being processed, -1 elsewhere.
    const pos = new Int32Array(n).fill(-1);
    const acc = new Float64Array(n);
    for (let s = n - 1; s >= 0; s--) {
      const p = order[s];
      const a = lPtr[s];
      const b = lPtr[s + 1];
      for (let e = a; e < b; e++) {
        pos[lIdx[e]] = e - a;
        acc[e - a] = 0;
      }
      for (let e = a; e < b; e++) {
        const k = lIdx[e];
        const lk = lVal[e];
        acc[e - a] -= lk * diagonal[k];
        // Pairs (k, k'') with k eliminated first are stored in k's own column.
        const t = chol.stepOfUnknown(k);
        for (let f = lPtr[t]; f < lPtr[t + 1]; f++) {
          const at = pos[lIdx[f]];
          if (at < 0) continue;
          const z = zVal[f];
          acc[at] -= lk * z;
          acc[e - a] -= lVal[a + at] * z;
        }
      }
      let d = 1 / pivot[s];
      for (let e = a; e < b; e++) {
        zVal[e] = acc[e - a];
        d -= lVal[e] * acc[e - a];
        pos[lIdx[e]] = -1;
      }
      diagonal[p] = d;
    }
    this.diagonal = diagonal;
    this.zVal = zVal;
  }

  /** Z[i, j]; throws RangeError when (i, j) is not on the factor's pattern. */
  entry(i: number, j: number): number {
    const z = this.find(i, j);
    if (z === undefined) throw new RangeError(`(${i}, ${j}) is not on the pattern of the factor`);
    return z;
  }

  /** Z[i, j], or undefined when (i, j) is not on the factor's pattern. */
  find(i: number, j: number): number | undefined {
    if (i === j) return this.diagonal[i];
    const si = this.chol.stepOfUnknown(i);
    const sj = this.chol.stepOfUnknown(j);
    const [s, other] = si < sj ? [si, j] : [sj, i];
    const { lPtr, lIdx } = this.chol.factor;
    for (let e = lPtr[s]; e < lPtr[s + 1]; e++) if (lIdx[e] === other) return this.zVal[e];
    return undefined;
  }
}
