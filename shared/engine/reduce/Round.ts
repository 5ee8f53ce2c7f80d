import type { BasedComplex } from '../based/BasedComplex';

/** What one round of Morse reduction did, kept so cochains can be lifted back. */
export interface Round<E> {
  readonly input: BasedComplex<E>;
  readonly output: BasedComplex<E>;
  /**
   * Per degree k, the matched pairs whose lower cell is in degree k: σ (a
   * k-cell of the input) and τ (a (k+1)-cell), in the order they were made,
   * with kind 0 for a coreduction pair (τ had no other free face) and 1 for a
   * reduction pair (σ had no other free coface).
   */
  readonly pairSigma: Int32Array[];
  readonly pairTau: Int32Array[];
  readonly pairKind: Uint8Array[];
  /** Per degree, the input index of each output (critical) cell. */
  readonly critical: Int32Array[];
  /** Smallest pivot magnitude accepted (Infinity when nothing paired). */
  readonly smallestPivot: number;
  readonly pairs: number;
}
