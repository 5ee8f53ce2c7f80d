import { symmetricEigen } from './symmetricEigen';

/** Euclidean inner product. */
export function dot(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}

export function norm(a: ArrayLike<number>): number {
  return Math.sqrt(dot(a, a));
}

/**
 * An orthonormal basis of the span of `vectors` by modified Gram–Schmidt,
 * applied twice ("twice is enough", Parlett). A vector whose remainder is
 * at most `tolerance` times its own norm is dependent and dropped.
 */
export function orthonormalise(vectors: ArrayLike<number>[], tolerance = 1e-10): Float64Array[] {
  const out: Float64Array[] = [];
  for (const v of vectors) {
    const w = Float64Array.from(v);
    const before = norm(w);
    if (before === 0) continue;
    for (let pass = 0; pass < 2; pass++) {
      for (const q of out) {
        const f = dot(q, w);
        for (let i = 0; i < w.length; i++) w[i] -= f * q[i];
      }
    }
    const after = norm(w);
    if (after <= tolerance * before) continue;
    for (let i = 0; i < w.length; i++) w[i] /= after;
    out.push(w);
  }
  return out;
}

/** v minus its orthogonal projection on the orthonormal vectors `basis`, twice for stability. */
export function projectOut(v: ArrayLike<number>, basis: ArrayLike<number>[]): Float64Array {
  const w = Float64Array.from(v);
  for (let pass = 0; pass < 2; pass++) {
    for (const q of basis) {
      const f = dot(q, w);
      for (let i = 0; i < w.length; i++) w[i] -= f * q[i];
    }
  }
  return w;
}

/**
 * An orthonormal basis of the `count`-dimensional subspace that best
 * represents the span of `vectors` (its principal directions, from the
 * eigenvectors of their Gram matrix). Used where the dimension is known
 * exactly from the cohomology and only the basis is numerical.
 */
export function principalBasis(vectors: ArrayLike<number>[], count: number): Float64Array[] {
  const k = vectors.length;
  if (count > k) throw new RangeError(`cannot take ${count} directions from ${k} vectors`);
  if (count === 0) return [];
  const n = vectors[0].length;
  const G = new Float64Array(k * k);
  for (let i = 0; i < k; i++) for (let j = i; j < k; j++) G[i * k + j] = G[j * k + i] = dot(vectors[i], vectors[j]);
  const { values, vectors: V } = symmetricEigen(G, k);
  const out: Float64Array[] = [];
  for (let c = k - 1; c >= k - count; c--) {
    const w = new Float64Array(n);
    for (let i = 0; i < k; i++) {
      const f = V[i * k + c];
      if (f === 0) continue;
      const v = vectors[i];
      for (let t = 0; t < n; t++) w[t] += f * v[t];
    }
    const len = norm(w);
    if (len > 0 && values[c] > 0) for (let t = 0; t < n; t++) w[t] /= len;
    out.push(w);
  }
  return orthonormalise(out, 0);
}
