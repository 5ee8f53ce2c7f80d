import type { BasedComplex } from '../based/BasedComplex';
import { invert, maxAbs, type Inverse } from '../based/Mat';
import { checkpoint, type Control } from './Cancelled';
import { CellIndex } from './CellIndex';

export const ALIVE = 0;
export const CRITICAL = 1;
export const GONE = 2;
/** Queue tags: a cell that lost a face (coreduction candidate) or a coface (reduction candidate). */
const LOST_FACE = 0;
const LOST_COFACE = 1;
/**
 * The free counts of a cell that has left the free cells: far above any
 * count, so decrements from its neighbours never make it look movable and
 * the hot loops need not read its state.
 */
const NOT_FREE = 1 << 30;

export interface MatchOptions {
  /**
   * Real field only: a block pairs when partial pivoting meets no pivot below
   * this fraction of the largest entry around the two cells.
   */
  pivotRatio: number;
  control?: Control;
}

/**
 * The order in which a round made its moves, so that the Morse coboundary
 * can be computed afterwards exactly as sequential elimination would:
 * `eventCell[i]` is a global cell made critical when `eventPair[i] < 0`,
 * else `eventPair[i]` is a pair index in degree `eventCell[i]`.
 */
export interface Matching {
  readonly index: CellIndex;
  /** Final state of every cell: CRITICAL or GONE. */
  readonly state: Uint8Array;
  readonly pairSigma: Int32Array[];
  readonly pairTau: Int32Array[];
  readonly pairKind: Uint8Array[];
  /** Entry of cob[k] holding the matched block σ → τ. */
  readonly pairEntry: Int32Array[];
  readonly eventCell: Int32Array;
  readonly eventPair: Int32Array;
  readonly smallestPivot: number;
  readonly pairs: number;
  /** Real field: per degree k, the largest entry of δ^k, the scale its zeros are judged against. */
  readonly scale: Float64Array;
}

/**
 * A sheaf-compatible acyclic matching, found greedily from a queue in the
 * manner of the coreduction algorithm (Mrozek–Batko 2009): a cell whose
 * only free face is σ pairs with it, a cell whose only free coface is τ
 * pairs with it, a face-less cell pairs with a coface whose only free face
 * it is, and when nothing moves the lowest free cell becomes critical.
 * A pair is accepted only where its block is invertible (well conditioned in
 * the real field), which keeps the matching compatible with the sheaf
 * (Curry–Ghrist–Nanda 2016).
 *
 * Every pair is made when one side of its elimination update (the other
 * faces of τ, or the other cofaces of σ) holds critical cells only. Hence
 * blocks between free cells never change, and the decisions need only the
 * input's blocks and counts of free neighbours: no arithmetic happens here.
 */
