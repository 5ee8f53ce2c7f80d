import { transposeIndex, type BasedComplex, type Coboundary } from '../based/BasedComplex';
import { denseMat, type Mat } from '../based/Mat';

/**
 * The dual of a based complex: degrees reversed (degree j of the dual is
 * degree top − j of the input) and every block transposed, so the dual's
 * coboundary is the input's boundary ∂ = δᵀ. Its cohomology is the
 * input's homology; for the constant sheaf on a simplicial complex that is
 * simplicial homology, cycles included. Cells keep their indices, so
 * cochains of the dual are chains of the input, coordinate for coordinate.
 */
export function transposeComplex<E>(X: BasedComplex<E>): BasedComplex<E> {
  const F = X.field;
  const top = X.dims.length - 1;
  const blocks: Mat<E>[] = X.blocks.map((M) => {
    if (M.scalar !== undefined || M.rows === 0 || M.cols === 0) return { rows: M.cols, cols: M.rows, data: M.data, scalar: M.scalar };
    const data = F.newVec(M.rows * M.cols);
    for (let i = 0; i < M.rows; i++) for (let j = 0; j < M.cols; j++) data[j * M.rows + i] = M.data[i * M.cols + j];
    return denseMat(M.cols, M.rows, data);
  });
  const dims = X.dims.slice().reverse();
  const cob: Coboundary[] = [];
  for (let j = 0; j < top; j++) {
    // Dual degree j → j+1 is input degree top−j → top−j−1: the transpose of cob[top−j−1].
    const C = X.cob[top - j - 1];
    const nnz = C.colEntry.length;
    const rowOfEntry = new Int32Array(C.rowPtr[C.rowPtr.length - 1]);
    for (let r = 0; r + 1 < C.rowPtr.length; r++) rowOfEntry.fill(r, C.rowPtr[r], C.rowPtr[r + 1]);
    const col = new Int32Array(nnz);
    const sign = new Int8Array(nnz);
    const block = new Int32Array(nnz);
    for (let e = 0; e < nnz; e++) {
      const orig = C.colEntry[e];
      col[e] = rowOfEntry[orig];
      sign[e] = C.sign[orig];
      block[e] = C.block[orig];
    }
    const rowPtr = Int32Array.from(C.colPtr);
    const { colPtr, colEntry } = transposeIndex(rowPtr, col, C.rowPtr.length - 1);
    cob.push({ rowPtr, col, sign, block, colPtr, colEntry });
  }
  return { field: F, dims, cob, blocks };
}
