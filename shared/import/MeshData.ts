import type { ModelFile, VertexInfo } from '../engine';
import { constantSheafModel } from './constantSheafModel';
import type { ImportOptions, ImportResult } from './ImportResult';
import type { Problem } from '../engine';

/**
 * A mesh as read from an OBJ or OFF file, in flat typed arrays with 0-based
 * vertex ids. The mesh kit works on this directly: a million-triangle file
 * never becomes a million small JS arrays, which cost more to allocate and
 * collect than the whole text scan.
 */
export interface MeshData {
  vertexCount: number;
  /** x, y, z of vertex i at 3i, 3i+1, 3i+2. */
  positions: Float64Array;
  /** Corners of triangle t at 3t, 3t+1, 3t+2, in the file's order (its winding). */
  triangles: Int32Array;
  /** Ends of polyline edge e at 2e, 2e+1. */
  edges: Int32Array;
}

export type MeshReadResult = { mesh: MeshData } | { problems: Problem[] };

/** Hooks of a mesh reader: the fraction of the text read so far, now and then. */
export interface MeshReadOptions {
  progress?(fraction: number): void;
}

/**
 * Characters read between two progress reports: a hundredth of the text, but
 * not less than 64 KiB, so that a large file sends about a hundred messages
 * from the worker and a small one hardly any.
 */
export function progressStep(textLength: number): number {
  return Math.max(Math.ceil(textLength / 100), 1 << 16);
}

/**
 * The constant sheaf on the mesh as a model file. Vertices that no face or
 * edge uses are kept as isolated points: they are cells of the file's
 * complex.
 */
export function meshModel(mesh: MeshData, options: ImportOptions = {}): ModelFile {
  const n = mesh.vertexCount;
  const used = new Uint8Array(n);
  const simplices: number[][] = [];
  const t = mesh.triangles;
  for (let i = 0; i < t.length; i += 3) {
    simplices.push([t[i], t[i + 1], t[i + 2]]);
    used[t[i]] = used[t[i + 1]] = used[t[i + 2]] = 1;
  }
  const e = mesh.edges;
  for (let i = 0; i < e.length; i += 2) {
    simplices.push([e[i], e[i + 1]]);
    used[e[i]] = used[e[i + 1]] = 1;
  }
  for (let v = 0; v < n; v++) if (!used[v]) simplices.push([v]);
  const p = mesh.positions;
  const vertices: VertexInfo[] = new Array(n);
  for (let v = 0; v < n; v++) vertices[v] = { id: v, x: p[3 * v], y: p[3 * v + 1], z: p[3 * v + 2] };
  return constantSheafModel(simplices, options, vertices);
}

/** A reader's outcome as an importer's: the model file, or the same problems. */
export function meshImport(read: MeshReadResult, options: ImportOptions): ImportResult {
  return 'mesh' in read ? { model: meshModel(read.mesh, options) } : read;
}
