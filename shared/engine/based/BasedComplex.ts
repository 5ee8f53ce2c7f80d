import type { Field } from '../fields/Field';
import type { Mat } from './Mat';

/**
 * The coboundary from degree k to k+1 of a based complex, as sparse blocks.
 *
 * Row-major CSR over the (k+1)-cells: entry e of row r is the block
 * `sign[e] · blocks[block[e]]` from column cell `col[e]`. The transpose index
 * (`colPtr`, `colEntry`) lists the entries of each k-cell so both faces and
 * cofaces are a contiguous scan. A block id of -1 is a zero block.
 */
export interface Coboundary {
  readonly rowPtr: Int32Array;
  readonly col: Int32Array;
  readonly sign: Int8Array;
  readonly block: Int32Array;
  readonly colPtr: Int32Array;
  readonly colEntry: Int32Array;
}

/**
 * A based cochain complex: graded cells, each with a dimension, and sparse
 * block coboundaries between consecutive degrees. The sheaf's cochain complex
 * is its first instance; every Morse complex is another.
 */
export interface BasedComplex<E> {
  readonly field: Field<E>;
  /** dims[k][c]: dimension of the space on cell c of degree k. */
  readonly dims: Int32Array[];
  /** cob[k]: degree k → k+1. */
  readonly cob: Coboundary[];
  readonly blocks: Mat<E>[];
}

/** Sum of cell dimensions per degree. */
export function cochainDims(X: BasedComplex<unknown>): number[] {
  return X.dims.map((d) => {
    let s = 0;
    for (let i = 0; i < d.length; i++) s += d[i];
    return s;
  });
}

/** Offsets of each cell's coordinates in a flat cochain of degree k. */
export function cellOffsets(dims: Int32Array): Int32Array {
  const off = new Int32Array(dims.length + 1);
  for (let i = 0; i < dims.length; i++) off[i + 1] = off[i] + dims[i];
  return off;
}

/** Build the transpose index for a CSR coboundary with `nCols` column cells. */
export function transposeIndex(rowPtr: Int32Array, col: Int32Array, nCols: number): { colPtr: Int32Array; colEntry: Int32Array } {
  const colPtr = new Int32Array(nCols + 1);
  const nnz = rowPtr[rowPtr.length - 1];
  for (let e = 0; e < nnz; e++) colPtr[col[e] + 1]++;
  for (let c = 0; c < nCols; c++) colPtr[c + 1] += colPtr[c];
  const fill = colPtr.slice(0, nCols);
  const colEntry = new Int32Array(nnz);
  for (let e = 0; e < nnz; e++) colEntry[fill[col[e]]++] = e;
  return { colPtr, colEntry };
}
