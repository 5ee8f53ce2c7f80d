import type { SimplicialComplex } from '../../engine/complex/SimplicialComplex';

export interface SurfaceChecks {
  /** Edges in exactly one triangle (the surface's border). */
  boundaryEdges: number;
  /** Edges in three or more triangles. */
  nonManifoldEdges: number;
  /** Vertices whose triangles do not form one fan (two surfaces pinched together there). */
  nonManifoldVertices: number;
  /** Edges and vertices that belong to no triangle. */
  looseEdges: number;
  looseVertices: number;
  /** Every edge in exactly two triangles and nothing loose: a closed surface (if also manifold at its vertices). */
  closed: boolean;
  /**
   * Whether the triangles can be oriented so that every shared edge is run
   * in opposite directions by its two triangles; null where an edge has
   * three or more triangles (then no surface orientation is defined).
   */
  orientable: boolean | null;
}

/**
 * Combinatorial surface checks on the triangles of a complex: border and
 * non-manifold edges, loose cells, closedness, and orientability by a
 * breadth-first walk that propagates one triangle's orientation across
 * shared edges until it meets itself reversed (then no consistent
 * orientation exists, as on a Möbius strip).
 */
export function surfaceChecks(cx: SimplicialComplex): SurfaceChecks {
  const nV = cx.simplices[0]?.size ?? 0;
  const nE = cx.simplices[1]?.size ?? 0;
  const nT = cx.simplices[2]?.size ?? 0;
  let boundaryEdges = 0;
  let nonManifoldEdges = 0;
  let looseEdges = 0;
  const triCount = (e: number) => (cx.dimension >= 2 ? cx.cofacePtr[1][e + 1] - cx.cofacePtr[1][e] : 0);
  for (let e = 0; e < nE; e++) {
    const c = triCount(e);
    if (c === 0) looseEdges++;
    else if (c === 1) boundaryEdges++;
    else if (c > 2) nonManifoldEdges++;
  }
  let looseVertices = 0;
  for (let v = 0; v < nV; v++) if (cx.dimension < 1 || cx.cofacePtr[0][v + 1] === cx.cofacePtr[0][v]) looseVertices++;
  const nonManifoldVertices = cx.dimension === 2 ? pinchedVertices(cx) : 0;
  const closed =
    cx.dimension === 2 && nT > 0 && boundaryEdges === 0 && nonManifoldEdges === 0 && nonManifoldVertices === 0 && looseEdges === 0 && looseVertices === 0;
  const orientation = nonManifoldEdges > 0 || cx.dimension !== 2 ? undefined : orientTriangles(cx);
  return {
    boundaryEdges,
    nonManifoldEdges,
    nonManifoldVertices,
    looseEdges,
    looseVertices,
    closed,
    orientable: orientation === undefined ? null : orientation !== null,
  };
}

/**
 * Vertices whose link (the edges opposite them in their triangles) falls
 * into more than one piece, by union–find over each link in turn.
 */
function pinchedVertices(cx: SimplicialComplex): number {
  const nV = cx.simplices[0].size;
  const tri = cx.simplices[2];
  const edgePtr = cx.cofacePtr[0];
  const edgeEntry = cx.cofaceEntry[0];
  const triPtr = cx.cofacePtr[1];
  const triEntry = cx.cofaceEntry[1];
  const parent = new Int32Array(nV).fill(-1);
  const seen = new Int32Array(tri.size).fill(-1);
  const find = (x: number): number => {
    while (parent[x] !== x) x = parent[x] = parent[parent[x]];
    return x;
  };
  let pinched = 0;
  const verts = tri.vertices;
  const touched = new Int32Array(nV);
  let nTouched = 0;
  for (let v = 0; v < nV; v++) {
    nTouched = 0;
    let pieces = 0;
    for (let p = edgePtr[v]; p < edgePtr[v + 1]; p++) {
      const e = Math.floor(edgeEntry[p] / 2);
      for (let q = triPtr[e]; q < triPtr[e + 1]; q++) {
        const t = Math.floor(triEntry[q] / 3);
        if (seen[t] === v) continue;
        seen[t] = v;
        // The link edge: the two corners other than v.
        const t0 = verts[3 * t];
        const x = t0 === v ? verts[3 * t + 1] : t0;
        const y = verts[3 * t + 2] === v ? verts[3 * t + 1] : verts[3 * t + 2];
        if (parent[x] < 0) {
          parent[x] = x;
          touched[nTouched++] = x;
          pieces++;
        }
        if (parent[y] < 0) {
          parent[y] = y;
          touched[nTouched++] = y;
          pieces++;
        }
        const a = find(x);
        const b = find(y);
        if (a !== b) {
          parent[a] = b;
          pieces--;
        }
      }
    }
    if (pieces > 1) pinched++;
    for (let i = 0; i < nTouched; i++) parent[touched[i]] = -1;
  }
  return pinched;
}

