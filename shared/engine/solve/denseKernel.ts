import type { Field, Vec } from '../fields/Field';
import type { SparseRows } from './SparseEchelon';

/**
 * A basis of the kernel of a matrix given by sparse rows, by dense
 * Gauss–Jordan elimination (partial pivoting by magnitude in the real
 * field). Meant for the small complexes left after reduction.
 */
export function denseKernel<E>(F: Field<E>, m: SparseRows<E>): Vec<E>[] {
  const n = m.nCols;
  const rowsCount = m.rows.length;
  const a: Vec<E>[] = m.rows.map((r) => {
    const v = F.newVec(n);
    for (let i = 0; i < r.cols.length; i++) v[r.cols[i]] = F.add(v[r.cols[i]], r.vals[i]);
    return v;
  });
  const pivotRowOfCol = new Int32Array(n).fill(-1);
  let row = 0;
  for (let c = 0; c < n && row < rowsCount; c++) {
    let pr = -1;
    let best = 0;
    for (let r = row; r < rowsCount; r++) {
      const v = a[r][c];
      if (F.negligible(v, m.scale)) continue;
      const mag = F.magnitude(v);
      if (mag > best) {
        best = mag;
        pr = r;
        if (F.kind !== 'real') break;
      }
    }
    if (pr < 0) continue;
    [a[row], a[pr]] = [a[pr], a[row]];
    const pinv = F.inv(a[row][c]);
    const prow = a[row];
    for (let j = c; j < n; j++) prow[j] = F.mul(prow[j], pinv);
    for (let r = 0; r < rowsCount; r++) {
      if (r === row) continue;
      const f = a[r][c];
      if (F.isZero(f)) continue;
      const target = a[r];
      for (let j = c; j < n; j++) {
        const pj = prow[j];
        if (!F.isZero(pj)) target[j] = F.sub(target[j], F.mul(f, pj));
      }
      target[c] = F.zero;
    }
    pivotRowOfCol[c] = row++;
  }
  const basis: Vec<E>[] = [];
  for (let f = 0; f < n; f++) {
    if (pivotRowOfCol[f] >= 0) continue;
    const v = F.newVec(n);
    v[f] = F.one;
    for (let c = 0; c < n; c++) {
      const r = pivotRowOfCol[c];
      if (r >= 0) v[c] = F.neg(a[r][f]);
    }
    basis.push(v);
  }
  return basis;
}
