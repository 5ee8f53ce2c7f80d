import { cellOffsets, cochainDims, type BasedComplex } from '../based/BasedComplex';
import { fromSheaf } from '../based/fromSheaf';
import type { Vec } from '../fields/Field';
import type { Sheaf } from '../model/Sheaf';
import type { Control } from '../reduce/Cancelled';
import { accumulate } from '../reduce/lift';
import { morseReduce, type Reduction } from '../reduce/morseReduce';
import { cohomologyBasis } from '../solve/cohomologyBasis';
import { cohomologyDims } from '../solve/ranks';
import { transposeComplex } from './transposeComplex';

/**
 * Homology of a sheaf with its maps transposed (for a constant sheaf:
 * simplicial homology H_k(K), whose dimension over a field equals dim H^k),
 * as cohomology of the dual complex: reduced once by the engine's Morse
 * reduction in the constructor, then representative cycles of any degree
 * are read off and lifted to the original k-cells (the layout of
 * {@link sectionVectors}), each checked to be a cycle, ∂z = 0.
 */
export class HomologyCycles<E> {
  private readonly dual: BasedComplex<E>;
  private readonly reduction: Reduction<E>;
  private readonly top: number;

  constructor(sheaf: Sheaf<E>, control?: Control) {
    this.top = sheaf.complex.dimension;
    this.dual = transposeComplex(fromSheaf(sheaf));
    this.reduction = morseReduce(this.dual, { control });
  }

  /**
   * dim H_k for k = 0 … top, from the same reduction (over a field these are
   * the cohomology dimensions too, Hatcher 2002 §3.1), with the Euler
   * characteristic checked as the engine's own run checks it.
   */
  dims(control?: Control): number[] {
    const dual = cohomologyDims(this.reduction.output, control).dims;
    const euler = (d: number[]) => d.reduce((sum, x, j) => sum + (j % 2 === 0 ? x : -x), 0);
    if (euler(dual) !== euler(cochainDims(this.dual))) throw new Error('internal check failed: the Euler characteristic changed during the reduction');
    return dual.slice().reverse();
  }

  /** k-cycles whose classes form a basis of H_k. Throws RangeError outside 0 … top. */
  cycles(k: number): Vec<E>[] {
    if (k < 0 || k > this.top) throw new RangeError(`degree ${k} is outside 0…${this.top}`);
    const j = this.top - k;
    const reps = cohomologyBasis(this.reduction.output, j).map((r) => this.reduction.lift(j, r));
    for (const z of reps) assertCycle(this.dual, j, z);
    return reps;
  }
}

/** {@link HomologyCycles} for a single degree. */
export function cycleRepresentatives<E>(sheaf: Sheaf<E>, k: number, control?: Control): Vec<E>[] {
  return new HomologyCycles(sheaf, control).cycles(k);
}

/** ∂z = 0, as the dual's coboundary of z (exact fields: exactly zero). */
function assertCycle<E>(X: BasedComplex<E>, j: number, z: Vec<E>): void {
  if (j + 1 >= X.dims.length) return;
  const F = X.field;
  const cob = X.cob[j];
  const off = cellOffsets(X.dims[j]);
  const up = X.dims[j + 1];
  let widest = 0;
  for (let t = 0; t < up.length; t++) widest = Math.max(widest, up[t]);
  const acc = F.newVec(widest);
  let norm = 0;
  for (let i = 0; i < z.length; i++) norm = Math.max(norm, F.magnitude(z[i]));
  for (let t = 0; t < up.length; t++) {
    for (let q = 0; q < up[t]; q++) acc[q] = F.zero;
    for (let e = cob.rowPtr[t]; e < cob.rowPtr[t + 1]; e++) {
      const b = cob.block[e];
      if (b >= 0) accumulate(F, acc, X.blocks[b], cob.sign[e], z, off[cob.col[e]]);
    }
    for (let q = 0; q < up[t]; q++) {
      if (!F.negligible(acc[q], Math.max(1, norm) * 1e3)) throw new Error('internal check failed: a lifted cycle has a boundary');
    }
  }
}
