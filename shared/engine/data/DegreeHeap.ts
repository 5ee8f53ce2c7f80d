/** A binary min-heap of (degree, unknown) pairs with lazy deletion; ties go to the lower unknown. */
export class DegreeHeap {
  private deg: Int32Array;
  private node: Int32Array;
  size = 0;
  constructor(capacity: number) {
    this.deg = new Int32Array(Math.max(16, capacity * 2));
    this.node = new Int32Array(this.deg.length);
  }
  push(d: number, v: number): void {
    if (this.size === this.deg.length) {
      this.deg = grown(this.deg);
      this.node = grown(this.node);
    }
    let i = this.size++;
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (!this.less(d, v, this.deg[p], this.node[p])) break;
      this.deg[i] = this.deg[p];
      this.node[i] = this.node[p];
      i = p;
    }
    this.deg[i] = d;
    this.node[i] = v;
  }
  pop(): [number, number] {
    const top: [number, number] = [this.deg[0], this.node[0]];
    const d = this.deg[--this.size];
    const v = this.node[this.size];
    let i = 0;
    for (;;) {
      const l = 2 * i + 1;
      if (l >= this.size) break;
      const r = l + 1;
      const c = r < this.size && this.less(this.deg[r], this.node[r], this.deg[l], this.node[l]) ? r : l;
      if (!this.less(this.deg[c], this.node[c], d, v)) break;
      this.deg[i] = this.deg[c];
      this.node[i] = this.node[c];
      i = c;
    }
    this.deg[i] = d;
    this.node[i] = v;
    return top;
  }
  private less(d1: number, v1: number, d2: number, v2: number): boolean {
    return d1 < d2 || (d1 === d2 && v1 < v2);
  }
}

function grown(a: Int32Array): Int32Array<ArrayBuffer> {
  const b = new Int32Array(a.length * 2);
  b.set(a);
  return b;
}
