import { cellOffsets, type BasedComplex } from '../based/BasedComplex';
import { fromSheaf } from '../based/fromSheaf';
import { entry } from '../based/Mat';
import type { Sheaf } from '../model/Sheaf';
import { csrFromTriplets, csrZero, type CsrMatrix } from './CsrMatrix';

/**
 * δ^k of a sheaf as a real sparse matrix: rows are the coordinates of the
 * (k+1)-cochains, columns those of the k-cochains, both in the complex's
 * cell order with each cell's stalk coordinates in turn (the layout of
 * {@link sectionVectors}). Exact entries are converted to the nearest
 * double. Outside 0 … top−1 the map is zero, of the right shape.
 */
export function coboundaryMatrix(sheaf: Sheaf<unknown>, k: number): CsrMatrix {
  return basedCoboundaryMatrix(fromSheaf(sheaf), k);
}

/** {@link coboundaryMatrix} for any based complex. */
export function basedCoboundaryMatrix<E>(X: BasedComplex<E>, k: number): CsrMatrix {
  const dim = (j: number) => (j >= 0 && j < X.dims.length ? sum(X.dims[j]) : 0);
  if (k < 0 || k + 1 >= X.dims.length) return csrZero(dim(k + 1), dim(k));
  const F = X.field;
  const cob = X.cob[k];
  const rowOff = cellOffsets(X.dims[k + 1]);
  const colOff = cellOffsets(X.dims[k]);
  const r: number[] = [];
  const c: number[] = [];
  const v: number[] = [];
  for (let t = 0; t + 1 < rowOff.length; t++) {
    for (let e = cob.rowPtr[t]; e < cob.rowPtr[t + 1]; e++) {
      const b = cob.block[e];
      if (b < 0) continue;
      const M = X.blocks[b];
      const s = cob.col[e];
      for (let i = 0; i < M.rows; i++) {
        for (let j = 0; j < M.cols; j++) {
          if (M.scalar !== undefined && i !== j) continue;
          const x = F.toNumber(entry(F, M, i, j));
          if (x === 0) continue;
          r.push(rowOff[t] + i);
          c.push(colOff[s] + j);
          v.push(cob.sign[e] * x);
        }
      }
    }
  }
  return csrFromTriplets(rowOff[rowOff.length - 1], colOff[colOff.length - 1], r, c, v);
}

function sum(d: Int32Array): number {
  let s = 0;
  for (let i = 0; i < d.length; i++) s += d[i];
  return s;
}
