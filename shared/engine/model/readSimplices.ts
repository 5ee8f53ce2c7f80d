import { buildComplex, type SimplicialComplex } from '../complex/SimplicialComplex';
import type { ProblemList } from './Problem';
import type { ScannedSimplices } from './scanSimplices';

/**
 * Validate the `simplices` list and build its closure. Vertex ids may be any
 * non-negative safe integers; they are renumbered densely in increasing order.
 */
export function readSimplices(raw: unknown, problems: ProblemList): SimplicialComplex | undefined {
  if (!Array.isArray(raw)) {
    problems.add('simplices', 'must be a list of simplices, each a list of vertex ids');
    return undefined;
  }
  let total = 0;
  let top = -1;
  let maxId = 0;
  const counts: number[] = [];
  for (let i = 0; i < raw.length; i++) {
    const s = raw[i];
    if (!Array.isArray(s) || s.length === 0) {
      problems.add(`simplices[${i}]`, 'must be a non-empty list of vertex ids');
      if (problems.full) break;
      continue;
    }
    const len = s.length;
    for (let j = 0; j < len; j++) {
      const v = s[j];
      if (typeof v !== 'number' || !Number.isSafeInteger(v) || v < 0) {
        problems.add(`simplices[${i}]`, `vertex ${JSON.stringify(v)} is not a non-negative integer id`);
        break;
      }
      if (v > maxId) maxId = v;
      for (let q = 0; q < j; q++) {
        if (s[q] === v) {
          problems.add(`simplices[${i}]`, `vertex ${v} appears twice in [${s.join(',')}]`);
          break;
        }
      }
    }
    if (problems.full) break;
    total += len;
    if (len - 1 > top) {
      for (let k = top + 1; k < len; k++) counts.push(0);
      top = len - 1;
    }
    counts[len - 1]++;
  }
  if (problems.any) return undefined;

  const vertexIds = collectVertexIds(raw as number[][], total, maxId);
  const dense = denseIndexer(vertexIds);
  const listed = counts.map((c, k) => new Int32Array(c * (k + 1)));
  const fill = new Array<number>(top + 1).fill(0);
  for (let i = 0; i < raw.length; i++) {
    const s = raw[i] as number[];
    const k = s.length - 1;
    const out = listed[k];
    const base = fill[k];
    for (let j = 0; j <= k; j++) out[base + j] = dense(s[j]);
    if (k > 0) sortSmall(out, base, k + 1);
    fill[k] += k + 1;
  }
  return buildComplex(listed, vertexIds);
}

/**
 * As {@link readSimplices}, for a list already scanned from the text into
 * typed arrays: the ids are known to be non-negative integers, so only the
 * repeated-vertex rule is left to check. Same messages as the ordinary path.
 */
export function readScannedSimplices(scanned: ScannedSimplices, problems: ProblemList): SimplicialComplex | undefined {
  const { ids, ends, count } = scanned;
  let top = -1;
  let maxId = 0;
  const counts: number[] = [];
  let from = 0;
  for (let i = 0; i < count; i++) {
    const to = ends[i];
    const len = to - from;
    for (let j = from; j < to; j++) {
      const v = ids[j];
      if (v > maxId) maxId = v;
      for (let q = from; q < j; q++) {
        if (ids[q] === v) {
          problems.add(`simplices[${i}]`, `vertex ${v} appears twice in [${Array.from(ids.subarray(from, to)).join(',')}]`);
          break;
        }
      }
    }
    if (problems.full) break;
    if (len - 1 > top) {
      for (let k = top + 1; k < len; k++) counts.push(0);
      top = len - 1;
    }
    counts[len - 1]++;
    from = to;
  }
  if (problems.any) return undefined;
  const { vertexIds, rank } = collectScannedIds(ids, maxId);
  const dense = rank ? (id: number) => rank[id] : denseIndexer(vertexIds);
  if (top === 2 && counts[0] === 0 && counts[1] === 0) {
    // Triangles only (the usual large surface): renumber in place, no second copy.
    const out = ids;
    if (rank) for (let j = 0; j < out.length; j++) out[j] = rank[out[j]];
    else for (let j = 0; j < out.length; j++) out[j] = dense(out[j]);
    for (let off = 0; off < out.length; off += 3) sortSmall(out, off, 3);
    return buildComplex([new Int32Array(0), new Int32Array(0), out], vertexIds);
  }
  const listed = counts.map((c, k) => new Int32Array(c * (k + 1)));
  const fill = new Array<number>(top + 1).fill(0);
  from = 0;
  for (let i = 0; i < count; i++) {
    const to = ends[i];
    const k = to - from - 1;
    const out = listed[k];
    const base = fill[k];
    for (let j = 0; j <= k; j++) out[base + j] = dense(ids[from + j]);
    if (k > 0) sortSmall(out, base, k + 1);
    fill[k] += k + 1;
    from = to;
  }
  return buildComplex(listed, vertexIds);
}

/**
 * The distinct ids, increasing, and, when ids are compact, the dense index
 * of every id as a table (the presence table turned into ranks in place).
 */
