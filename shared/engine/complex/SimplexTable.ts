/**
 * A set of equal-width vertex tuples (the k-simplices of one dimension) with
 * insertion-ordered indices, by open addressing.
 *
 * Tuples live back to back in one Int32Array so a million simplices cost a
 * few megabytes and no per-simplex objects; the slot array holds tuple
 * indices (or -1) and is kept at most half full.
 */
export class SimplexTable {
  readonly width: number;
  private verts: Int32Array;
  private slots: Int32Array;
  private mask: number;
  private count = 0;
  /** False for a table built from known-unique tuples until something looks one up. */
  private indexed = true;

  constructor(width: number, expected = 16) {
    this.width = width;
    let cap = 16;
    while (cap < expected * 2) cap *= 2;
    this.slots = new Int32Array(cap).fill(-1);
    this.mask = cap - 1;
    this.verts = new Int32Array(Math.max(expected, 4) * width);
  }

  /**
   * A table over tuples already known to be distinct (as a closure built by
   * bucketing produces them). The hash index is only built if a lookup ever
   * needs it, which a model without per-cell entries never does.
   */
  static ofUnique(width: number, verts: Int32Array, count: number): SimplexTable {
    const t = new SimplexTable(width, 1);
    t.verts = verts;
    t.count = count;
    t.indexed = false;
    return t;
  }

  private ensureIndex(): void {
    if (this.indexed) return;
    this.indexed = true;
    let cap = 16;
    while (cap < this.count * 2) cap *= 2;
    this.slots = new Int32Array(cap / 2);
    this.rehash();
  }

  get size(): number {
    return this.count;
  }

  /** The vertex tuples, `width` per simplex, valid up to `size * width`. */
  get vertices(): Int32Array {
    return this.verts.subarray(0, this.count * this.width);
  }

  vertex(index: number, position: number): number {
    return this.verts[index * this.width + position];
  }

  /** Index of the tuple at `buf[off ..]`, or -1. */
  find(buf: ArrayLike<number>, off = 0): number {
    this.ensureIndex();
    let slot = this.hash(buf, off) & this.mask;
    for (;;) {
      const idx = this.slots[slot];
      if (idx < 0) return -1;
      if (this.matches(idx, buf, off)) return idx;
      slot = (slot + 1) & this.mask;
    }
  }

  /** Index of the tuple at `buf[off ..]`, inserting it if new. */
  insert(buf: ArrayLike<number>, off = 0): number {
    this.ensureIndex();
    let slot = this.hash(buf, off) & this.mask;
    for (;;) {
      const idx = this.slots[slot];
      if (idx < 0) break;
      if (this.matches(idx, buf, off)) return idx;
      slot = (slot + 1) & this.mask;
    }
    const idx = this.count++;
    const w = this.width;
    if (this.count * w > this.verts.length) {
      const grown = new Int32Array(this.verts.length * 2);
      grown.set(this.verts);
      this.verts = grown;
    }
    for (let i = 0; i < w; i++) this.verts[idx * w + i] = buf[off + i];
    this.slots[slot] = idx;
    if (this.count * 2 > this.slots.length) this.rehash();
    return idx;
  }

  private matches(idx: number, buf: ArrayLike<number>, off: number): boolean {
    const w = this.width;
    const base = idx * w;
    for (let i = 0; i < w; i++) if (this.verts[base + i] !== buf[off + i]) return false;
    return true;
  }

  private hash(buf: ArrayLike<number>, off: number): number {
    let h = 0x811c9dc5;
    for (let i = 0; i < this.width; i++) {
      h = Math.imul(h ^ buf[off + i], 0x9e3779b1);
      h ^= h >>> 15;
    }
    return h;
  }

  private rehash(): void {
    const cap = this.slots.length * 2;
    this.slots = new Int32Array(cap).fill(-1);
    this.mask = cap - 1;
    const w = this.width;
    for (let idx = 0; idx < this.count; idx++) {
      let slot = this.hash(this.verts, idx * w) & this.mask;
      while (this.slots[slot] >= 0) slot = (slot + 1) & this.mask;
      this.slots[slot] = idx;
    }
  }
}
