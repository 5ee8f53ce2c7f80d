import { cellOffsets, type BasedComplex } from './based/BasedComplex';
import { simplexIds } from './complex/SimplicialComplex';
import type { Vec } from './fields/Field';
import type { Sheaf } from './model/Sheaf';
import { cohomologyBasis } from './solve/cohomologyBasis';
import { scalarRows } from './solve/scalarRows';
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

function assertCocycle<E>(X: BasedComplex<E>, k: number, v: Vec<E>): void {
  if (k + 1 >= X.dims.length) return;
  const F = X.field;
  const rows = scalarRows(X, k);
  let norm = 0;
  for (let i = 0; i < v.length; i++) norm = Math.max(norm, F.magnitude(v[i]));
  for (const r of rows.rows) {
    let acc = F.zero;
    for (let i = 0; i < r.cols.length; i++) acc = F.add(acc, F.mul(r.vals[i], v[r.cols[i]]));
    if (!F.negligible(acc, Math.max(1, rows.scale * norm) * 1e3)) {
      throw new Error('internal check failed: a lifted representative is not a cocycle');
    }
  }
}
