import { cellOffsets, type BasedComplex } from './based/BasedComplex';
import { simplexIds } from './complex/SimplicialComplex';
import type { Vec } from './fields/Field';
import type { Sheaf } from './model/Sheaf';
import { cohomologyBasis } from './solve/cohomologyBasis';
import { accumulate } from './reduce/lift';
import { maxAbs } from './based/Mat';
import type { Computation } from './computeCohomology';

/** A basis of H^k as values on the original k-cells. */
export interface SectionsReport {
  degree: number;
  dim: number;
  field: string;
  method: string;
  /** The k-simplices, by original vertex ids, in the order of the values. */
  cells: number[][];
  /** One entry per basis vector: for each cell, its value vector. */
  basis: (number | string)[][][];
}

/**
 * Representatives of a basis of H^k lifted to the original cells, each
 * checked to be a cocycle of the full complex.
 */
export function computeSections<E>(sheaf: Sheaf<E>, run: Computation<E>, k: number): { report: SectionsReport; vectors: Vec<E>[] } {
  const F = sheaf.field;
  const vectors = sectionVectors(sheaf, run, k);
  const n = sheaf.complex.simplices[k].size;
  const off = cellOffsets(sheaf.stalkDims[k]);
  const cells: number[][] = [];
  for (let s = 0; s < n; s++) cells.push(simplexIds(sheaf.complex, k, s));
  const basis = vectors.map((v) => {
    const normal = normalise(F, v);
    const perCell: (number | string)[][] = [];
    for (let s = 0; s < n; s++) {
      const vals: (number | string)[] = [];
      for (let i = off[s]; i < off[s + 1]; i++) vals.push(F.toJSON(normal[i]));
      perCell.push(vals);
    }
    return perCell;
  });
  return {
    report: { degree: k, dim: vectors.length, field: F.label, method: run.report.method, cells, basis },
    vectors,
  };
}

/**
 * Cocycles whose classes form a basis of H^k, as flat cochains on the
 * original cells (cell order of the complex, each cell's stalk coordinates
 * in turn), each checked to be a cocycle of the full complex.
 */
export function sectionVectors<E>(sheaf: Sheaf<E>, run: Computation<E>, k: number): Vec<E>[] {
  const top = sheaf.complex.dimension;
  if (k < 0 || k > top) throw new RangeError(`degree ${k} is outside 0…${top}`);
  const small = run.reduction ? run.reduction.output : run.complex;
  const reps = cohomologyBasis(small, k);
  const vectors = reps.map((r) => (run.reduction ? run.reduction.lift(k, r) : r));
  for (const v of vectors) assertCocycle(run.complex, k, v);
  return vectors;
}

/** Real field: scale to largest magnitude 1 so values read as proportions. */
function normalise<E>(F: Sheaf<E>['field'], v: Vec<E>): Vec<E> {
  if (F.kind !== 'real') return v;
  const f = v as unknown as Float64Array;
  let m = 0;
  for (let i = 0; i < f.length; i++) m = Math.max(m, Math.abs(f[i]));
  return m === 0 ? v : (f.map((x) => x / m) as unknown as Vec<E>);
}

/** δ^k v = 0 on the full complex (within tolerance in the real field), computed block by block. */
function assertCocycle<E>(X: BasedComplex<E>, k: number, v: Vec<E>): void {
  if (k + 1 >= X.dims.length) return;
  const F = X.field;
  const cob = X.cob[k];
  const off = cellOffsets(X.dims[k]);
  let norm = 0;
  for (let i = 0; i < v.length; i++) norm = Math.max(norm, F.magnitude(v[i]));
  let scale = 0;
  for (const M of X.blocks) scale = Math.max(scale, maxAbs(F, M));
  const up = X.dims[k + 1];
  let widest = 0;
  for (let t = 0; t < up.length; t++) widest = Math.max(widest, up[t]);
  const acc = F.newVec(widest);
  const bound = Math.max(1, scale * norm) * 1e3;
  for (let t = 0; t < up.length; t++) {
    for (let q = 0; q < up[t]; q++) acc[q] = F.zero;
    for (let e = cob.rowPtr[t]; e < cob.rowPtr[t + 1]; e++) {
      const b = cob.block[e];
      if (b >= 0) accumulate(F, acc, X.blocks[b], cob.sign[e], v, off[cob.col[e]]);
    }
    for (let q = 0; q < up[t]; q++) {
      if (!F.negligible(acc[q], bound)) throw new Error('internal check failed: a lifted representative is not a cocycle');
    }
  }
}
