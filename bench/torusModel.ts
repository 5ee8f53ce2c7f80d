import type { ModelFile } from '../shared/engine';

/**
 * A triangulated torus: an n×n grid of squares with opposite sides glued,
 * each square cut along one diagonal (6n² cells: n² vertices, 3n² edges,
 * 2n² triangles). The textbook construction; n ≥ 3 makes it simplicial.
 */
export function torusSimplices(n: number): number[][] {
  const id = (i: number, j: number) => ((i + n) % n) * n + ((j + n) % n);
  const out: number[][] = [];
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      out.push([id(i, j), id(i + 1, j), id(i + 1, j + 1)]);
      out.push([id(i, j), id(i, j + 1), id(i + 1, j + 1)]);
    }
  }
  return out;
}

/** Grid size whose torus has about `cells` cells. */
export function torusSizeFor(cells: number): number {
  return Math.max(3, Math.round(Math.sqrt(cells / 6)));
}

/** The constant sheaf of dimension d on a torus. */
export function constantTorus(n: number, d: number, field: ModelFile['field']): ModelFile {
  return { format: 'gluefield.sheaf', version: 1, name: `torus ${n}×${n}, stalk ${d}`, field, simplices: torusSimplices(n), stalks: { default: d } };
}
