import type { CsrMatrix } from './CsrMatrix';
import { DegreeHeap } from './DegreeHeap';
import { denseTail } from './denseTail';

/** The dense finish starts once this many unknowns remain and their rows are this full. */
const DENSE_TAIL_MIN = 64;
const DENSE_TAIL_FILL = 0.25;

export interface CholeskyOptions {
  /**
   * A pivot at most `tolerance` times the original diagonal entry counts as
   * zero: the matrix is taken as singular in that direction (default 1e-10).
   */
  tolerance?: number;
}

/**
 * LDLᵀ factorisation of a symmetric positive semidefinite sparse matrix,
 * computed once in the constructor, pivoting in minimum-degree order (the
 * remaining unknown with the fewest neighbours goes next), which keeps the
 * fill small on survey nets, frames and meshes.
 *
 * A semidefinite matrix meets zero pivots where it is singular; in exact
 * arithmetic the whole remaining row is then zero, so that unknown is set
 * aside (its solution component is 0) and counted in {@link nullity}. This is
 * how a least-squares adjustment finds unknowns the observations do not fix.
 * Both triangles of the input must be stored; only the pattern is trusted
 * to be symmetric, values are read from the row of each unknown.
 */
export class SparseCholesky {
  readonly n: number;
  /** Elimination order: step s eliminated unknown `order[s]`. */
  readonly order: Int32Array;
  /** D of LDLᵀ per step; 0 for a zero (singular) pivot. */
  readonly pivot: Float64Array;
  /** L column of step s: unknowns `lIdx[lPtr[s] … lPtr[s+1]]` with multipliers `lVal`. */
  private readonly lPtr: Int32Array;
  private readonly lIdx: Int32Array;
  private readonly lVal: Float64Array;
  private readonly stepOf: Int32Array;
  /** The smallest accepted pivot relative to its original diagonal entry. */
  readonly smallestPivotRatio: number;
  /** A negative pivot beyond the tolerance was met: the matrix is not semidefinite. */
  readonly indefinite: boolean;
  private readonly zeroSteps: number[] = [];

