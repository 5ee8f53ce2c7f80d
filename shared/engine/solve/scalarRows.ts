import { cellOffsets, type BasedComplex } from '../based/BasedComplex';
import { entry, maxAbs } from '../based/Mat';
import type { Vec } from '../fields/Field';
import type { SparseRows } from './SparseEchelon';

/**
 * δ^k of a based complex as sparse scalar rows: one row per coordinate of
 * degree k+1, columns the coordinates of degree k.
 */
export function scalarRows<E>(X: BasedComplex<E>, k: number): SparseRows<E> {
  const F = X.field;
  const cob = X.cob[k];
  const rowDims = X.dims[k + 1];
  const colOff = cellOffsets(X.dims[k]);
  const rows: { cols: Int32Array; vals: Vec<E> }[] = [];
  let scale = 0;
  for (let t = 0; t < rowDims.length; t++) {
    const lists: { cols: number[]; vals: E[] }[] = Array.from({ length: rowDims[t] }, () => ({ cols: [], vals: [] }));
    for (let e = cob.rowPtr[t]; e < cob.rowPtr[t + 1]; e++) {
      const b = cob.block[e];
      if (b < 0) continue;
      const M = X.blocks[b];
      const s = cob.col[e];
      const neg = cob.sign[e] < 0;
      const m = maxAbs(F, M);
      if (m > scale) scale = m;
      for (let r = 0; r < M.rows; r++) {
        for (let c = 0; c < M.cols; c++) {
          if (M.scalar !== undefined && r !== c) continue;
          const v = entry(F, M, r, c);
          if (F.isZero(v)) continue;
          lists[r].cols.push(colOff[s] + c);
          lists[r].vals.push(neg ? F.neg(v) : v);
        }
      }
    }
    for (const l of lists) {
      const vals = F.newVec(l.vals.length);
      for (let i = 0; i < l.vals.length; i++) vals[i] = l.vals[i];
      rows.push({ cols: Int32Array.from(l.cols), vals });
    }
  }
  return { nCols: colOff[colOff.length - 1], rows, scale };
}

/** The transpose of sparse rows (columns become rows). */
export function transposeRows<E>(m: SparseRows<E>, newVec: (n: number) => Vec<E>): SparseRows<E> {
  const counts = new Int32Array(m.nCols);
  for (const r of m.rows) for (let i = 0; i < r.cols.length; i++) counts[r.cols[i]]++;
  const rows = Array.from(counts, (n) => ({ cols: new Int32Array(n), vals: newVec(n) }));
  const fill = new Int32Array(m.nCols);
  m.rows.forEach((r, ri) => {
    for (let i = 0; i < r.cols.length; i++) {
      const c = r.cols[i];
      rows[c].cols[fill[c]] = ri;
      rows[c].vals[fill[c]++] = r.vals[i];
    }
  });
  return { nCols: m.rows.length, rows, scale: m.scale };
}