/**
 * A consistent orientation of the triangles (±1 relative to increasing
 * vertex order), or null when none exists. Edge i of a triangle (opposite
 * its i-th vertex) is induced with sign (−1)^i, so two triangles sharing an
 * edge agree when their induced signs are opposite.
 */
export function orientTriangles(cx: SimplicialComplex): Int8Array | null {
  const nT = cx.simplices[2].size;
  const faces = cx.faces[2];
  const ptr = cx.cofacePtr[1];
  const entry = cx.cofaceEntry[1];
  const o = new Int8Array(nT);
  const queue = new Int32Array(nT);
  for (let seed = 0; seed < nT; seed++) {
    if (o[seed] !== 0) continue;
    o[seed] = 1;
    let head = 0;
    let tail = 0;
    queue[tail++] = seed;
    while (head < tail) {
      const t = queue[head++];
      for (let i = 0; i < 3; i++) {
        const e = faces[3 * t + i];
        const induced = (i % 2 === 0 ? 1 : -1) * o[t];
        for (let p = ptr[e]; p < ptr[e + 1]; p++) {
          const u = Math.floor(entry[p] / 3);
          if (u === t) continue;
          const j = entry[p] % 3;
          // u must induce −induced on e: (−1)^j o[u] = −induced.
          const want = (-induced * (j % 2 === 0 ? 1 : -1)) as 1 | -1;
          if (o[u] === 0) {
            o[u] = want;
            queue[tail++] = u;
          } else if (o[u] !== want) return null;
        }
      }
    }
  }
  return o;
}

/**
 * Whether the file's own winding (corner order of each listed triangle) is
 * consistent: every shared edge run once in each direction. `triangles`
 * holds the listed corner triples back to back as dense vertex indices.
 */
export function windingConsistent(cx: SimplicialComplex, triangles: ArrayLike<number>): boolean {
  // Bit 1: edge run from its lower to its higher vertex; bit 2: the other way.
  const runs = new Uint8Array(cx.simplices[1]?.size ?? 0);
  const tri = cx.simplices[2];
  if (tri && tri.size * 3 === triangles.length) {
    // No repeated triangles: the complex keeps the file's order, so triangle t
    // is listed triangle t and its edges are read from the incidences, not looked up.
    const verts = tri.vertices;
    const faces = cx.faces[2];
    for (let t = 0; t < tri.size; t++) {
      const o = 3 * t;
      for (let i = 0; i < 3; i++) {
        const a = triangles[o + i];
        const b = triangles[o + ((i + 1) % 3)];
        const c = triangles[o + ((i + 2) % 3)];
        // The edge (a, b) is the face opposite c.
        const e = faces[o + (verts[o] === c ? 0 : verts[o + 1] === c ? 1 : 2)];
        const bit = a < b ? 1 : 2;
        if (runs[e] & bit) return false;
        runs[e] |= bit;
      }
    }
    return true;
  }
  const pair = new Int32Array(2);
  for (let t = 0; t + 2 < triangles.length; t += 3) {
    for (let i = 0; i < 3; i++) {
      const a = triangles[t + i];
      const b = triangles[t + ((i + 1) % 3)];
      pair[0] = Math.min(a, b);
      pair[1] = Math.max(a, b);
      const e = cx.simplices[1].find(pair, 0);
      const bit = a < b ? 1 : 2;
      if (e < 0 || runs[e] & bit) return false;
      runs[e] |= bit;
    }
  }
  return true;
}
