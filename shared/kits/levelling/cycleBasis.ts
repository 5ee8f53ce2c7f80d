/** A closed walk through a multigraph: vertices in order, and each edge with the direction it is walked. */
export interface Cycle {
  /** Vertices in walking order; the walk returns from the last to the first. */
  vertices: number[];
  /** Edge i joins vertices[i] and vertices[i+1] (the last one closes the walk). */
  edges: number[];
  /** +1 when edge i is walked from its `from` end to its `to` end, −1 against it. */
  signs: number[];
}

/** Longest search for a short cycle before falling back to the spanning-tree one. */
const SEARCH_LIMIT = 4096;

/**
 * A cycle basis of a multigraph (vertices 0 … n−1, edge e from `from[e]`
 * to `to[e]`): m − n + c independent cycles, c the number of connected
 * pieces. A breadth-first spanning forest gives one fundamental cycle per
 * other edge; taking those edges shortest cycle first, each is replaced by
 * the shortest cycle through it in the forest plus the edges already
 * taken, which keeps loops short and local (they stay independent: each
 * holds an edge no earlier one does).
 */
export function cycleBasis(n: number, from: ArrayLike<number>, to: ArrayLike<number>): Cycle[] {
  const m = from.length;
  const { ptr, adj } = incidence(n, from, to);
  const parentEdge = new Int32Array(n).fill(-1);
  const depth = new Int32Array(n).fill(-1);
  const inTree = new Uint8Array(m);
  for (let root = 0; root < n; root++) {
    if (depth[root] >= 0) continue;
    depth[root] = 0;
    const queue = [root];
    for (let q = 0; q < queue.length; q++) {
      const u = queue[q];
      for (let i = ptr[u]; i < ptr[u + 1]; i++) {
        const e = adj[i];
        const w = from[e] === u ? to[e] : from[e];
        if (depth[w] >= 0) continue;
        depth[w] = depth[u] + 1;
        parentEdge[w] = e;
        inTree[e] = 1;
        queue.push(w);
      }
    }
  }
  const chords: number[] = [];
  for (let e = 0; e < m; e++) if (!inTree[e]) chords.push(e);
  const treeLength = (e: number) => {
    let a = from[e];
    let b = to[e];
    let len = 1;
    while (a !== b) {
      if (depth[a] >= depth[b]) a = other(parentEdge[a], a, from, to);
      else b = other(parentEdge[b], b, from, to);
      len++;
    }
    return len;
  };
  const lengths = new Map(chords.map((e) => [e, treeLength(e)]));
  chords.sort((a, b) => lengths.get(a)! - lengths.get(b)! || a - b);
  const usable = Uint8Array.from(inTree);
  const seenStamp = new Int32Array(n);
  const via = new Int32Array(n);
  const cycles: Cycle[] = [];
  let stamp = 0;
  for (const e of chords) {
    stamp++;
    // Shortest path from to[e] back to from[e] over usable edges (not e itself).
    const start = to[e];
    const goal = from[e];
    seenStamp[start] = stamp;
    via[start] = -1;
    const queue = [start];
    let found = start === goal;
    for (let q = 0; q < queue.length && !found && queue.length < SEARCH_LIMIT; q++) {
      const u = queue[q];
      for (let i = ptr[u]; i < ptr[u + 1]; i++) {
        const f = adj[i];
        if (!usable[f] || f === e) continue;
        const w = other(f, u, from, to);
        if (seenStamp[w] === stamp) continue;
        seenStamp[w] = stamp;
        via[w] = f;
        if (w === goal) {
          found = true;
          break;
        }
        queue.push(w);
      }
    }
    const path = found ? walkBack(goal, start, via, from, to) : treePath(start, goal, parentEdge, depth, from, to);
    // The cycle: e from from[e] to to[e], then the path back.
    const vertices = [goal, start, ...path.vertices.slice(0, -1)];
    const edges = [e, ...path.edges];
    const signs = [1, ...path.signs];
    cycles.push({ vertices, edges, signs });
    usable[e] = 1;
  }
  return cycles;
}

/**
 * A shortest path (fewest edges) between two vertices, as the vertex list
 * from `a` to `b` and the edges walked; undefined when they are not
 * connected.
 */
export function shortestPath(n: number, from: ArrayLike<number>, to: ArrayLike<number>, a: number, b: number): { vertices: number[]; edges: number[]; signs: number[] } | undefined {
  const { ptr, adj } = incidence(n, from, to);
  const via = new Int32Array(n).fill(-2);
  via[a] = -1;
  const queue = [a];
  for (let q = 0; q < queue.length && via[b] === -2; q++) {
    const u = queue[q];
    for (let i = ptr[u]; i < ptr[u + 1]; i++) {
      const f = adj[i];
      const w = other(f, u, from, to);
      if (via[w] !== -2) continue;
      via[w] = f;
      queue.push(w);
    }
  }
  if (via[b] === -2) return undefined;
  const back = walkBack(b, a, via, from, to);
  // walkBack lists the path from a to b already.
  return { vertices: [a, ...back.vertices], edges: back.edges, signs: back.signs };
}

function incidence(n: number, from: ArrayLike<number>, to: ArrayLike<number>): { ptr: Int32Array; adj: Int32Array } {
  const m = from.length;
  const ptr = new Int32Array(n + 1);
  for (let e = 0; e < m; e++) {
    ptr[from[e] + 1]++;
    ptr[to[e] + 1]++;
  }
  for (let v = 0; v < n; v++) ptr[v + 1] += ptr[v];
  const fill = ptr.slice(0, n);
  const adj = new Int32Array(2 * m);
  for (let e = 0; e < m; e++) {
    adj[fill[from[e]]++] = e;
    adj[fill[to[e]]++] = e;
  }
  return { ptr, adj };
}

function other(e: number, v: number, from: ArrayLike<number>, to: ArrayLike<number>): number {
  return from[e] === v ? to[e] : from[e];
}

/** The path start → … → end recorded in `via` (edge used to reach each vertex), walked forwards: vertices after start. */
function walkBack(end: number, start: number, via: Int32Array, from: ArrayLike<number>, to: ArrayLike<number>) {
  const vertices: number[] = [];
  const edges: number[] = [];
  const signs: number[] = [];
  for (let w = end; w !== start; ) {
    const f = via[w];
    const u = other(f, w, from, to);
    vertices.push(w);
    edges.push(f);
    signs.push(from[f] === u ? 1 : -1);
    w = u;
  }
  return { vertices: vertices.reverse(), edges: edges.reverse(), signs: signs.reverse() };
}

/** The spanning-forest path from a to b, in the same form as walkBack(b, a). */
function treePath(a: number, b: number, parentEdge: Int32Array, depth: Int32Array, from: ArrayLike<number>, to: ArrayLike<number>) {
  const up: { v: number; e: number }[] = [];
  const down: { v: number; e: number }[] = [];
  let x = a;
  let y = b;
  while (x !== y) {
    if (depth[x] >= depth[y]) {
      const e = parentEdge[x];
      x = other(e, x, from, to);
      up.push({ v: x, e });
    } else {
      const e = parentEdge[y];
      down.push({ v: y, e });
      y = other(e, y, from, to);
    }
  }
  const vertices: number[] = [];
  const edges: number[] = [];
  const signs: number[] = [];
  let cur = a;
  for (const s of [...up, ...down.reverse()]) {
    edges.push(s.e);
    signs.push(from[s.e] === cur ? 1 : -1);
    cur = other(s.e, cur, from, to);
    vertices.push(cur);
  }
  return { vertices, edges, signs };
}
