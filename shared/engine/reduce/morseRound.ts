import { cochainDims, transposeIndex, type BasedComplex, type Coboundary } from '../based/BasedComplex';
import type { Mat } from '../based/Mat';
import { liftCoboundary } from './liftCoboundary';
import { CRITICAL, matchCells, type MatchOptions, type Matching } from './matchCells';
import type { MorseEntries } from './MorseEntries';
import { replayCoboundary } from './replayCoboundary';
import type { Round } from './Round';

export type RoundOptions = MatchOptions;

/** Lifting carries m columns through every pair; beyond this many, replaying the fill is cheaper. */
const LIFT_COLUMNS = 48;
const LIFT_ENTRIES = 40_000_000;

/**
 * One round of sheaf-compatible Morse reduction: an acyclic matching, then
 * the Morse complex on its critical cells, degree by degree either by
 * lifting the critical cochains (few critical cells) or by replaying the
 * eliminations (many). Both give the same coboundary, the one sequential
 * elimination of the matched pairs produces.
 */
export function morseRound<E>(X: BasedComplex<E>, options: RoundOptions): Round<E> {
  const matching = matchCells(X, options);
  const degrees = X.dims.length;
  const entries: MorseEntries<E>[] = [];
  const coords = cochainDims(X);
  for (let k = 0; k + 1 < degrees; k++) {
    const m = criticalDimension(X, matching, k);
    const lift = m <= LIFT_COLUMNS && m * coords[k] <= LIFT_ENTRIES;
    entries.push(lift ? liftCoboundary(X, matching, k, options.pivotRatio) : replayCoboundary(X, matching, k, options.pivotRatio));
  }
  return buildRound(X, matching, entries);
}

function criticalDimension(X: BasedComplex<unknown>, m: Matching, k: number): number {
  let n = 0;
  const base = m.index.offset[k];
  const d = X.dims[k];
  for (let c = 0; c < d.length; c++) if (m.state[base + c] === CRITICAL) n += d[c];
  return n;
}

function buildRound<E>(X: BasedComplex<E>, m: Matching, entries: MorseEntries<E>[]): Round<E> {
  const degrees = X.dims.length;
  const { offset } = m.index;
  const critical: Int32Array[] = [];
  const newIndex = new Int32Array(m.index.total).fill(-1);
  for (let k = 0; k < degrees; k++) {
    const list: number[] = [];
    for (let c = 0; c < X.dims[k].length; c++) {
      if (m.state[offset[k] + c] === CRITICAL) {
        newIndex[offset[k] + c] = list.length;
        list.push(c);
      }
    }
    critical.push(Int32Array.from(list));
  }
  const dims = critical.map((list, k) => Int32Array.from(list, (c) => X.dims[k][c]));
  const blocks: Mat<E>[] = [];
  const cob: Coboundary[] = entries.map((ent, k) => {
    const nRows = critical[k + 1].length;
    const rowPtr = new Int32Array(nRows + 1);
    for (const g of ent.rows) rowPtr[newIndex[g] + 1]++;
    for (let r = 0; r < nRows; r++) rowPtr[r + 1] += rowPtr[r];
    const fill = rowPtr.slice(0, nRows);
    const col = new Int32Array(ent.rows.length);
    const block = new Int32Array(ent.rows.length);
    ent.rows.forEach((g, i) => {
      const at = fill[newIndex[g]]++;
      col[at] = newIndex[ent.cols[i]];
      block[at] = blocks.length;
      blocks.push(ent.mats[i]);
    });
    const { colPtr, colEntry } = transposeIndex(rowPtr, col, critical[k].length);
    return { rowPtr, col, sign: new Int8Array(col.length).fill(1), block, colPtr, colEntry };
  });
  return {
    input: X,
    output: { field: X.field, dims, cob, blocks },
    pairSigma: m.pairSigma,
    pairTau: m.pairTau,
    pairKind: m.pairKind,
    critical,
    smallestPivot: m.smallestPivot,
    pairs: m.pairs,
  };
}