export function matchCells<E>(X: BasedComplex<E>, options: MatchOptions): Matching {
  const F = X.field;
  const real = F.kind === 'real';
  const degrees = X.dims.length;
  const index = new CellIndex(X);
  const { offset, total, degreeOf, coCell } = index;

  const state = new Uint8Array(total);
  const freeFaces = new Int32Array(total);
  const freeCofaces = new Int32Array(total);
  // Real field: the largest entry in each cell's coboundary column and row, the scale pivots are judged against.
  const colScale = real ? new Float64Array(total) : undefined;
  const rowScale = real ? new Float64Array(total) : undefined;
  const scale = new Float64Array(Math.max(degrees - 1, 0));
  for (let k = 0; k < degrees; k++) {
    const d = X.dims[k];
    for (let c = 0; c < d.length; c++) if (d[c] === 0) state[offset[k] + c] = GONE;
  }
  // Counts (and real scales) by rows and then by columns: two sequential
  // sweeps instead of scattered increments per entry.
  const blockMax = colScale ? Float64Array.from(X.blocks, (M) => maxAbs(F, M)) : undefined;
  for (let k = 0; k + 1 < degrees; k++) {
    const { rowPtr, colPtr, colEntry, block } = X.cob[k];
    const up = offset[k + 1];
    for (let r = 0; r + 1 < rowPtr.length; r++) {
      let n = 0;
      let most = 0;
      for (let e = rowPtr[r]; e < rowPtr[r + 1]; e++) {
        const b = block[e];
        if (b < 0) continue;
        n++;
        if (blockMax && blockMax[b] > most) most = blockMax[b];
      }
      freeFaces[up + r] = n;
      if (rowScale) {
        rowScale[up + r] = most;
        if (most > scale[k]) scale[k] = most;
      }
    }
    const cells = coCell[k];
    const low = offset[k];
    for (let c = 0; c + 1 < colPtr.length; c++) {
      let n = 0;
      let most = 0;
      for (let p = colPtr[c]; p < colPtr[c + 1]; p++) {
        if (cells[p] < 0) continue;
        n++;
        if (blockMax) {
          const s = blockMax[block[colEntry[p]]];
          if (s > most) most = s;
        }
      }
      freeCofaces[low + c] = n;
      if (colScale) colScale[low + c] = most;
    }
  }

  for (let g = 0; g < total; g++) {
    if (state[g] !== ALIVE) {
      freeFaces[g] = NOT_FREE;
      freeCofaces[g] = NOT_FREE;
    }
  }

  // Indexed by block id: the simplicial case shares a handful of blocks, a split complex has one per entry.
  const inverses: (Inverse<E> | null | undefined)[] = new Array(X.blocks.length);
  const inverseOf = (blockId: number): Inverse<E> | null => {
    let inv = inverses[blockId];
    if (inv === undefined) {
      inv = invert(F, X.blocks[blockId], real ? options.pivotRatio : 0) ?? null;
      inverses[blockId] = inv;
    }
    return inv;
  };
  const acceptable = (k: number, blockId: number, s: number, t: number): Inverse<E> | null => {
    const inv = inverseOf(blockId);
    if (!inv || !colScale || !rowScale) return inv;
    const floor = Math.max(options.pivotRatio * Math.max(colScale[s], rowScale[t]), F.tolerance * scale[k]);
    return inv.minPivot >= floor ? inv : null;
  };

  // FIFO of tagged cells; duplicates are allowed and skipped when stale.
  let queue = new Int32Array(1024);
  let head = 0;
  let tail = 0;
  const push = (g: number, tag: number) => {
    if (tail === queue.length) {
      const live = tail - head;
      const next = new Int32Array(live * 2 > queue.length ? queue.length * 2 : queue.length);
      next.set(queue.subarray(head, tail));
      queue = next;
      head = 0;
      tail = live;
    }
    queue[tail++] = g * 2 + tag;
  };

  // A degree has at most as many pairs as it has cells; the log at most one event per cell.
  const pairCap = (k: number) => (k + 1 < degrees ? Math.min(X.dims[k].length, X.dims[k + 1].length) : 0);
  const pairSigma = Array.from({ length: degrees }, (_, k) => new Int32Array(pairCap(k)));
  const pairTau = Array.from({ length: degrees }, (_, k) => new Int32Array(pairCap(k)));
  const pairKind = Array.from({ length: degrees }, (_, k) => new Uint8Array(pairCap(k)));
  const pairEntry = Array.from({ length: degrees }, (_, k) => new Int32Array(pairCap(k)));
  const pairCount = new Int32Array(degrees);
  const eventCell = new Int32Array(total);
  const eventPair = new Int32Array(total);
  let events = 0;
  let smallestPivot = Infinity;
  let pairs = 0;

  /** The one free face of τ (degree k+1) with a nonzero block, as an entry of cob[k]. */
  const freeFaceEntry = (k1: number, t: number): number => {
    const cob = X.cob[k1 - 1];
    const base = offset[k1 - 1];
    for (let e = cob.rowPtr[t]; e < cob.rowPtr[t + 1]; e++) {
      if (cob.block[e] >= 0 && state[base + cob.col[e]] === ALIVE) return e;
    }
    return -1;
  };
  /** The one free coface of σ (degree k) with a nonzero block, as a position in cob[k]'s transpose. */
  const freeCofacePosition = (k: number, s: number): number => {
    const ptr = X.cob[k].colPtr;
    const cells = coCell[k];
    for (let p = ptr[s]; p < ptr[s + 1]; p++) {
      const w = cells[p];
      if (w >= 0 && state[w] === ALIVE) return p;
    }
    return -1;
  };

  /** Pair entry e of cob[k] (σ in degree k, τ the global cell t in degree k+1) if its block allows. */
  const tryPair = (k: number, e: number, t: number, kind: number): boolean => {
    const cob = X.cob[k];
    const s = offset[k] + cob.col[e];
    const inv = acceptable(k, cob.block[e], s, t);
    if (!inv) return false;
    const i = pairCount[k]++;
    eventCell[events] = k;
    eventPair[events++] = i;
    pairEntry[k][i] = e;
    pairSigma[k][i] = s - offset[k];
    pairTau[k][i] = t - offset[k + 1];
    pairKind[k][i] = kind;
    remove(s, k);
    remove(t, k + 1);
    if (inv.minPivot < smallestPivot) smallestPivot = inv.minPivot;
    pairs++;
    return true;
  };

  /** Update the free counts of g's free neighbours once g stops being free. */
  const release = (g: number, k: number) => {
    const c = g - offset[k];
    if (k > 0) {
      const cob = X.cob[k - 1];
      const base = offset[k - 1];
      for (let e = cob.rowPtr[c]; e < cob.rowPtr[c + 1]; e++) {
        // Only a cell left with one free coface has a new move (a reduction pair).
        // A cell no longer free holds a count far above 1, so no state check is needed.
        if (cob.block[e] >= 0 && --freeCofaces[base + cob.col[e]] === 1) push(base + cob.col[e], LOST_COFACE);
      }
    }
    if (k + 1 < degrees) {
      const ptr = X.cob[k].colPtr;
      const cells = coCell[k];
      for (let p = ptr[c]; p < ptr[c + 1]; p++) {
        const w = cells[p];
        // Moves open up at one free face (a coreduction pair) or none (defer, or a coface pair).
        if (w >= 0 && --freeFaces[w] <= 1) push(w, LOST_FACE);
      }
    }
  };

  const remove = (g: number, k: number) => {
    state[g] = GONE;
    freeFaces[g] = NOT_FREE;
    freeCofaces[g] = NOT_FREE;
    release(g, k);
  };

  let criticalCount = 0;
  const makeCritical = (g: number, k: number) => {
    criticalCount++;
    state[g] = CRITICAL;
    freeFaces[g] = NOT_FREE;
    freeCofaces[g] = NOT_FREE;
    eventCell[events] = g;
    eventPair[events++] = -1;
    release(g, k);
  };

  /** Try every pairing open to g; true when g left the free cells. */
  const tryCell = (g: number, tag: number, force: boolean): boolean => {
    const k = degreeOf[g];
    const c = g - offset[k];
    if (tag === LOST_FACE || force) {
      if (k > 0 && freeFaces[g] === 1) {
        const e = freeFaceEntry(k, c);
        if (e >= 0 && tryPair(k - 1, e, g, 0)) return true;
      }
      if (freeFaces[g] === 0 && k + 1 < degrees) {
        // g is free-face-less: a coface whose only free face is g pairs with it.
        const cob = X.cob[k];
        const cells = coCell[k];
        for (let p = cob.colPtr[c]; p < cob.colPtr[c + 1]; p++) {
          const w = cells[p];
          if (w >= 0 && state[w] === ALIVE && freeFaces[w] === 1 && tryPair(k, cob.colEntry[p], w, 0)) return true;
        }
      }
    }
    if (k + 1 < degrees && freeCofaces[g] === 1) {
      const p = freeCofacePosition(k, c);
      if (p >= 0 && tryPair(k, X.cob[k].colEntry[p], coCell[k][p], 1)) return true;
    }
    if (force) {
      makeCritical(g, k);
      return true;
    }
    if (tag === LOST_FACE && freeFaces[g] === 0) {
      // A face-less cell may still pair once its cofaces lose their other
      // faces; making it critical only when nothing else can move keeps the
      // first round close to a minimal matching (one vertex, 2 edges, 1 face on a torus).
      deferred.push(g);
    }
    return false;
  };
  const deferred: number[] = [];
  let deferredHead = 0;

  let next = 0;
  let processed = 0;
  for (;;) {
    while (head < tail) {
      const item = queue[head++];
      const g = item >> 1;
      if (state[g] !== ALIVE) continue;
      tryCell(g, item & 1, false);
      if ((++processed & 0xffff) === 0) checkpoint(options.control, 'reduce', (2 * pairs + criticalCount) / total);
    }
    if (deferredHead < deferred.length) {
      const g = deferred[deferredHead++];
      if (state[g] === ALIVE) tryCell(g, LOST_FACE, true);
      continue;
    }
    while (next < total && state[next] !== ALIVE) next++;
    if (next === total) break;
    tryCell(next, LOST_FACE, true);
  }

  return {
    index,
    state,
    pairSigma: pairSigma.map((a, k) => a.subarray(0, pairCount[k])),
    pairTau: pairTau.map((a, k) => a.subarray(0, pairCount[k])),
    pairKind: pairKind.map((a, k) => a.subarray(0, pairCount[k])),
    pairEntry: pairEntry.map((a, k) => a.subarray(0, pairCount[k])),
    eventCell: eventCell.subarray(0, events),
    eventPair: eventPair.subarray(0, events),
    smallestPivot,
    pairs,
    scale,
  };
}
