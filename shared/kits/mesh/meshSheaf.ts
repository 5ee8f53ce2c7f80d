import type { FieldSpec } from '../../engine/fields/FieldSpec';
import { MODEL_FORMAT, MODEL_VERSION } from '../../engine/model/ModelFile';
import { ModelError } from '../../engine/model/Problem';
import { readModelWithSimplices } from '../../engine/model/readModel';
import type { Sheaf } from '../../engine/model/Sheaf';
import type { MeshData } from '../../import/MeshData';

/**
 * The constant sheaf (stalks of dimension 1, identity maps) on a mesh read
 * into typed arrays: the same cells as the model file `meshModel` writes
 * (triangles, polyline edges, unused vertices as points), handed to the
 * engine's typed-array path so no JS array per simplex is made.
 */
export function meshSheaf(mesh: MeshData, field: FieldSpec): Sheaf<unknown> {
  const t = mesh.triangles;
  const e = mesh.edges;
  const n = mesh.vertexCount;
  const used = new Uint8Array(n);
  for (let i = 0; i < t.length; i++) used[t[i]] = 1;
  for (let i = 0; i < e.length; i++) used[e[i]] = 1;
  let points = 0;
  for (let v = 0; v < n; v++) if (!used[v]) points++;
  const nT = t.length / 3;
  const nE = e.length / 2;
  const count = nT + nE + points;
  // A copy: the engine renumbers and sorts the corners in place, and the kit still reads the file's winding.
  const ids = new Int32Array(t.length + e.length + points);
  ids.set(t);
  ids.set(e, t.length);
  const ends = new Int32Array(count);
  let w = 0;
  for (let i = 0; i < nT; i++) ends[w++] = 3 * (i + 1);
  for (let i = 0; i < nE; i++) ends[w++] = t.length + 2 * (i + 1);
  let at = t.length + e.length;
  for (let v = 0; v < n; v++) {
    if (used[v]) continue;
    ids[at++] = v;
    ends[w++] = at;
  }
  const rest = { format: MODEL_FORMAT, version: MODEL_VERSION, field, simplices: [], stalks: { default: 1 }, maps: { default: 'identity' } };
  const read = readModelWithSimplices(rest, { ids, ends, count }, { field });
  if (!read.sheaf) throw new ModelError(read.problems);
  return read.sheaf;
}
