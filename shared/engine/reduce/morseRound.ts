import { transposeIndex, type BasedComplex, type Coboundary } from '../based/BasedComplex';
import { copyMat, invert, isZeroMat, maxAbs, mulMat, scalarMat, subInPlace, type Inverse, type Mat } from '../based/Mat';
import { Overlay } from './Overlay';
import { checkpoint, type Control } from './Cancelled';
import type { Round } from './Round';

const ALIVE = 0;
const CRITICAL = 1;
const GONE = 2;
/** Queue tags: a cell that lost a face (coreduction candidate) or a coface (reduction candidate). */
const LOST_FACE = 0;
const LOST_COFACE = 1;

export interface RoundOptions {
  /**
   * Real field only: a block pairs when partial pivoting meets no pivot below
   * this fraction of the largest entry around the two cells.
   */
  pivotRatio: number;
  control?: Control;
}

/**
 * One round of sheaf-compatible Morse reduction.
 *
 * Cells are matched greedily from a queue in the manner of the coreduction
 * algorithm (Mrozek–Batko 2009): a cell whose only free face is σ pairs with
 * it (no fill-in among free cells), a cell whose only free coface is τ pairs
 * with it, and when nothing pairs the lowest free cell becomes critical.
 * A pair is accepted only where its block is invertible (well conditioned in
 * the real field), which keeps the matching compatible with the sheaf
 * (Curry–Ghrist–Nanda 2016).
 *
 * Each pair is eliminated at once, D ← D − c·B⁻¹·b. Because a pair is only
 * made when b or c consists of critical cells alone, every update lands on an
 * entry with a critical end: blocks between free cells stay the input's own,
 * and the updated entries live in a small overlay keyed by critical cell.
 * When every cell is paired or critical, the overlay is the Morse complex.
 */
