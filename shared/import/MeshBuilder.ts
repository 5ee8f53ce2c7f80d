import type { MeshData } from './MeshData';
import { Float64List, Int32List } from './TypedList';

/**
 * A surface mesh while it is being read: positions, triangles and edges in
 * flat typed arrays (0-based vertex ids). Polygons are fan-triangulated
 * from their first corner, which keeps the topology of any simple polygon
 * whatever its shape.
 */
export class MeshBuilder {
  /** x, y, z of vertex i at 3i, 3i+1, 3i+2. */
  readonly positions = new Float64List();
  /** Corners of triangle t at 3t, 3t+1, 3t+2. */
  readonly triangles = new Int32List();
  /** Ends of edge e at 2e, 2e+1. */
  readonly edges = new Int32List();

  get vertexCount(): number {
    return this.positions.length / 3;
  }

  addVertex(x: number, y: number, z: number): void {
    this.positions.push(x);
    this.positions.push(y);
    this.positions.push(z);
  }

  addEdge(a: number, b: number): void {
    this.edges.push(a);
    this.edges.push(b);
  }

  /**
   * Add the polygon corners[0..n) (n ≥ 3) as n − 2 triangles. Returns a
   * vertex that appears twice, in which case nothing is added, else -1.
   */
  addPolygon(corners: Int32Array, n: number): number {
    if (n < 3) throw new RangeError(`a polygon needs at least 3 corners, got ${n}`);
    const repeated = firstRepeated(corners, n);
    if (repeated >= 0) return repeated;
    const t = this.triangles;
    const a = corners[0];
    for (let i = 2; i < n; i++) {
      t.push(a);
      t.push(corners[i - 1]);
      t.push(corners[i]);
    }
    return -1;
  }

  /** The mesh read so far; the arrays are views of the builder's buffers, trimmed to length. */
  toData(): MeshData {
    return {
      vertexCount: this.vertexCount,
      positions: this.positions.data.subarray(0, this.positions.length),
      triangles: this.triangles.data.subarray(0, this.triangles.length),
      edges: this.edges.data.subarray(0, this.edges.length),
    };
  }
}

/** A value occurring twice in a[0..n), or -1. Quadratic for the usual small polygons. */
function firstRepeated(a: Int32Array, n: number): number {
  if (n <= 32) {
    for (let i = 1; i < n; i++) {
      const v = a[i];
      for (let j = 0; j < i; j++) if (a[j] === v) return v;
    }
    return -1;
  }
  const sorted = a.slice(0, n).sort();
  for (let i = 1; i < n; i++) if (sorted[i] === sorted[i - 1]) return sorted[i];
  return -1;
}
