import type { Mat } from '../based/Mat';

/**
 * The coboundary entries a reduction round has changed, as an orthogonal
 * linked list: every entry sits in its coface's list of faces and in its
 * face's list of cofaces. Every entry has a critical end, so a free cell's
 * lists stay one or two long, while a critical cell's list can span the
 * whole frontier of the search; lookups therefore scan the shorter list.
 * Removal is lazy: entries of removed cells are marked dead and unlinked
 * the next time a list is walked.
 */
export class Overlay<E> {
  private rowOf: Int32Array;
  private colOf: Int32Array;
  private nextFace: Int32Array;
  private nextCoface: Int32Array;
  private live: Uint8Array;
  private mats: Mat<E>[] = [];
  private size = 0;
  private readonly faceHead: Int32Array;
  private readonly cofaceHead: Int32Array;
  private readonly faceCount: Int32Array;
  private readonly cofaceCount: Int32Array;

  constructor(cells: number) {
    this.faceHead = new Int32Array(cells).fill(-1);
    this.cofaceHead = new Int32Array(cells).fill(-1);
    this.faceCount = new Int32Array(cells);
    this.cofaceCount = new Int32Array(cells);
    const cap = 1024;
    this.rowOf = new Int32Array(cap);
    this.colOf = new Int32Array(cap);
    this.nextFace = new Int32Array(cap);
    this.nextCoface = new Int32Array(cap);
    this.live = new Uint8Array(cap);
  }

  faceTotal(g: number): number {
    return this.faceCount[g];
  }

  cofaceTotal(g: number): number {
    return this.cofaceCount[g];
  }

  add(face: number, coface: number, m: Mat<E>): void {
    if (this.size === this.rowOf.length) this.grow();
    const e = this.size++;
    this.rowOf[e] = coface;
    this.colOf[e] = face;
    this.live[e] = 1;
    this.mats[e] = m;
    this.nextFace[e] = this.faceHead[coface];
    this.faceHead[coface] = e;
    this.nextCoface[e] = this.cofaceHead[face];
    this.cofaceHead[face] = e;
    this.faceCount[coface]++;
    this.cofaceCount[face]++;
  }

  find(face: number, coface: number): Mat<E> | undefined {
    if (this.faceCount[coface] <= this.cofaceCount[face]) {
      for (let e = this.faceHead[coface]; e >= 0; e = this.nextFace[e]) {
        if (this.live[e] && this.colOf[e] === face) return this.mats[e];
      }
    } else {
      for (let e = this.cofaceHead[face]; e >= 0; e = this.nextCoface[e]) {
        if (this.live[e] && this.rowOf[e] === coface) return this.mats[e];
      }
    }
    return undefined;
  }

  /** Live faces of g into the scratch arrays; returns how many. */
  faces(g: number, cells: number[], mats: Mat<E>[]): number {
    let n = 0;
    let prev = -1;
    for (let e = this.faceHead[g]; e >= 0; e = this.nextFace[e]) {
      if (!this.live[e]) {
        if (prev < 0) this.faceHead[g] = this.nextFace[e];
        else this.nextFace[prev] = this.nextFace[e];
        continue;
      }
      cells[n] = this.colOf[e];
      mats[n++] = this.mats[e];
      prev = e;
    }
    return n;
  }

  /** Live cofaces of g into the scratch arrays; returns how many. */
  cofaces(g: number, cells: number[], mats: Mat<E>[]): number {
    let n = 0;
    let prev = -1;
    for (let e = this.cofaceHead[g]; e >= 0; e = this.nextCoface[e]) {
      if (!this.live[e]) {
        if (prev < 0) this.cofaceHead[g] = this.nextCoface[e];
        else this.nextCoface[prev] = this.nextCoface[e];
        continue;
      }
      cells[n] = this.rowOf[e];
      mats[n++] = this.mats[e];
      prev = e;
    }
    return n;
  }

  /** Drop every entry of a removed cell. */
  removeCell(g: number): void {
    if (this.faceCount[g] > 0) {
      for (let e = this.faceHead[g]; e >= 0; e = this.nextFace[e]) this.kill(e);
      this.faceHead[g] = -1;
    }
    if (this.cofaceCount[g] > 0) {
      for (let e = this.cofaceHead[g]; e >= 0; e = this.nextCoface[e]) this.kill(e);
      this.cofaceHead[g] = -1;
    }
  }

  private kill(e: number): void {
    if (!this.live[e]) return;
    this.live[e] = 0;
    this.faceCount[this.rowOf[e]]--;
    this.cofaceCount[this.colOf[e]]--;
    (this.mats as (Mat<E> | undefined)[])[e] = undefined;
  }

  private grow(): void {
    const cap = this.rowOf.length * 2;
    const g32 = (a: Int32Array) => {
      const b = new Int32Array(cap);
      b.set(a);
      return b;
    };
    this.rowOf = g32(this.rowOf);
    this.colOf = g32(this.colOf);
    this.nextFace = g32(this.nextFace);
    this.nextCoface = g32(this.nextCoface);
    const l = new Uint8Array(cap);
    l.set(this.live);
    this.live = l;
  }
}