export function morseRound<E>(X: BasedComplex<E>, options: RoundOptions): Round<E> {
  const F = X.field;
  const real = F.kind === 'real';
  const degrees = X.dims.length;
  const offset = new Int32Array(degrees + 1);
  for (let k = 0; k < degrees; k++) offset[k + 1] = offset[k] + X.dims[k].length;
  const total = offset[degrees];
  const degreeOf = new Uint8Array(total);
  for (let k = 0; k < degrees; k++) degreeOf.fill(k, offset[k], offset[k + 1]);
  const rowOf = X.cob.map((c) => expandRows(c));

  const state = new Uint8Array(total);
  const freeFaces = new Int32Array(total);
  const freeCofaces = new Int32Array(total);
  // Real field: the largest entry touching each cell, the scale pivots are judged against.
  const cellScale = real ? new Float64Array(total) : undefined;
  let globalScale = 0;
  for (let k = 0; k < degrees; k++) {
    const d = X.dims[k];
    for (let c = 0; c < d.length; c++) if (d[c] === 0) state[offset[k] + c] = GONE;
  }
  for (let k = 0; k + 1 < degrees; k++) {
    const cob = X.cob[k];
    const rows = rowOf[k];
    for (let e = 0; e < cob.block.length; e++) {
      const b = cob.block[e];
      if (b < 0) continue;
      const r = offset[k + 1] + rows[e];
      const c = offset[k] + cob.col[e];
      freeFaces[r]++;
      freeCofaces[c]++;
      if (cellScale) {
        const s = maxAbs(F, X.blocks[b]);
        if (s > cellScale[r]) cellScale[r] = s;
        if (s > cellScale[c]) cellScale[c] = s;
        if (s > globalScale) globalScale = s;
      }
    }
  }

  const overlay = new Overlay<E>(total);
  // Scratch lists for one elimination step, reused to keep the hot loop allocation-free.
  const faceCells: number[] = [];
  const faceMats: Mat<E>[] = [];
  const cofaceCells: number[] = [];
  const cofaceMats: Mat<E>[] = [];
  const faceSigns: number[] = [];
  const cofaceSigns: number[] = [];

  const inverses = new Map<number, Inverse<E> | null>();
  const inverseOf = (blockId: number): Inverse<E> | null => {
    let inv = inverses.get(blockId);
    if (inv === undefined) {
      inv = invert(F, X.blocks[blockId], real ? options.pivotRatio : 0) ?? null;
      inverses.set(blockId, inv);
    }
    return inv;
  };
  const acceptable = (blockId: number, s: number, t: number): Inverse<E> | null => {
    const inv = inverseOf(blockId);
    if (!inv || !cellScale) return inv;
    const floor = Math.max(options.pivotRatio * Math.max(cellScale[s], cellScale[t]), F.tolerance * globalScale);
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

  const pairSigma: number[][] = Array.from({ length: degrees }, () => []);
  const pairTau: number[][] = Array.from({ length: degrees }, () => []);
  const pairKind: number[][] = Array.from({ length: degrees }, () => []);
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
  const freeCofaceEntry = (k: number, s: number): number => {
    const cob = X.cob[k];
    const base = offset[k + 1];
    const rows = rowOf[k];
    for (let p = cob.colPtr[s]; p < cob.colPtr[s + 1]; p++) {
      const e = cob.colEntry[p];
      if (cob.block[e] >= 0 && state[base + rows[e]] === ALIVE) return e;
    }
    return -1;
  };

  /** Pair entry e of cob[k] (σ in degree k, τ in degree k+1) if its block allows. */
  const tryPair = (k: number, e: number, kind: number): boolean => {
    const cob = X.cob[k];
    const s = offset[k] + cob.col[e];
    const t = offset[k + 1] + rowOf[k][e];
    const inv = acceptable(cob.block[e], s, t);
    if (!inv) return false;
    eliminate(k, s, t, inv, cob.sign[e]);
    pairSigma[k].push(s - offset[k]);
    pairTau[k].push(t - offset[k + 1]);
    pairKind[k].push(kind);
    if (inv.minPivot < smallestPivot) smallestPivot = inv.minPivot;
    pairs++;
    return true;
  };

  /**
   * D ← D − c·B⁻¹·b over the faces α ≠ σ of τ and the cofaces ω ≠ τ of σ.
   * The pair rule guarantees one side holds critical cells only, so free
   * neighbours join a side only when the other side is critical.
   */
  const eliminate = (k: number, s: number, t: number, inv: Inverse<E>, sign: number) => {
    const criticalFaces = overlay.faceTotal(t);
    const criticalCofaces = overlay.cofaceTotal(s);
    if (criticalFaces === 0 && criticalCofaces === 0) {
      // The common case: no critical neighbour, so nothing to update.
      remove(s);
      remove(t);
      return;
    }
    let nf = overlay.faces(t, faceCells, faceMats);
    let nc = overlay.cofaces(s, cofaceCells, cofaceMats);
    for (let i = 0; i < nf; i++) faceSigns[i] = 1;
    for (let j = 0; j < nc; j++) cofaceSigns[j] = 1;
    if (nf > 0) {
      const cob = X.cob[k];
      const base = offset[k + 1];
      const rows = rowOf[k];
      const c0 = s - offset[k];
      for (let p = cob.colPtr[c0]; p < cob.colPtr[c0 + 1]; p++) {
        const e = cob.colEntry[p];
        const b = cob.block[e];
        const w = base + rows[e];
        if (b >= 0 && w !== t && state[w] === ALIVE) {
          cofaceCells[nc] = w;
          cofaceSigns[nc] = cob.sign[e];
          cofaceMats[nc++] = X.blocks[b];
        }
      }
    }
    if (criticalCofaces > 0) {
      const cob = X.cob[k];
      const base = offset[k];
      const r0 = t - offset[k + 1];
      for (let e = cob.rowPtr[r0]; e < cob.rowPtr[r0 + 1]; e++) {
        const b = cob.block[e];
        const a = base + cob.col[e];
        if (b >= 0 && a !== s && state[a] === ALIVE) {
          faceCells[nf] = a;
          faceSigns[nf] = cob.sign[e];
          faceMats[nf++] = X.blocks[b];
        }
      }
    }
    if (nf > 0 && nc > 0) {
      const minusOne = F.neg(F.one);
      const Binv = inv.inv;
      for (let i = 0; i < nf; i++) {
        const a = faceCells[i];
        const bm = faceMats[i];
        const f = sign * faceSigns[i] < 0 ? minusOne : F.one;
        // t = ±B⁻¹·b, kept as a scalar when both factors are scalar blocks.
        const tScalar = Binv.scalar !== undefined && bm.scalar !== undefined ? F.mul(f, F.mul(Binv.scalar, bm.scalar)) : undefined;
        const tb = tScalar === undefined ? mulMat(F, Binv, bm, f) : undefined;
        for (let j = 0; j < nc; j++) {
          const w = cofaceCells[j];
          const c = cofaceMats[j];
          const cur = overlay.find(a, w);
          if (tScalar !== undefined && c.scalar !== undefined && (cur === undefined || cur.scalar !== undefined)) {
            // Scalar blocks (constant and locally constant sheaves): no temporaries.
            let x = F.mul(c.scalar, tScalar);
            if (cofaceSigns[j] < 0) x = F.neg(x);
            if (cur) cur.scalar = F.sub(cur.scalar as E, x);
            else overlay.add(a, w, scalarMat(c.rows, F.neg(x)));
            continue;
          }
          const x = mulMat(F, c, tb ?? scalarMat(bm.cols, tScalar as E), cofaceSigns[j] < 0 ? minusOne : F.one);
          if (cur) subInPlace(F, cur, x);
          else overlay.add(a, w, copyMat(F, x, minusOne));
        }
      }
    }
    remove(s);
    remove(t);
  };

  const forEachFreeFace = (k1: number, t: number, f: (g: number, m: Mat<E>) => void) => {
    const cob = X.cob[k1 - 1];
    const base = offset[k1 - 1];
    for (let e = cob.rowPtr[t]; e < cob.rowPtr[t + 1]; e++) {
      const b = cob.block[e];
      const g = base + cob.col[e];
      if (b >= 0 && state[g] === ALIVE) f(g, signed(b, cob.sign[e]));
    }
  };
  const forEachFreeCoface = (k: number, s: number, f: (g: number, m: Mat<E>) => void) => {
    const cob = X.cob[k];
    const base = offset[k + 1];
    const rows = rowOf[k];
    for (let p = cob.colPtr[s]; p < cob.colPtr[s + 1]; p++) {
      const e = cob.colEntry[p];
      const b = cob.block[e];
      const g = base + rows[e];
      if (b >= 0 && state[g] === ALIVE) f(g, signed(b, cob.sign[e]));
    }
  };
  const signed = (b: number, sign: number): Mat<E> =>
    sign > 0 ? X.blocks[b] : copyMat(F, X.blocks[b], F.neg(F.one));

  /** Update the free counts of g's free neighbours once g stops being free. */
  const release = (g: number) => {
    const k = degreeOf[g];
    const c = g - offset[k];
    if (k > 0) {
      const cob = X.cob[k - 1];
      const base = offset[k - 1];
      for (let e = cob.rowPtr[c]; e < cob.rowPtr[c + 1]; e++) {
        const a = base + cob.col[e];
        if (cob.block[e] >= 0 && state[a] === ALIVE) {
          // Only a cell left with one free coface has a new move (a reduction pair).
          if (--freeCofaces[a] === 1) push(a, LOST_COFACE);
        }
      }
    }
    if (k + 1 < degrees) {
      const cob = X.cob[k];
      const base = offset[k + 1];
      const rows = rowOf[k];
      for (let p = cob.colPtr[c]; p < cob.colPtr[c + 1]; p++) {
        const e = cob.colEntry[p];
        const w = base + rows[e];
        if (cob.block[e] >= 0 && state[w] === ALIVE) {
          // Moves open up at one free face (a coreduction pair) or none (defer, or a coface pair).
          if (--freeFaces[w] <= 1) push(w, LOST_FACE);
        }
      }
    }
  };

  const remove = (g: number) => {
    state[g] = GONE;
    release(g);
    overlay.removeCell(g);
  };

  let criticalCount = 0;
  const makeCritical = (g: number) => {
    criticalCount++;
    const k = degreeOf[g];
    const c = g - offset[k];
    state[g] = CRITICAL;
    if (k > 0) {
      forEachFreeFace(k, c, (a, m) => overlay.add(a, g, copyMat(F, m)));
    }
    if (k + 1 < degrees) {
      forEachFreeCoface(k, c, (w, m) => overlay.add(g, w, copyMat(F, m)));
    }
    release(g);
  };

  /** Try every pairing open to g; true when g left the free cells. */
  const tryCell = (g: number, tag: number, force: boolean): boolean => {
    const k = degreeOf[g];
    const c = g - offset[k];
    if (tag === LOST_FACE || force) {
      if (k > 0 && freeFaces[g] === 1) {
        const e = freeFaceEntry(k, c);
        if (e >= 0 && tryPair(k - 1, e, 0)) return true;
      }
      if (freeFaces[g] === 0 && k + 1 < degrees) {
        // g is free-face-less: a coface whose only free face is g pairs with it.
        const cob = X.cob[k];
        const rows = rowOf[k];
        for (let p = cob.colPtr[c]; p < cob.colPtr[c + 1]; p++) {
          const e = cob.colEntry[p];
          const w = offset[k + 1] + rows[e];
          if (cob.block[e] >= 0 && state[w] === ALIVE && freeFaces[w] === 1 && tryPair(k, e, 0)) return true;
        }
      }
    }
    if (k + 1 < degrees && freeCofaces[g] === 1) {
      const e = freeCofaceEntry(k, c);
      if (e >= 0 && tryPair(k, e, 1)) return true;
    }
    if (force) {
      makeCritical(g);
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

  return buildRound(X, offset, state, overlay, { pairSigma, pairTau, pairKind, smallestPivot, pairs, globalScale });
}

function expandRows(cob: Coboundary): Int32Array {
  const n = cob.rowPtr.length - 1;
  const rows = new Int32Array(cob.rowPtr[n]);
  for (let r = 0; r < n; r++) rows.fill(r, cob.rowPtr[r], cob.rowPtr[r + 1]);
  return rows;
}

function buildRound<E>(
  X: BasedComplex<E>,
  offset: Int32Array,
  state: Uint8Array,
  overlay: Overlay<E>,
  made: {
    pairSigma: number[][];
    pairTau: number[][];
    pairKind: number[][];
    smallestPivot: number;
    pairs: number;
    globalScale: number;
  },
): Round<E> {
  const F = X.field;
  const degrees = X.dims.length;
  const critical: Int32Array[] = [];
  const newIndex = new Int32Array(offset[degrees]).fill(-1);
  for (let k = 0; k < degrees; k++) {
    const list: number[] = [];
    for (let c = 0; c < X.dims[k].length; c++) {
      if (state[offset[k] + c] === CRITICAL) {
        newIndex[offset[k] + c] = list.length;
        list.push(c);
      }
    }
    critical.push(Int32Array.from(list));
  }
  const dims = critical.map((list, k) => Int32Array.from(list, (c) => X.dims[k][c]));
  const blocks: Mat<E>[] = [];
  const cob: Coboundary[] = [];
  const cells: number[] = [];
  const mats: Mat<E>[] = [];
  for (let k = 0; k + 1 < degrees; k++) {
    const rows = critical[k + 1];
    const rowPtr = new Int32Array(rows.length + 1);
    const col: number[] = [];
    const block: number[] = [];
    for (let r = 0; r < rows.length; r++) {
      const n = overlay.faces(offset[k + 1] + rows[r], cells, mats);
      for (let i = 0; i < n; i++) {
        const m = mats[i];
        if (isZeroMat(F, m, made.globalScale)) continue;
        col.push(newIndex[cells[i]]);
        block.push(blocks.length);
        blocks.push(m);
      }
      rowPtr[r + 1] = col.length;
    }
    const colArr = Int32Array.from(col);
    const { colPtr, colEntry } = transposeIndex(rowPtr, colArr, critical[k].length);
    cob.push({ rowPtr, col: colArr, sign: new Int8Array(col.length).fill(1), block: Int32Array.from(block), colPtr, colEntry });
  }
  const output: BasedComplex<E> = { field: F, dims, cob, blocks };
  return {
    input: X,
    output,
    pairSigma: made.pairSigma.map((a) => Int32Array.from(a)),
    pairTau: made.pairTau.map((a) => Int32Array.from(a)),
    pairKind: made.pairKind.map((a) => Uint8Array.from(a)),
    critical,
    smallestPivot: made.smallestPivot,
    pairs: made.pairs,
  };
}
