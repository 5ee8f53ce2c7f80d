import type { ClassCycle, MeshReport } from './analyseMesh';

/**
 * A representative cycle with its cells packed flat: the k+1 original
 * vertex ids of each cell one after another. A void's representative on a
 * closed 10^6-triangle surface is every triangle; as a million small arrays
 * it takes 0.4 s to copy to the page, as one Int32Array next to nothing.
 */
export interface PackedCycle {
  degree: number;
  cellCount: number;
  /** Vertex ids of cell i at (k+1)i … (k+1)i+k, increasing within a cell. */
  vertices: Int32Array;
  /** As in {@link ClassCycle}: absent over GF(2). */
  coefficients?: (number | string)[];
}

/** A mesh report whose cycles are packed (what the worker sends the page). */
export type PackedMeshReport = Omit<MeshReport, 'cycles'> & { cycles: PackedCycle[] };

export function unpackCycle(p: PackedCycle): ClassCycle {
  const size = p.degree + 1;
  const cells: number[][] = new Array(p.cellCount);
  for (let i = 0; i < p.cellCount; i++) cells[i] = Array.from(p.vertices.subarray(size * i, size * (i + 1)));
  return p.coefficients ? { degree: p.degree, cells, coefficients: p.coefficients } : { degree: p.degree, cells };
}

/** The report as {@link analyseMesh} gives it (cells as lists of vertex ids), for saving and export. */
export function unpackMeshReport(r: PackedMeshReport): MeshReport {
  return { ...r, cycles: r.cycles.map(unpackCycle) };
}

/** Whether a stored or received mesh report still has packed cycles. */
export function isPackedMeshReport(r: unknown): r is PackedMeshReport {
  const cycles = (r as { cycles?: unknown } | null)?.cycles;
  return Array.isArray(cycles) && cycles.some((c) => (c as PackedCycle).vertices instanceof Int32Array);
}
