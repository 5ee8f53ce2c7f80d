/**
 * A sparse real matrix in compressed sparse row form: row r holds the
 * entries `rowPtr[r] … rowPtr[r+1]` with columns `col[e]` (increasing within
 * a row) and values `val[e]`. Contiguous typed arrays, so a matrix crosses to
 * a worker without copying and every product below scans memory in order.
 */
export interface CsrMatrix {
  readonly rows: number;
  readonly cols: number;
  readonly rowPtr: Int32Array;
  readonly col: Int32Array;
  readonly val: Float64Array;
}

/** The rows × cols zero matrix. */
export function csrZero(rows: number, cols: number): CsrMatrix {
  return { rows, cols, rowPtr: new Int32Array(rows + 1), col: new Int32Array(0), val: new Float64Array(0) };
}

/**
 * A matrix from (row, column, value) triplets; duplicates are summed and
 * exact zeros dropped. Throws RangeError on an index outside the shape.
 */
export function csrFromTriplets(rows: number, cols: number, r: ArrayLike<number>, c: ArrayLike<number>, v: ArrayLike<number>): CsrMatrix {
  const n = r.length;
  const count = new Int32Array(rows + 1);
  for (let i = 0; i < n; i++) {
    if (r[i] < 0 || r[i] >= rows || c[i] < 0 || c[i] >= cols) throw new RangeError(`entry (${r[i]}, ${c[i]}) is outside ${rows}×${cols}`);
    count[r[i] + 1]++;
  }
  for (let i = 0; i < rows; i++) count[i + 1] += count[i];
  const fill = count.slice(0, rows);
  const col = new Int32Array(n);
  const val = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const at = fill[r[i]]++;
    col[at] = c[i];
    val[at] = v[i];
  }
  return compress(rows, cols, count, col, val);
}

/** y = A x. */
export function csrMatVec(A: CsrMatrix, x: ArrayLike<number>, y: Float64Array = new Float64Array(A.rows)): Float64Array {
  const { rowPtr, col, val } = A;
  for (let r = 0; r < A.rows; r++) {
    let s = 0;
    for (let e = rowPtr[r]; e < rowPtr[r + 1]; e++) s += val[e] * x[col[e]];
    y[r] = s;
  }
  return y;
}

/** y = Aᵀ x, scanning A by rows (no transpose is built). */
export function csrMatTVec(A: CsrMatrix, x: ArrayLike<number>, y: Float64Array = new Float64Array(A.cols)): Float64Array {
  const { rowPtr, col, val } = A;
  y.fill(0);
  for (let r = 0; r < A.rows; r++) {
    const xr = x[r];
    if (xr === 0) continue;
    for (let e = rowPtr[r]; e < rowPtr[r + 1]; e++) y[col[e]] += val[e] * xr;
  }
  return y;
}

/** Aᵀ as its own CSR matrix (columns stay increasing: rows are visited in order). */
export function csrTranspose(A: CsrMatrix): CsrMatrix {
  const nnz = A.rowPtr[A.rows];
  const ptr = new Int32Array(A.cols + 1);
  for (let e = 0; e < nnz; e++) ptr[A.col[e] + 1]++;
  for (let c = 0; c < A.cols; c++) ptr[c + 1] += ptr[c];
  const fill = ptr.slice(0, A.cols);
  const col = new Int32Array(nnz);
  const val = new Float64Array(nnz);
  for (let r = 0; r < A.rows; r++) {
    for (let e = A.rowPtr[r]; e < A.rowPtr[r + 1]; e++) {
      const at = fill[A.col[e]]++;
      col[at] = r;
      val[at] = A.val[e];
    }
  }
  return { rows: A.cols, cols: A.rows, rowPtr: ptr, col, val };
}

/**
 * A · diag(w) · B (w omitted: the identity), by Gustavson's row-by-row
 * product with a dense accumulator and a marker array.
 */
