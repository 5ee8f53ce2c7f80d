import type { BasedComplex, Coboundary } from '../based/BasedComplex';

/**
 * Global numbering of the cells of a based complex (degree by degree) and
 * the row of every coboundary entry, so a round can keep one flat state
 * array over all cells.
 */
export class CellIndex {
  readonly offset: Int32Array;
  readonly total: number;
  readonly degreeOf: Uint8Array;
  /** rowOf[k][e]: the (k+1)-cell of entry e of cob[k]. */
  readonly rowOf: Int32Array[];

  constructor(X: BasedComplex<unknown>) {
    const degrees = X.dims.length;
    this.offset = new Int32Array(degrees + 1);
    for (let k = 0; k < degrees; k++) this.offset[k + 1] = this.offset[k] + X.dims[k].length;
    this.total = this.offset[degrees];
    this.degreeOf = new Uint8Array(this.total);
    for (let k = 0; k < degrees; k++) this.degreeOf.fill(k, this.offset[k], this.offset[k + 1]);
    this.rowOf = X.cob.map(expandRows);
  }
}

function expandRows(cob: Coboundary): Int32Array {
  const n = cob.rowPtr.length - 1;
  const rows = new Int32Array(cob.rowPtr[n]);
  for (let r = 0; r < n; r++) rows.fill(r, cob.rowPtr[r], cob.rowPtr[r + 1]);
  return rows;
}
