import { cellOffsets, transposeIndex, type BasedComplex, type Coboundary } from './BasedComplex';
import { entry, scalarMat, type Mat } from './Mat';

/**
 * The same complex with every basis vector its own cell of dimension one.
 *
 * Pairing single coordinates is algebraic Morse theory at the level of basis
 * vectors (Sköldberg 2006; Jöllenbeck–Welker 2009): a rank-one projection
 * between stalks, unmatchable as a block, still pairs one coordinate. Cell
 * i of degree k is coordinate i of the flat degree-k cochain, so cochains
 * pass between the two complexes unchanged. `parent[k][i]` is the cell of
 * the input that coordinate came from.
 */
export function splitToScalars<E>(X: BasedComplex<E>): { split: BasedComplex<E>; parent: Int32Array[] } {
  const F = X.field;
  const degrees = X.dims.length;
  const parent: Int32Array[] = [];
  const dims: Int32Array[] = [];
  const offsets = X.dims.map(cellOffsets);
  for (let k = 0; k < degrees; k++) {
    const off = offsets[k];
    const n = off[off.length - 1];
    const p = new Int32Array(n);
    for (let c = 0; c + 1 < off.length; c++) p.fill(c, off[c], off[c + 1]);
    parent.push(p);
    dims.push(new Int32Array(n).fill(1));
  }
  const blocks: Mat<E>[] = [];
  const cob: Coboundary[] = [];
  for (let k = 0; k + 1 < degrees; k++) {
    const src = X.cob[k];
    const rowOff = offsets[k + 1];
    const colOff = offsets[k];
    const nRows = rowOff[rowOff.length - 1];
    const rowPtr = new Int32Array(nRows + 1);
    const col: number[] = [];
    const sign: number[] = [];
    const block: number[] = [];
    for (let t = 0; t + 1 < rowOff.length; t++) {
      for (let r = 0; r < X.dims[k + 1][t]; r++) {
        for (let e = src.rowPtr[t]; e < src.rowPtr[t + 1]; e++) {
          const b = src.block[e];
          if (b < 0) continue;
          const M = X.blocks[b];
          const s = src.col[e];
          for (let c = 0; c < M.cols; c++) {
            if (M.scalar !== undefined && c !== r) continue;
            const v = entry(F, M, r, c);
            if (F.isZero(v)) continue;
            col.push(colOff[s] + c);
            sign.push(src.sign[e]);
            block.push(blocks.length);
            blocks.push(scalarMat(1, v));
          }
        }
        rowPtr[rowOff[t] + r + 1] = col.length;
      }
    }
    const colArr = Int32Array.from(col);
    const { colPtr, colEntry } = transposeIndex(rowPtr, colArr, colOff[colOff.length - 1]);
    cob.push({ rowPtr, col: colArr, sign: Int8Array.from(sign), block: Int32Array.from(block), colPtr, colEntry });
  }
  return { split: { field: F, dims, cob, blocks }, parent };
}
