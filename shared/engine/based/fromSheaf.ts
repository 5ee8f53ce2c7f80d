import type { Sheaf } from '../model/Sheaf';
import type { BasedComplex, Coboundary } from './BasedComplex';

/**
 * The cochain complex of a sheaf as a based complex. The row structure and
 * the block ids are the complex's own incidence arrays (no copy); only the
 * incidence signs (-1)^i are materialised.
 */
export function fromSheaf<E>(sheaf: Sheaf<E>): BasedComplex<E> {
  const cx = sheaf.complex;
  const cob: Coboundary[] = [];
  for (let k = 0; k < cx.dimension; k++) {
    const width = k + 2;
    const n = cx.simplices[k + 1].size;
    const rowPtr = new Int32Array(n + 1);
    for (let r = 0; r <= n; r++) rowPtr[r] = r * width;
    const sign = alternatingRows(n, width);
    cob.push({
      rowPtr,
      col: cx.faces[k + 1],
      sign,
      block: sheaf.restriction[k + 1],
      colPtr: cx.cofacePtr[k],
      colEntry: cx.cofaceEntry[k],
    });
  }
  return { field: sheaf.field, dims: sheaf.stalkDims, cob, blocks: sheaf.maps };
}

/** The incidence signs (-1)^i of n rows of `width` faces, by doubling copies of the first row. */
function alternatingRows(n: number, width: number): Int8Array {
  const sign = new Int8Array(n * width);
  if (sign.length === 0) return sign;
  for (let i = 0; i < width; i++) sign[i] = i % 2 === 0 ? 1 : -1;
  for (let filled = width; filled < sign.length; filled *= 2) sign.copyWithin(filled, 0, Math.min(filled, sign.length - filled));
  return sign;
}
