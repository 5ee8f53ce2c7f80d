/**
 * Textbook triangulations (Hatcher, Algebraic Topology, 2002, ch. 2) written
 * out as OBJ and OFF text, so the mesh kit is tested through the importers.
 * Triangles keep the corner order given (their winding).
 */
export type Tri = [number, number, number];

export function toObj(vertexCount: number, triangles: Tri[]): string {
  const v = Array.from({ length: vertexCount }, (_, i) => `v ${i} ${(i * 7) % 5} ${(i * 3) % 4}`);
  const f = triangles.map(([a, b, c]) => `f ${a + 1} ${b + 1} ${c + 1}`);
  return [...v, ...f].join('\n') + '\n';
}

export function toOff(vertexCount: number, triangles: Tri[]): string {
  const v = Array.from({ length: vertexCount }, (_, i) => `${i} ${(i * 7) % 5} ${(i * 3) % 4}`);
  const f = triangles.map(([a, b, c]) => `3 ${a} ${b} ${c}`);
  return ['OFF', `${vertexCount} ${triangles.length} 0`, ...v, ...f].join('\n') + '\n';
}

/** An n×m grid of squares, each cut in two, with vertex(i, j) naming the identifications; consistently wound. */
export function grid(n: number, m: number, vertex: (i: number, j: number) => number): Tri[] {
  const out: Tri[] = [];
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < m; j++) {
      out.push([vertex(i, j), vertex(i + 1, j), vertex(i + 1, j + 1)], [vertex(i, j), vertex(i + 1, j + 1), vertex(i, j + 1)]);
    }
  }
  return out;
}

/** Torus: the n×n grid with opposite sides identified straight; n² vertices. */
export function torus(n = 5, offset = 0): Tri[] {
  return grid(n, n, (i, j) => offset + (i % n) * n + (j % n));
}

/** Klein bottle: sides j identified straight, sides i with the flip (n, j) ~ (0, n − j). */
export function kleinBottle(n = 5): Tri[] {
  return grid(n, n, (i, j) => {
    let jj = j % n;
    let ii = i;
    if (ii === n) {
      ii = 0;
      jj = (n - jj) % n;
    }
    return ii * n + jj;
  });
}

/** The boundary of a tetrahedron on vertices o … o+3, wound outwards. */
export function tetrahedron(o = 0): Tri[] {
  return [[o, o + 2, o + 1], [o, o + 1, o + 3], [o, o + 3, o + 2], [o + 1, o + 2, o + 3]];
}

/**
 * The closed surface of genus 2 as the connected sum of two 5×5 tori: one
 * triangle removed from each and their boundaries glued. 47 vertices,
 * 147 edges, 98 triangles, χ = −2.
 */
export function genusTwo(): { vertices: number; triangles: Tri[] } {
  const t1 = torus(5, 0);
  const t2 = torus(5, 25);
  const [a, b, c] = t1[0];
  const [a2, b2, c2] = t2[0];
  // Rename the second torus so its removed triangle's corners become the first one's, and the rest close up.
  const used = new Set([a2, b2, c2]);
  const rename = new Map<number, number>([[a2, a], [b2, b], [c2, c]]);
  let next = 25;
  for (let v = 25; v < 50; v++) if (!used.has(v)) rename.set(v, next++);
  // Reverse the second torus's winding so the glued surface stays consistently wound.
  const second = t2.slice(1).map(([x, y, z]) => [rename.get(z)!, rename.get(y)!, rename.get(x)!] as Tri);
  return { vertices: next, triangles: [...t1.slice(1), ...second] };
}

/** The 5-vertex Möbius strip: triangles (i, i+1, i+2) mod 5. */
export function moebius(): Tri[] {
  return Array.from({ length: 5 }, (_, i) => [i, (i + 1) % 5, (i + 2) % 5] as Tri);
}
