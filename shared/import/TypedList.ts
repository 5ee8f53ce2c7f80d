/**
 * Append-only typed arrays that double their capacity. Importers collect
 * millions of coordinates and indices; one contiguous buffer per kind keeps
 * that to a few allocations instead of one small array per face.
 */
export class Int32List {
  data: Int32Array;
  length = 0;
  constructor(capacity = 1024) {
    this.data = new Int32Array(Math.max(capacity, 4));
  }
  push(v: number): void {
    if (this.length === this.data.length) this.grow();
    this.data[this.length++] = v;
  }
  private grow(): void {
    const next = new Int32Array(this.data.length * 2);
    next.set(this.data);
    this.data = next;
  }
}

/** As {@link Int32List}, for 64-bit floats. */
export class Float64List {
  data: Float64Array;
  length = 0;
  constructor(capacity = 1024) {
    this.data = new Float64Array(Math.max(capacity, 4));
  }
  push(v: number): void {
    if (this.length === this.data.length) this.grow();
    this.data[this.length++] = v;
  }
  private grow(): void {
    const next = new Float64Array(this.data.length * 2);
    next.set(this.data);
    this.data = next;
  }
}
