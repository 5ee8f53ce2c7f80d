/**
 * LDLᵀ of the remaining unknowns `rest` as a dense matrix, in their given
 * order: no pivoting is needed for a semidefinite matrix, and a zero pivot
 * leaves a zero row (within rounding). Rows of the dense block are scanned
 * in memory order in the update, which is why it beats the sparse rows once
 * they are this full.
 */
export function denseTail(rest: number[], idx: Int32Array[], val: Float64Array[], len: Int32Array, diag: Float64Array, original: Float64Array, tol: number) {
  const R = rest.length;
  const local = new Map(rest.map((node, k) => [node, k]));
  const D = new Float64Array(R * R);
  rest.forEach((node, r) => {
    D[r * R + r] = diag[node];
    for (let e = 0; e < len[node]; e++) D[r * R + local.get(idx[node][e])!] += val[node][e];
  });
  const pivot = new Float64Array(R);
  const ptr = new Int32Array(R + 1);
  const entries: number[] = [];
  const values: number[] = [];
  let smallest = Infinity;
  let indefinite = false;
  for (let s = 0; s < R; s++) {
    const d = D[s * R + s];
    const scale = Math.max(Math.abs(original[rest[s]]), Number.MIN_VALUE);
    if (d <= tol * scale) {
      if (d < -tol * scale) indefinite = true;
      ptr[s + 1] = entries.length;
      continue;
    }
    pivot[s] = d;
    smallest = Math.min(smallest, d / scale);
    for (let r = s + 1; r < R; r++) {
      const a = D[r * R + s];
      // Zeros are kept in L: the block is structurally full, and the selected
      // inverse relies on every later pair of a column being on the pattern.
      entries.push(r);
      values.push(a / d);
      if (a === 0) continue;
      const f = a / d;
      const row = r * R;
      const prow = s * R;
      for (let c = s + 1; c < R; c++) D[row + c] -= f * D[prow + c];
    }
    ptr[s + 1] = entries.length;
  }
  return { pivot, ptr, entries: Int32Array.from(entries), values: Float64Array.from(values), smallest, indefinite };
}
