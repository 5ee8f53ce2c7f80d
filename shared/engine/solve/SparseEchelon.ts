import type { Field, Vec } from '../fields/Field';
import { Cancelled } from '../reduce/Cancelled';

/**
 * Incremental row echelon form of sparse vectors, for ranks of large sparse
 * matrices (Gaussian elimination, left-looking by rows).
 *
 * Each stored pivot row is reduced against every earlier pivot, so when a new
 * row is reduced by pivots in increasing creation order, eliminating with
 * pivot i can only create entries under later pivots: a min-heap of pivot
 * numbers therefore visits each pivot at most once per row. In the real
 * field the pivot of a row is its largest entry (stable partial pivoting),
 * and a row whose entries are all within tolerance · scale counts as zero;
 * exact fields take the lowest column.
 */
export class SparseEchelon<E> {
  private readonly F: Field<E>;
  private readonly scale: number;
  private readonly pivotOfCol: Int32Array;
  private readonly pivotCols: number[] = [];
  private readonly pivotInv: E[] = [];
  private readonly rowCols: Int32Array[] = [];
  private readonly rowVals: Vec<E>[] = [];
  private readonly work: Vec<E>;
  private readonly mark: Int32Array;
  private stamp = 0;
  private heap = new Int32Array(64);
  private heapMark = new Int32Array(64);
  smallestPivot = Infinity;
  largestDropped = 0;

  constructor(F: Field<E>, nCols: number, scale: number) {
    this.F = F;
    this.scale = scale;
    this.pivotOfCol = new Int32Array(nCols).fill(-1);
    this.work = F.newVec(nCols);
    this.mark = new Int32Array(nCols);
  }

  get rank(): number {
    return this.pivotCols.length;
  }

  /** Add a row; returns true when it was independent of the rows so far. */
  insert(cols: ArrayLike<number>, vals: ArrayLike<E>): boolean {
    const F = this.F;
    const work = this.work;
    const mark = this.mark;
    const stamp = ++this.stamp;
    const touched: number[] = [];
    let heapSize = 0;
    if (this.heapMark.length < this.pivotCols.length) {
      this.heapMark = new Int32Array(this.pivotCols.length * 2);
    }
    const heapPush = (p: number) => {
      if (this.heapMark[p] === stamp) return;
      this.heapMark[p] = stamp;
      if (heapSize === this.heap.length) {
        const h = new Int32Array(this.heap.length * 2);
        h.set(this.heap);
        this.heap = h;
      }
      const heap = this.heap;
      let i = heapSize++;
      heap[i] = p;
      while (i > 0) {
        const parent = (i - 1) >> 1;
        if (heap[parent] <= heap[i]) break;
        [heap[parent], heap[i]] = [heap[i], heap[parent]];
        i = parent;
      }
    };
    const heapPop = () => {
      const heap = this.heap;
      const top = heap[0];
      heap[0] = heap[--heapSize];
      let i = 0;
      for (;;) {
        const l = 2 * i + 1;
        const r = l + 1;
        let m = i;
        if (l < heapSize && heap[l] < heap[m]) m = l;
        if (r < heapSize && heap[r] < heap[m]) m = r;
        if (m === i) break;
        [heap[m], heap[i]] = [heap[i], heap[m]];
        i = m;
      }
      return top;
    };
    const touch = (c: number) => {
      if (mark[c] !== stamp) {
        mark[c] = stamp;
        work[c] = F.zero;
        touched.push(c);
        const p = this.pivotOfCol[c];
        if (p >= 0) heapPush(p);
      }
    };
    for (let i = 0; i < cols.length; i++) {
      const c = cols[i];
      touch(c);
      work[c] = F.add(work[c], vals[i]);
    }
    while (heapSize > 0) {
      const p = heapPop();
      const pc = this.pivotCols[p];
      const v = work[pc];
      if (F.isZero(v)) continue;
      const factor = F.mul(v, this.pivotInv[p]);
      const rc = this.rowCols[p];
      const rv = this.rowVals[p];
      for (let i = 0; i < rc.length; i++) {
        const c = rc[i];
        touch(c);
        work[c] = F.sub(work[c], F.mul(factor, rv[i]));
      }
      work[pc] = F.zero;
    }
    let best = -1;
    let bestMag = 0;
    const real = F.kind === 'real';
    let kept = 0;
    for (const c of touched) {
      const v = work[c];
      if (F.negligible(v, this.scale)) {
        const m = F.magnitude(v);
        if (m > this.largestDropped && real) this.largestDropped = m;
        continue;
      }
      kept++;
      const m = F.magnitude(v);
      if (real ? m > bestMag : best < 0 || c < best) {
        best = c;
        bestMag = m;
      }
    }
    if (best < 0) return false;
    const rc = new Int32Array(kept);
    const rv = F.newVec(kept);
    let w = 0;
    for (const c of touched) {
      const v = work[c];
      if (F.negligible(v, this.scale)) continue;
      rc[w] = c;
      rv[w++] = v;
    }
    this.pivotOfCol[best] = this.pivotCols.length;
    this.pivotCols.push(best);
    this.pivotInv.push(F.inv(work[best]));
    this.rowCols.push(rc);
    this.rowVals.push(rv);
    if (real && bestMag < this.smallestPivot) this.smallestPivot = bestMag;
    return true;
  }
}

export interface SparseRows<E> {
  nCols: number;
  rows: { cols: Int32Array; vals: Vec<E> }[];
  scale: number;
}

/** Rank of a sparse matrix given by rows, with optional progress and cancel. */
export function sparseRank<E>(
  F: Field<E>,
  m: SparseRows<E>,
  control?: { tick?(fraction: number): void; shouldStop?(): boolean },
): { rank: number; smallestPivot: number; largestDropped: number } {
  const ech = new SparseEchelon(F, m.nCols, m.scale);
  for (let i = 0; i < m.rows.length; i++) {
    if ((i & 1023) === 0 && control) {
      control.tick?.(i / m.rows.length);
      if (control.shouldStop?.()) throw new Cancelled();
    }
    ech.insert(m.rows[i].cols, m.rows[i].vals);
  }
  return { rank: ech.rank, smallestPivot: ech.smallestPivot, largestDropped: ech.largestDropped };
}
