import { simplexIds } from '../complex/SimplicialComplex';
import type { Sheaf } from '../model/Sheaf';
import { CellRestriction } from './CellRestriction';
import type { Readings } from './Readings';

/** One assigned face pair σ ≤ τ and how far its readings disagree. */
export interface MismatchPair {
  /** σ and τ by original vertex ids. */
  face: number[];
  coface: number[];
  /** ‖F(σ ≤ τ) a(σ) − a(τ)‖ (Euclidean). */
  mismatch: number;
}

export interface ConsistencyRadius {
  /** Largest mismatch over the assigned pairs (Robinson 2017's consistency radius); 0 when no pair is assigned. */
  max: number;
  /** Root-mean-square mismatch over the same pairs. */
  rms: number;
  /** Number of face pairs σ < τ (any codimension) with both cells assigned. */
  pairs: number;
  /** The worst pairs, largest mismatch first. */
  worst: MismatchPair[];
}

/**
 * How far readings are from gluing: for every face pair σ < τ with a reading
 * on both cells (faces of any codimension, through the composite map), the
 * mismatch ‖F(σ ≤ τ)·a(σ) − a(τ)‖. Zero on every pair of a full assignment
 * means the readings are a global section (engine-notes, "Data on a
 * sheaf"; M. Robinson, Information Fusion 36 (2017) 208–224). Weights do
 * not enter: the radius is a property of the values.
 */
export function consistencyRadius(sheaf: Sheaf<unknown>, readings: Readings, options: { worst?: number } = {}): ConsistencyRadius {
  const keep = options.worst ?? 10;
  const cx = sheaf.complex;
  const R = new CellRestriction(sheaf);
  // entryOf[k][c]: the reading on cell c of degree k, or -1.
  const entryOf: (Int32Array | undefined)[] = cx.simplices.map(() => undefined);
  for (let i = 0; i < readings.cell.length; i++) {
    const k = readings.degree[i];
    entryOf[k] ??= new Int32Array(cx.simplices[k].size).fill(-1);
    entryOf[k]![readings.cell[i]] = i;
  }
  const cofaceEntry: number[] = [];
  const faceDeg: number[] = [];
  const faceCell: number[] = [];
  const mismatch: number[] = [];
  let sumSq = 0;
  let max = 0;
  const verts: number[] = [];
  for (let i = 0; i < readings.cell.length; i++) {
    const k = readings.degree[i];
    if (k === 0) continue;
    const t = readings.cell[i];
    const tv = R.vertices(k, t);
    const a = readings.value.subarray(readings.offset[i], readings.offset[i + 1]);
    for (let mask = 1; mask < (1 << (k + 1)) - 1; mask++) {
      verts.length = 0;
      for (let b = 0; b <= k; b++) if (mask & (1 << b)) verts.push(tv[b]);
      const j = verts.length - 1;
      const lookup = entryOf[j];
      if (!lookup) continue;
      const s = R.find(verts);
      const e = s < 0 ? -1 : lookup[s];
      if (e < 0) continue;
      const image = R.apply(verts, k, t, readings.value.subarray(readings.offset[e], readings.offset[e + 1]));
      let sq = 0;
      for (let q = 0; q < a.length; q++) sq += (image[q] - a[q]) ** 2;
      const m = Math.sqrt(sq);
      sumSq += sq;
      if (m > max) max = m;
      cofaceEntry.push(i);
      faceDeg.push(j);
      faceCell.push(s);
      mismatch.push(m);
    }
  }
  const pairs = mismatch.length;
  const order = Array.from({ length: pairs }, (_, p) => p).sort((p, q) => mismatch[q] - mismatch[p] || p - q);
  const worst = order.slice(0, keep).map((p) => ({
    face: simplexIds(cx, faceDeg[p], faceCell[p]),
    coface: simplexIds(cx, readings.degree[cofaceEntry[p]], readings.cell[cofaceEntry[p]]),
    mismatch: mismatch[p],
  }));
  return { max, rms: pairs ? Math.sqrt(sumSq / pairs) : 0, pairs, worst };
}
