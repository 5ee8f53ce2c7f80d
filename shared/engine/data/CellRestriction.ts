import { entry } from '../based/Mat';
import type { Sheaf } from '../model/Sheaf';

/**
 * The restriction maps F(σ ≤ τ) of a sheaf for faces of any codimension,
 * applied to real vectors. A longer face relation is the composite along
 * any chain of codimension-one faces (the sheaf condition makes the choice
 * irrelevant); this one drops the vertices of τ that σ lacks, last first.
 * Exact map entries are used as the nearest doubles; each map is converted
 * once.
 */
export class CellRestriction {
  private readonly dense = new Map<number, Float64Array>();
  private readonly tuple: Int32Array;

  constructor(readonly sheaf: Sheaf<unknown>) {
    this.tuple = new Int32Array(Math.max(1, sheaf.complex.dimension + 1));
  }

  /** Stalk dimension of cell c of degree k. */
  stalkDim(k: number, c: number): number {
    return this.sheaf.stalkDims[k][c];
  }

  /** Dense vertex indices of cell c of degree k. */
  vertices(k: number, c: number): number[] {
    const t = this.sheaf.complex.simplices[k];
    const out: number[] = [];
    for (let i = 0; i <= k; i++) out.push(t.vertex(c, i));
    return out;
  }

  /** The index of the cell with these (increasing, dense) vertices, or -1. */
  find(verts: ArrayLike<number>): number {
    const k = verts.length - 1;
    const table = this.sheaf.complex.simplices[k];
    if (!table) return -1;
    for (let i = 0; i <= k; i++) this.tuple[i] = verts[i];
    return table.find(this.tuple, 0);
  }

  /**
   * F(σ ≤ τ) v, with σ = `faceVerts` a face of cell `coface` of degree
   * `k` (given by its vertices, a subset of τ's). Throws RangeError when σ
   * is not a face of τ.
   */
  apply(faceVerts: ArrayLike<number>, k: number, coface: number, v: ArrayLike<number>): Float64Array {
    const j = faceVerts.length - 1;
    if (j === k) return Float64Array.from(v);
    const cx = this.sheaf.complex;
    const table = cx.simplices[k];
    // Drop the last vertex of τ that σ does not have.
    let drop = -1;
    let f = j;
    for (let i = k; i >= 0; i--) {
      const vert = table.vertex(coface, i);
      if (f >= 0 && faceVerts[f] === vert) f--;
      else if (drop < 0) drop = i;
    }
    if (f >= 0 || drop < 0) throw new RangeError('not a face of the cell');
    const e = coface * (k + 1) + drop;
    const rho = cx.faces[k][e];
    const inner = this.apply(faceVerts, k - 1, rho, v);
    return this.mapVector(this.sheaf.restriction[k][e], this.sheaf.stalkDims[k][coface], inner);
  }

  /** F(v ≤ τ) x_v for the first vertex v of τ: a global section's value on τ read from one vertex. */
  fromFirstVertex(k: number, coface: number, xv: ArrayLike<number>): Float64Array {
    const v0 = this.sheaf.complex.simplices[k].vertex(coface, 0);
    return this.apply([v0], k, coface, xv);
  }

  /** Map `id` (or the zero map, id −1) applied to v, into a stalk of dimension `rows`. */
  private mapVector(id: number, rows: number, v: Float64Array): Float64Array {
    const out = new Float64Array(rows);
    if (id < 0) return out;
    const M = this.sheaf.maps[id];
    if (M.scalar !== undefined) {
      const s = this.sheaf.field.toNumber(M.scalar);
      for (let i = 0; i < rows; i++) out[i] = s * v[i];
      return out;
    }
    const D = this.denseOf(id);
    for (let i = 0; i < M.rows; i++) {
      let s = 0;
      for (let c = 0; c < M.cols; c++) s += D[i * M.cols + c] * v[c];
      out[i] = s;
    }
    return out;
  }

  private denseOf(id: number): Float64Array {
    let D = this.dense.get(id);
    if (!D) {
      const M = this.sheaf.maps[id];
      const F = this.sheaf.field;
      D = new Float64Array(M.rows * M.cols);
      for (let i = 0; i < M.rows; i++) for (let c = 0; c < M.cols; c++) D[i * M.cols + c] = F.toNumber(entry(F, M, i, c));
      this.dense.set(id, D);
    }
    return D;
  }
}