export function csrMultiply(A: CsrMatrix, B: CsrMatrix, w?: ArrayLike<number>): CsrMatrix {
  if (A.cols !== B.rows) throw new RangeError(`cannot multiply ${A.rows}×${A.cols} by ${B.rows}×${B.cols}`);
  const acc = new Float64Array(B.cols);
  const mark = new Int32Array(B.cols).fill(-1);
  const ptr = new Int32Array(A.rows + 1);
  let col = new Int32Array(Math.max(16, A.rowPtr[A.rows] + B.rowPtr[B.rows]));
  let val = new Float64Array(col.length);
  let nnz = 0;
  const touched: number[] = [];
  for (let r = 0; r < A.rows; r++) {
    touched.length = 0;
    for (let e = A.rowPtr[r]; e < A.rowPtr[r + 1]; e++) {
      const k = A.col[e];
      const a = w ? A.val[e] * w[k] : A.val[e];
      if (a === 0) continue;
      for (let f = B.rowPtr[k]; f < B.rowPtr[k + 1]; f++) {
        const c = B.col[f];
        if (mark[c] !== r) {
          mark[c] = r;
          acc[c] = 0;
          touched.push(c);
        }
        acc[c] += a * B.val[f];
      }
    }
    touched.sort((x, y) => x - y);
    if (nnz + touched.length > col.length) {
      const size = Math.max(col.length * 2, nnz + touched.length);
      col = grow(col, size);
      val = growF(val, size);
    }
    for (const c of touched) {
      if (acc[c] === 0) continue;
      col[nnz] = c;
      val[nnz++] = acc[c];
    }
    ptr[r + 1] = nnz;
  }
  return { rows: A.rows, cols: B.cols, rowPtr: ptr, col: col.slice(0, nnz), val: val.slice(0, nnz) };
}

/** αA + βB for matrices of the same shape. */
export function csrAdd(A: CsrMatrix, B: CsrMatrix, alpha = 1, beta = 1): CsrMatrix {
  if (A.rows !== B.rows || A.cols !== B.cols) throw new RangeError(`cannot add ${A.rows}×${A.cols} and ${B.rows}×${B.cols}`);
  const ptr = new Int32Array(A.rows + 1);
  const col = new Int32Array(A.rowPtr[A.rows] + B.rowPtr[B.rows]);
  const val = new Float64Array(col.length);
  let nnz = 0;
  for (let r = 0; r < A.rows; r++) {
    // Both rows are sorted: a merge.
    let i = A.rowPtr[r];
    let j = B.rowPtr[r];
    const iEnd = A.rowPtr[r + 1];
    const jEnd = B.rowPtr[r + 1];
    while (i < iEnd || j < jEnd) {
      let c: number;
      let v: number;
      if (j >= jEnd || (i < iEnd && A.col[i] < B.col[j])) {
        c = A.col[i];
        v = alpha * A.val[i++];
      } else if (i >= iEnd || B.col[j] < A.col[i]) {
        c = B.col[j];
        v = beta * B.val[j++];
      } else {
        c = A.col[i];
        v = alpha * A.val[i++] + beta * B.val[j++];
      }
      if (v !== 0) {
        col[nnz] = c;
        val[nnz++] = v;
      }
    }
    ptr[r + 1] = nnz;
  }
  return { rows: A.rows, cols: A.cols, rowPtr: ptr, col: col.slice(0, nnz), val: val.slice(0, nnz) };
}

/** The largest absolute entry (0 for an empty matrix). */
export function csrMaxAbs(A: CsrMatrix): number {
  let m = 0;
  for (let e = 0; e < A.val.length; e++) m = Math.max(m, Math.abs(A.val[e]));
  return m;
}

/** Sort each row by column, sum duplicates and drop zeros. */
function compress(rows: number, cols: number, ptr: Int32Array, col: Int32Array, val: Float64Array): CsrMatrix {
  const outPtr = new Int32Array(rows + 1);
  const outCol = new Int32Array(col.length);
  const outVal = new Float64Array(col.length);
  let nnz = 0;
  const order: number[] = [];
  for (let r = 0; r < rows; r++) {
    order.length = 0;
    for (let e = ptr[r]; e < ptr[r + 1]; e++) order.push(e);
    order.sort((a, b) => col[a] - col[b]);
    let last = -1;
    for (const e of order) {
      if (col[e] === last) outVal[nnz - 1] += val[e];
      else {
        outCol[nnz] = col[e];
        outVal[nnz++] = val[e];
        last = col[e];
      }
    }
    // Drop entries that summed to zero.
    let w = outPtr[r];
    for (let e = outPtr[r]; e < nnz; e++) {
      if (outVal[e] === 0) continue;
      outCol[w] = outCol[e];
      outVal[w++] = outVal[e];
    }
    nnz = w;
    outPtr[r + 1] = nnz;
  }
  return { rows, cols, rowPtr: outPtr, col: outCol.slice(0, nnz), val: outVal.slice(0, nnz) };
}

function grow(a: Int32Array, size: number): Int32Array<ArrayBuffer> {
  const b = new Int32Array(size);
  b.set(a);
  return b;
}

function growF(a: Float64Array, size: number): Float64Array<ArrayBuffer> {
  const b = new Float64Array(size);
  b.set(a);
  return b;
}
