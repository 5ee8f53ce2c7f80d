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
  private rows: Int32Array[] | undefined;
  /**
   * coCell[k][p]: the coface, as a global cell number, of position p of
   * cob[k]'s transpose index, or -1 for a zero block. Saves two dependent
   * random reads per coface in the matching's hottest loop.
   */
  readonly coCell: Int32Array[];

  constructor(private readonly X: BasedComplex<unknown>) {
    const degrees = X.dims.length;
    this.offset = new Int32Array(degrees + 1);
    for (let k = 0; k < degrees; k++) this.offset[k + 1] = this.offset[k] + X.dims[k].length;
    this.total = this.offset[degrees];
    this.degreeOf = new Uint8Array(this.total);
    for (let k = 0; k < degrees; k++) this.degreeOf.fill(k, this.offset[k], this.offset[k + 1]);
    this.coCell = X.cob.map((cob, k) => {
      // Only the matching's coface scans need rows, through coCell; the
      // row array itself is kept only when asked for (the replay uses it).
      const rows = expandRows(cob);
      const base = this.offset[k + 1];
      const out = new Int32Array(cob.colEntry.length);
      for (let p = 0; p < out.length; p++) {
        const e = cob.colEntry[p];
        out[p] = cob.block[e] >= 0 ? base + rows[e] : -1;
      }
      return out;
    });
  }

  /** rowOf[k][e]: the (k+1)-cell of entry e of cob[k]. */
  get rowOf(): Int32Array[] {
    this.rows ??= this.X.cob.map(expandRows);
    return this.rows;
  }
}

function expandRows(cob: Coboundary): Int32Array {
  const n = cob.rowPtr.length - 1;
  const rows = new Int32Array(cob.rowPtr[n]);
  // A plain loop: a fill() call per row costs more than the few writes it does.
  const ptr = cob.rowPtr;
  for (let r = 0; r < n; r++) for (let e = ptr[r]; e < ptr[r + 1]; e++) rows[e] = r;
  return rows;
}