function collectScannedIds(ids: Int32Array, maxId: number): { vertexIds: Float64Array; rank?: Int32Array } {
  if (maxId <= 4 * ids.length + 1_000_000) {
    const rank = new Int32Array(maxId + 1);
    for (let j = 0; j < ids.length; j++) rank[ids[j]] = 1;
    let n = 0;
    for (let v = 0; v <= maxId; v++) if (rank[v]) n++;
    const vertexIds = new Float64Array(n);
    let w = 0;
    for (let v = 0; v <= maxId; v++) {
      if (rank[v]) {
        vertexIds[w] = v;
        rank[v] = w++;
      } else rank[v] = -1;
    }
    return { vertexIds, rank };
  }
  const all = Float64Array.from(ids).sort();
  let unique = 0;
  for (let i = 0; i < all.length; i++) if (i === 0 || all[i] !== all[i - 1]) all[unique++] = all[i];
  return { vertexIds: all.slice(0, unique) };
}

/** The distinct vertex ids, increasing; a presence table when ids are compact, else a sort. */
function collectVertexIds(raw: number[][], total: number, maxId: number): Float64Array {
  if (maxId <= 4 * total + 1_000_000) {
    const seen = new Uint8Array(maxId + 1);
    let n = 0;
    for (let i = 0; i < raw.length; i++) {
      const s = raw[i];
      for (let j = 0; j < s.length; j++) {
        if (seen[s[j]] === 0) {
          seen[s[j]] = 1;
          n++;
        }
      }
    }
    const ids = new Float64Array(n);
    let w = 0;
    for (let v = 0; v <= maxId; v++) if (seen[v]) ids[w++] = v;
    return ids;
  }
  const all = new Float64Array(total);
  let w = 0;
  for (const s of raw) for (const v of s) all[w++] = v;
  all.sort();
  let unique = 0;
  for (let i = 0; i < all.length; i++) if (i === 0 || all[i] !== all[i - 1]) all[unique++] = all[i];
  return all.slice(0, unique);
}

/** Dense index of an original vertex id (sorted ids), or -1 when absent. */
export function denseIndexer(sortedIds: Float64Array): (id: number) => number {
  const n = sortedIds.length;
  const max = n ? sortedIds[n - 1] : 0;
  if (max < 2 ** 31 && max <= 4 * n + 1_000_000) {
    // A direct table is a few MB at most and turns lookups into one read.
    const table = new Int32Array(max + 1).fill(-1);
    for (let i = 0; i < n; i++) table[sortedIds[i]] = i;
    return (id) => (id >= 0 && id <= max && Number.isInteger(id) ? table[id] : -1);
  }
  return (id) => {
    let lo = 0;
    let hi = n - 1;
    while (lo <= hi) {
      const mid = (lo + hi) >> 1;
      const v = sortedIds[mid];
      if (v === id) return mid;
      if (v < id) lo = mid + 1;
      else hi = mid - 1;
    }
    return -1;
  };
}

function sortSmall(a: Int32Array, off: number, len: number): void {
  for (let i = off + 1; i < off + len; i++) {
    const v = a[i];
    let j = i - 1;
    while (j >= off && a[j] > v) {
      a[j + 1] = a[j];
      j--;
    }
    a[j + 1] = v;
  }
}

/** A cell named by vertex ids in the file, resolved against the complex. */
export interface CellRef {
  k: number;
  index: number;
  /** Dense vertex indices, increasing. */
  dense: Int32Array;
}

/**
 * Resolve a cell written as a list of vertex ids (any order). Reports a
 * problem at `where` and returns undefined when it is not in the complex.
 */
export function resolveCell(
  complex: SimplicialComplex,
  dense: (id: number) => number,
  raw: unknown,
  problems: ProblemList,
  where: string | (() => string),
): CellRef | undefined {
  // Named only on failure: a large file resolves one cell per entry.
  const at = () => (typeof where === 'string' ? where : where());
  const name = () => `[${(raw as number[]).join(',')}]`;
  if (!Array.isArray(raw) || raw.length === 0 || !raw.every(isVertexId)) {
    problems.add(at(), `${JSON.stringify(raw)} is not a list of vertex ids`);
    return undefined;
  }
  const ids = raw as number[];
  const k = ids.length - 1;
  const d = new Int32Array(ids.length);
  for (let i = 0; i < ids.length; i++) {
    d[i] = dense(ids[i]);
    if (d[i] < 0) {
      problems.add(at(), `cell ${name()} is not in the complex (vertex ${ids[i]} appears in no simplex)`);
      return undefined;
    }
  }
  sortSmall(d, 0, d.length);
  for (let i = 1; i < d.length; i++) {
    if (d[i] === d[i - 1]) {
      problems.add(at(), `cell ${name()} repeats a vertex`);
      return undefined;
    }
  }
  const index = k <= complex.dimension ? complex.simplices[k].find(d) : -1;
  if (index < 0) {
    problems.add(at(), `cell ${name()} is not in the complex`);
    return undefined;
  }
  return { k, index, dense: d };
}

function isVertexId(v: unknown): boolean {
  return typeof v === 'number' && Number.isSafeInteger(v) && v >= 0;
}