  constructor(A: CsrMatrix, options: CholeskyOptions = {}) {
    if (A.rows !== A.cols) throw new RangeError(`a ${A.rows}×${A.cols} matrix is not square`);
    const tol = options.tolerance ?? 1e-10;
    const n = A.rows;
    this.n = n;
    // Working rows of the shrinking Schur complement, off-diagonal only, unsorted.
    const idx: Int32Array[] = new Array(n);
    const val: Float64Array[] = new Array(n);
    const len = new Int32Array(n);
    const diag = new Float64Array(n);
    const original = new Float64Array(n);
    for (let r = 0; r < n; r++) {
      const a = A.rowPtr[r];
      const b = A.rowPtr[r + 1];
      const ri = new Int32Array(Math.max(4, b - a));
      const rv = new Float64Array(ri.length);
      let m = 0;
      for (let e = a; e < b; e++) {
        const c = A.col[e];
        if (c === r) diag[r] += A.val[e];
        else if (A.val[e] !== 0) {
          ri[m] = c;
          rv[m++] = A.val[e];
        }
      }
      idx[r] = ri;
      val[r] = rv;
      len[r] = m;
      original[r] = diag[r];
    }
    const heap = new DegreeHeap(n);
    for (let r = 0; r < n; r++) heap.push(len[r], r);
    const eliminated = new Uint8Array(n);
    const order = new Int32Array(n);
    const stepOf = new Int32Array(n);
    const pivot = new Float64Array(n);
    const lPtr = new Int32Array(n + 1);
    let lIdx = new Int32Array(Math.max(16, A.rowPtr[n]));
    let lVal = new Float64Array(lIdx.length);
    let nnzL = 0;
    const slot = new Int32Array(n).fill(-1);
    let smallest = Infinity;
    let indefinite = false;
    let remainingEntries = 0;
    for (let r = 0; r < n; r++) remainingEntries += len[r];
    let step = 0;
    for (; step < n; step++) {
      const left = n - step;
      // Once the remaining Schur complement is a quarter full, dense elimination is cheaper.
      if (left >= DENSE_TAIL_MIN && remainingEntries >= DENSE_TAIL_FILL * left * left) break;
      let p = -1;
      while (heap.size > 0) {
        const [deg, node] = heap.pop();
        if (!eliminated[node] && deg === len[node]) {
          p = node;
          break;
        }
      }
      if (p < 0) throw new Error('internal check failed: the elimination queue ran dry');
      eliminated[p] = 1;
      order[step] = p;
      stepOf[p] = step;
      const d = diag[p];
      const m = len[p];
      const pi = idx[p];
      const pv = val[p];
      const scale = Math.max(Math.abs(original[p]), Number.MIN_VALUE);
      // Remove p from its neighbours' rows whatever happens next.
      for (let a = 0; a < m; a++) removeEntry(idx, val, len, pi[a], p);
      remainingEntries -= 2 * m;
      if (d <= tol * scale) {
        if (d < -tol * scale) indefinite = true;
        pivot[step] = 0;
        this.zeroSteps.push(step);
        lPtr[step + 1] = nnzL;
        len[p] = 0;
        for (let a = 0; a < m; a++) heap.push(len[pi[a]], pi[a]);
        continue;
      }
      smallest = Math.min(smallest, d / scale);
      pivot[step] = d;
      if (nnzL + m > lIdx.length) {
        const size = Math.max(lIdx.length * 2, nnzL + m);
        lIdx = growI(lIdx, size);
        lVal = growF(lVal, size);
      }
      for (let a = 0; a < m; a++) {
        lIdx[nnzL + a] = pi[a];
        lVal[nnzL + a] = pv[a] / d;
      }
      // Schur update: a_ij -= a_ip a_pj / d for every pair of neighbours. The
      // hot loop of the factorisation: rows are held in locals and grown once.
      for (let a = 0; a < m; a++) {
        const i = pi[a];
        const pa = pv[a];
        const li = pa / d;
        diag[i] -= li * pa;
        let ri = idx[i];
        let rv = val[i];
        let rowLen = len[i];
        if (rowLen + m > ri.length) {
          ri = idx[i] = growI(ri, Math.max(ri.length * 2, rowLen + m));
          rv = val[i] = growF(rv, ri.length);
        }
        for (let e = 0; e < rowLen; e++) slot[ri[e]] = e;
        for (let b = 0; b < m; b++) {
          if (b === a) continue;
          const j = pi[b];
          const at = slot[j];
          if (at >= 0) rv[at] -= li * pv[b];
          else {
            ri[rowLen] = j;
            rv[rowLen] = -li * pv[b];
            slot[j] = rowLen++;
          }
        }
        for (let e = 0; e < rowLen; e++) slot[ri[e]] = -1;
        remainingEntries += rowLen - len[i];
        len[i] = rowLen;
      }
      nnzL += m;
      lPtr[step + 1] = nnzL;
      len[p] = 0;
      idx[p] = EMPTY_I;
      val[p] = EMPTY_F;
      for (let a = 0; a < m; a++) heap.push(len[pi[a]], pi[a]);
    }
    if (step < n) {
      const rest: number[] = [];
      for (let r = 0; r < n; r++) if (!eliminated[r]) rest.push(r);
      const tail = denseTail(rest, idx, val, len, diag, original, tol);
      if (nnzL + tail.entries.length > lIdx.length) {
        lIdx = growI(lIdx, nnzL + tail.entries.length);
        lVal = growF(lVal, lIdx.length);
      }
      for (let s = 0; s < rest.length; s++, step++) {
        const p = rest[s];
        order[step] = p;
        stepOf[p] = step;
        pivot[step] = tail.pivot[s];
        if (tail.pivot[s] === 0) this.zeroSteps.push(step);
        for (let e = tail.ptr[s]; e < tail.ptr[s + 1]; e++) {
          lIdx[nnzL] = rest[tail.entries[e]];
          lVal[nnzL++] = tail.values[e];
        }
        lPtr[step + 1] = nnzL;
      }
      smallest = Math.min(smallest, tail.smallest);
      indefinite ||= tail.indefinite;
    }
    this.order = order;
    this.stepOf = stepOf;
    this.pivot = pivot;
    this.lPtr = lPtr;
    this.lIdx = lIdx.slice(0, nnzL);
    this.lVal = lVal.slice(0, nnzL);
    this.smallestPivotRatio = smallest;
    this.indefinite = indefinite;
  }

