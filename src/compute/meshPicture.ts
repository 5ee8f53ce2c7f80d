import type { MeshData } from '../../shared/import';
import { spectralLayout } from '../../shared/layout/spectralLayout';

/** What the mesh kit's picture needs, computed in the worker so the page only draws. */
export interface MeshPicture {
  /** Projected x, y per vertex in [0, 1]² (y down), dense order. */
  positions: Float32Array;
  /** Original vertex id per dense index. */
  vertexIds: Int32Array;
  /** Dense vertex index pairs of the drawn edges (all, or a sample for very large meshes). */
  edges: Int32Array;
  /** The picture takes the edges of every `drawStride`-th cell of the file (1: all of them). */
  drawStride: number;
}

/**
 * A fixed oblique view (rotate 35° about z, tilt 30°) of a mesh, edges
 * deduplicated and capped at `maxEdges` for drawing. Dense indices are the
 * file's vertex numbers, so nothing is renumbered.
 */
export function meshPicture(mesh: MeshData, maxEdges: number): MeshPicture {
  const n = mesh.vertexCount;
  const t = mesh.triangles;
  const l = mesh.edges;
  const nT = t.length / 3;
  const cells = nT + l.length / 2;
  // Past the cap, every stride-th cell, so a sample of the whole mesh is drawn rather than one corner of it.
  const stride = Math.max(1, Math.ceil((3 * nT + l.length / 2) / maxEdges));
  const seen = new Set<number>();
  const edges = new Int32Array(2 * Math.min(maxEdges, 3 * nT + l.length / 2));
  let w = 0;
  const add = (i: number, j: number) => {
    if (w >= edges.length) return;
    const key = Math.min(i, j) * n + Math.max(i, j);
    if (seen.has(key)) return;
    seen.add(key);
    edges[w++] = i;
    edges[w++] = j;
  };
  for (let c = 0; c < cells && w < edges.length; c += stride) {
    if (c < nT) {
      const a = t[3 * c];
      const b = t[3 * c + 1];
      const d = t[3 * c + 2];
      add(a, b);
      add(a, d);
      add(b, d);
    } else add(l[2 * (c - nT)], l[2 * (c - nT) + 1]);
  }
  const drawn = edges.slice(0, w);
  const vertexIds = new Int32Array(n);
  for (let v = 0; v < n; v++) vertexIds[v] = v;
  const p = mesh.positions;
  const ca = Math.cos(0.6), sa = Math.sin(0.6), ct = Math.cos(0.52), st = Math.sin(0.52);
  const xy = new Float64Array(2 * n);
  let positioned = true;
  for (let v = 0; v < n && positioned; v++) {
    const x = p[3 * v];
    const y = p[3 * v + 1];
    const z = p[3 * v + 2];
    if (!Number.isFinite(x) || !Number.isFinite(y)) positioned = false;
    const rx = ca * x - sa * y;
    const ry = sa * x + ca * y;
    xy[2 * v] = rx;
    xy[2 * v + 1] = ct * (Number.isFinite(z) ? z : 0) + st * ry;
  }
  const positions = positioned ? fitUnitSquare(xy) : spectralLayout(n, drawn);
  return { positions, vertexIds, edges: drawn, drawStride: stride };
}

/** x, y pairs scaled into [0.05, 0.95]² with y up on paper, centred along the shorter side. */
function fitUnitSquare(xy: Float64Array): Float32Array {
  let minX = Infinity, maxX = -Infinity, minY = Infinity, maxY = -Infinity;
  for (let i = 0; i < xy.length; i += 2) {
    const x = xy[i];
    const y = xy[i + 1];
    if (x < minX) minX = x;
    if (x > maxX) maxX = x;
    if (y < minY) minY = y;
    if (y > maxY) maxY = y;
  }
  const span = Math.max(maxX - minX, maxY - minY) || 1;
  const cx = (span - (maxX - minX)) / 2;
  const cy = (span - (maxY - minY)) / 2;
  const out = new Float32Array(xy.length);
  for (let i = 0; i < xy.length; i += 2) {
    out[i] = 0.05 + (0.9 * (xy[i] - minX + cx)) / span;
    out[i + 1] = 0.95 - (0.9 * (xy[i + 1] - minY + cy)) / span;
  }
  return out;
}
