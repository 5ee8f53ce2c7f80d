import type { Field, Vec } from '../fields/Field';

/**
 * A small dense block (row-major), or `scalar · I` when `scalar` is set.
 * The scalar form keeps constant and locally constant sheaves cheap: their
 * blocks stay ±I through every elimination step.
 */
export interface Mat<E> {
  rows: number;
  cols: number;
  data: Vec<E>;
  scalar: E | undefined;
}

const EMPTY: Vec<never> = [];

export function scalarMat<E>(n: number, s: E): Mat<E> {
  return { rows: n, cols: n, data: EMPTY, scalar: s };
}

export function denseMat<E>(rows: number, cols: number, data: Vec<E>): Mat<E> {
  return { rows, cols, data, scalar: undefined };
}

export function entry<E>(F: Field<E>, m: Mat<E>, r: number, c: number): E {
  if (m.scalar !== undefined) return r === c ? m.scalar : F.zero;
  return m.data[r * m.cols + c];
}

/** A dense copy (always dense, never shared). */
export function toDense<E>(F: Field<E>, m: Mat<E>): Mat<E> {
  const data = F.newVec(m.rows * m.cols);
  if (m.scalar !== undefined) {
    for (let i = 0; i < m.rows; i++) data[i * m.cols + i] = m.scalar;
  } else {
    for (let i = 0; i < data.length; i++) data[i] = m.data[i];
  }
  return denseMat(m.rows, m.cols, data);
}

export function copyMat<E>(F: Field<E>, m: Mat<E>, factor: E = F.one): Mat<E> {
  if (m.scalar !== undefined) return scalarMat(m.rows, F.mul(factor, m.scalar));
  const data = F.newVec(m.data.length);
  for (let i = 0; i < data.length; i++) data[i] = F.mul(factor, m.data[i]);
  return denseMat(m.rows, m.cols, data);
}

/** factor · A · B. */
export function mulMat<E>(F: Field<E>, A: Mat<E>, B: Mat<E>, factor: E = F.one): Mat<E> {
  if (A.scalar !== undefined && B.scalar !== undefined) {
    return scalarMat(A.rows, F.mul(factor, F.mul(A.scalar, B.scalar)));
  }
  if (A.scalar !== undefined) return copyMat(F, B, F.mul(factor, A.scalar));
  if (B.scalar !== undefined) return copyMat(F, A, F.mul(factor, B.scalar));
  const n = A.rows;
  const m = A.cols;
  const p = B.cols;
  const out = F.newVec(n * p);
  // i-k-j order: rows of B are read sequentially for each nonzero A[i][k].
  for (let i = 0; i < n; i++) {
    for (let k = 0; k < m; k++) {
      const a = A.data[i * m + k];
      if (F.isZero(a)) continue;
      const fa = F.mul(factor, a);
      for (let j = 0; j < p; j++) {
        const b = B.data[k * p + j];
        if (!F.isZero(b)) out[i * p + j] = F.add(out[i * p + j], F.mul(fa, b));
      }
    }
  }
  return denseMat(n, p, out);
}

/** D ← D − X, in place (D may change from scalar to dense form). */
export function subInPlace<E>(F: Field<E>, D: Mat<E>, X: Mat<E>): void {
  if (D.scalar !== undefined && X.scalar !== undefined) {
    D.scalar = F.sub(D.scalar, X.scalar);
    return;
  }
  if (D.scalar !== undefined) {
    const dense = toDense(F, D);
    D.data = dense.data;
    D.scalar = undefined;
  }
  if (X.scalar !== undefined) {
    for (let i = 0; i < D.rows; i++) D.data[i * D.cols + i] = F.sub(D.data[i * D.cols + i], X.scalar);
    return;
  }
  for (let i = 0; i < D.data.length; i++) D.data[i] = F.sub(D.data[i], X.data[i]);
}

export function isZeroMat<E>(F: Field<E>, m: Mat<E>, scale = 0): boolean {
  if (m.rows === 0 || m.cols === 0) return true;
  if (m.scalar !== undefined) return F.negligible(m.scalar, scale);
  for (let i = 0; i < m.data.length; i++) if (!F.negligible(m.data[i], scale)) return false;
  return true;
}

export function maxAbs<E>(F: Field<E>, m: Mat<E>): number {
  if (m.scalar !== undefined) return F.magnitude(m.scalar);
  let best = 0;
  for (let i = 0; i < m.data.length; i++) {
    const a = F.magnitude(m.data[i]);
    if (a > best) best = a;
  }
  return best;
}

/** Matrix equality: exact in exact fields, within tolerance relative to the larger matrix in the real field. */
export function matEquals<E>(F: Field<E>, A: Mat<E>, B: Mat<E>): boolean {
  const scale = Math.max(maxAbs(F, A), maxAbs(F, B));
  for (let i = 0; i < A.rows; i++) {
    for (let j = 0; j < A.cols; j++) {
      const d = F.sub(entry(F, A, i, j), entry(F, B, i, j));
      if (F.kind === 'real' ? !F.negligible(d, scale) : !F.isZero(d)) return false;
    }
  }
  return true;
}

export interface Inverse<E> {
  inv: Mat<E>;
  /** Smallest pivot magnitude met by partial pivoting (1 for exact fields). */
  minPivot: number;
}

/**
 * Inverse by Gauss–Jordan with partial pivoting, or undefined when the block
 * is not square or (numerically) singular. A pivot below
 * `relThreshold · maxAbs(block)` counts as singular in the real field.
 */
export function invert<E>(F: Field<E>, m: Mat<E>, relThreshold: number): Inverse<E> | undefined {
  if (m.rows !== m.cols || m.rows === 0) return undefined;
  if (m.scalar !== undefined) {
    if (F.isZero(m.scalar)) return undefined;
    return { inv: scalarMat(m.rows, F.inv(m.scalar)), minPivot: F.magnitude(m.scalar) };
  }
  const n = m.rows;
  const a = toDense(F, m).data;
  const b = toDense(F, scalarMat(n, F.one)).data;
  const floor = relThreshold * maxAbs(F, m);
  let minPivot = Infinity;
  for (let c = 0; c < n; c++) {
    let pr = -1;
    let best = 0;
    for (let r = c; r < n; r++) {
      const mag = F.magnitude(a[r * n + c]);
      if (mag > best) {
        best = mag;
        pr = r;
        if (F.kind !== 'real') break;
      }
    }
    if (pr < 0 || best === 0 || (F.kind === 'real' && best <= floor)) return undefined;
    if (best < minPivot) minPivot = best;
    if (pr !== c) {
      for (let j = 0; j < n; j++) {
        [a[c * n + j], a[pr * n + j]] = [a[pr * n + j], a[c * n + j]];
        [b[c * n + j], b[pr * n + j]] = [b[pr * n + j], b[c * n + j]];
      }
    }
    const pinv = F.inv(a[c * n + c]);
    for (let j = 0; j < n; j++) {
      a[c * n + j] = F.mul(a[c * n + j], pinv);
      b[c * n + j] = F.mul(b[c * n + j], pinv);
    }
    for (let r = 0; r < n; r++) {
      if (r === c) continue;
      const f = a[r * n + c];
      if (F.isZero(f)) continue;
      for (let j = 0; j < n; j++) {
        a[r * n + j] = F.sub(a[r * n + j], F.mul(f, a[c * n + j]));
        b[r * n + j] = F.sub(b[r * n + j], F.mul(f, b[c * n + j]));
      }
    }
  }
  return { inv: denseMat(n, n, b), minPivot };
}