  /** Number of zero pivots: the dimension of the kernel. */
  get nullity(): number {
    return this.zeroSteps.length;
  }

  get rank(): number {
    return this.n - this.zeroSteps.length;
  }

  isSingular(): boolean {
    return this.zeroSteps.length > 0;
  }

  /** Entries of the factor L (fill included). */
  get factorEntries(): number {
    return this.lIdx.length;
  }

  /**
   * A solution of A x = b. For a singular A and b in its range this is one
   * exact solution (components of the set-aside unknowns are 0); other
   * right-hand sides get the least-squares answer only in the nonsingular part.
   */
  solve(b: ArrayLike<number>): Float64Array {
    const n = this.n;
    if (b.length !== n) throw new RangeError(`right-hand side has ${b.length} entries, expected ${n}`);
    const x = Float64Array.from(b as ArrayLike<number>);
    const { order, pivot, lPtr, lIdx, lVal } = this;
    for (let s = 0; s < n; s++) {
      const p = order[s];
      const xp = x[p];
      if (xp === 0) continue;
      for (let e = lPtr[s]; e < lPtr[s + 1]; e++) x[lIdx[e]] -= lVal[e] * xp;
    }
    for (let s = 0; s < n; s++) {
      const p = order[s];
      x[p] = pivot[s] === 0 ? 0 : x[p] / pivot[s];
    }
    for (let s = n - 1; s >= 0; s--) {
      const p = order[s];
      let xp = x[p];
      for (let e = lPtr[s]; e < lPtr[s + 1]; e++) xp -= lVal[e] * x[lIdx[e]];
      x[p] = xp;
    }
    return x;
  }

  /**
   * A basis of the kernel, one vector per zero pivot: the set-aside unknown
   * at 1, unknowns eliminated after it at 0, earlier ones by back
   * substitution. At most `limit` vectors (default all).
   */
  nullVectors(limit = Infinity): Float64Array[] {
    const out: Float64Array[] = [];
    const { order, lPtr, lIdx, lVal } = this;
    for (const z of this.zeroSteps) {
      if (out.length >= limit) break;
      const x = new Float64Array(this.n);
      x[order[z]] = 1;
      for (let s = z - 1; s >= 0; s--) {
        let xp = 0;
        for (let e = lPtr[s]; e < lPtr[s + 1]; e++) xp -= lVal[e] * x[lIdx[e]];
        x[order[s]] = xp;
      }
      out.push(x);
    }
    return out;
  }

  /** Unknowns set aside at a zero pivot, in elimination order. */
  get zeroPivotUnknowns(): Int32Array {
    return Int32Array.from(this.zeroSteps, (s) => this.order[s]);
  }

  /**
   * The factor as stored: column s of the unit lower triangle L holds the
   * unknowns `lIdx[lPtr[s] … lPtr[s+1]]` (all eliminated after step s)
   * with multipliers `lVal`; D is {@link pivot}. The arrays are the
   * factor's own: read, do not write.
   */
  get factor(): { order: Int32Array; pivot: Float64Array; lPtr: Int32Array; lIdx: Int32Array; lVal: Float64Array } {
    return { order: this.order, pivot: this.pivot, lPtr: this.lPtr, lIdx: this.lIdx, lVal: this.lVal };
  }

  /** Step at which unknown i was eliminated. */
  stepOfUnknown(i: number): number {
    return this.stepOf[i];
  }
}

const EMPTY_I = new Int32Array(0);
const EMPTY_F = new Float64Array(0);

function removeEntry(idx: Int32Array[], val: Float64Array[], len: Int32Array, row: number, target: number): void {
  const ri = idx[row];
  const m = len[row];
  for (let e = 0; e < m; e++) {
    if (ri[e] === target) {
      ri[e] = ri[m - 1];
      val[row][e] = val[row][m - 1];
      len[row] = m - 1;
      return;
    }
  }
}

function growI(a: Int32Array, size: number): Int32Array<ArrayBuffer> {
  const b = new Int32Array(size);
  b.set(a.subarray(0, Math.min(a.length, size)));
  return b;
}

function growF(a: Float64Array, size: number): Float64Array<ArrayBuffer> {
  const b = new Float64Array(size);
  b.set(a.subarray(0, Math.min(a.length, size)));
  return b;
}
