import { cellOffsets, type BasedComplex } from '../based/BasedComplex';
import { isZeroMat, denseMat, scalarMat, type Mat } from '../based/Mat';
import { matchedInverses } from './matchedInverses';
import type { Field, Vec } from '../fields/Field';
import { CRITICAL, type Matching } from './matchCells';
import type { MorseEntries } from './MorseEntries';
import { liftScalar } from './liftScalar';
import { reduceMod } from './reduceMod';

/**
 * The Morse coboundary δ_M^k by lifting: for the critical k-cells taken
 * together as the m columns of one block cochain, X = ι(unit columns) is the
 * lift of {@link liftCochain} (critical cells carry the unit columns, each
 * matched σ solves its τ's row, matched τ's are zero), and
 * δ_M^k = (δ^k X) read on the critical (k+1)-cells (Sköldberg 2006).
 *
 * Work is a few sequential sweeps over contiguous arrays, m columns at a
 * time, so it suits few critical cells spread over a large flow (the usual
 * case of a constant sheaf); {@link replayCoboundary} suits the opposite.
 */
export function liftCoboundary<E>(X: BasedComplex<E>, mt: Matching, k: number, pivotRatio: number): MorseEntries<E> {
  if (X.field.kind === 'real' || X.field.kind === 'prime') {
    const fast = liftScalar(X as unknown as BasedComplex<number>, mt, k);
    if (fast) return fast as unknown as MorseEntries<E>;
  }
  const scalar = scalarShadow(X, k);
  if (!scalar) return liftBlocks(X, mt, k, pivotRatio);
  // Every block of δ^k is λ·I: coordinates never mix, so one lift of the
  // one-dimensional shadow serves all d coordinates (d times fewer columns,
  // d² times less memory traffic) and the Morse blocks stay scalar.
  const shadow = liftBlocks(scalar, mt, k, pivotRatio);
  const F = X.field;
  const { offset } = mt.index;
  const out: MorseEntries<E> = { rows: [], cols: [], mats: [] };
  shadow.rows.forEach((g, i) => {
    const c = shadow.cols[i];
    const d = X.dims[k + 1][g - offset[k + 1]];
    if (d !== X.dims[k][c - offset[k]]) throw new Error('internal check failed: a scalar path joins stalks of different dimension');
    out.rows.push(g);
    out.cols.push(c);
    out.mats.push(scalarMat(d, shadow.mats[i].scalar ?? (shadow.mats[i].data[0] as E)));
  });
  void F;
  return out;
}

/** δ^k with every cell one-dimensional and every block its scalar, when all blocks of δ^k are scalar. */
function scalarShadow<E>(X: BasedComplex<E>, k: number): BasedComplex<E> | undefined {
  const cob = X.cob[k];
  // Block ids keep their meaning: each scalar block becomes its 1×1 shadow.
  let anyWide = false;
  for (let e = 0; e < cob.block.length; e++) {
    const b = cob.block[e];
    if (b < 0) continue;
    const M = X.blocks[b];
    if (M.scalar === undefined) return undefined;
    if (M.rows > 1) anyWide = true;
  }
  if (!anyWide) return undefined;
  const blocks = X.blocks.map((M) => (M.scalar !== undefined ? scalarMat(1, M.scalar) : M));
  const block = cob.block;
  const ones = (d: Int32Array) => {
    const out = new Int32Array(d.length);
    for (let i = 0; i < d.length; i++) out[i] = d[i] > 0 ? 1 : 0;
    return out;
  };
  const dims = X.dims.map((d, j) => (j === k || j === k + 1 ? ones(d) : d));
  const cobs = X.cob.map((c, j) => (j === k ? { ...c, block } : c));
  return { field: X.field, dims, cob: cobs, blocks };
}

function liftBlocks<E>(X: BasedComplex<E>, mt: Matching, k: number, pivotRatio: number): MorseEntries<E> {
  const F = X.field;
  const { offset } = mt.index;
  const dims = X.dims[k];
  const off = cellOffsets(dims);
  const critical: number[] = [];
  const critCol: number[] = [];
  let m = 0;
  for (let c = 0; c < dims.length; c++) {
    if (mt.state[offset[k] + c] === CRITICAL) {
      critical.push(c);
      critCol.push(m);
      m += dims[c];
    }
  }
  const out: MorseEntries<E> = { rows: [], cols: [], mats: [] };
  if (m === 0) return out;
  // Row-major: coordinate i of the flat cochain holds its m column values at i*m.
  const x = F.newVec(off[off.length - 1] * m);
  critical.forEach((c, j) => {
    for (let i = 0; i < dims[c]; i++) x[(off[c] + i) * m + critCol[j] + i] = F.one;
  });
  const cob = X.cob[k];
  const sigma = mt.pairSigma[k];
  const tau = mt.pairTau[k];
  const kind = mt.pairKind[k];
  const entryOf = mt.pairEntry[k];
  const up = X.dims[k + 1];
  let maxUp = 0;
  for (let t = 0; t < up.length; t++) maxUp = Math.max(maxUp, up[t]);
  const r = F.newVec(maxUp * m);
  const inverseOf = matchedInverses(X, pivotRatio);
  const solve = (i: number) => {
    const s = sigma[i];
    const t = tau[i];
    const dt = up[t];
    for (let q = 0; q < dt * m; q++) r[q] = F.zero;
    const pivot = entryOf[i];
    for (let e = cob.rowPtr[t]; e < cob.rowPtr[t + 1]; e++) {
      const b = cob.block[e];
      if (b < 0 || e === pivot) continue;
      addProduct(F, r, 0, X.blocks[b], cob.sign[e], x, off[cob.col[e]] * m, m);
    }
    const inv = inverseOf(cob.block[pivot]);
    // x_σ = −(sign·M)⁻¹ r
    const base = off[s] * m;
    for (let q = 0; q < dims[s] * m; q++) x[base + q] = F.zero;
    addProduct(F, x, base, inv, cob.sign[pivot] > 0 ? -1 : 1, r, 0, m);
  };
  const fast = numberKernel(F, X, k);
  if (fast >= 0) {
    const numberInverse = inverseOf as unknown as (b: number) => Mat<number>;
    const step = (i: number) =>
      solveNumbers(fast, X as unknown as BasedComplex<number>, k, sigma[i], tau[i], entryOf[i], off, m, x as unknown as Float64Array, r as unknown as Float64Array, numberInverse);
    for (let i = 0; i < sigma.length; i++) if (kind[i] === 0) step(i);
    for (let i = sigma.length - 1; i >= 0; i--) if (kind[i] === 1) step(i);
  } else {
    for (let i = 0; i < sigma.length; i++) if (kind[i] === 0) solve(i);
    for (let i = sigma.length - 1; i >= 0; i--) if (kind[i] === 1) solve(i);
  }

  for (let t = 0; t < up.length; t++) {
    const g = offset[k + 1] + t;
    if (mt.state[g] !== CRITICAL) continue;
    const dt = up[t];
    for (let q = 0; q < dt * m; q++) r[q] = F.zero;
    for (let e = cob.rowPtr[t]; e < cob.rowPtr[t + 1]; e++) {
      const b = cob.block[e];
      if (b >= 0) addProduct(F, r, 0, X.blocks[b], cob.sign[e], x, off[cob.col[e]] * m, m);
    }
    critical.forEach((c, j) => {
      const dc = dims[c];
      const data = F.newVec(dt * dc);
      for (let p = 0; p < dt; p++) for (let q = 0; q < dc; q++) data[p * dc + q] = r[p * m + critCol[j] + q];
      const mat = denseMat(dt, dc, data);
      if (isZeroMat(F, mat, mt.scale[k])) return;
      out.rows.push(g);
      out.cols.push(offset[k] + c);
      out.mats.push(mat);
    });
  }
  return out;
}

/** out[o + p*m + j] += sign · Σ_q M[p][q] · v[from + q*m + j], for the m columns j. */
function addProduct<E>(F: Field<E>, out: Vec<E>, o: number, M: Mat<E>, sign: number, v: Vec<E>, from: number, m: number): void {
  // The hot kernel of every lift: inline the arithmetic of the number fields.
  if (F.kind === 'real' || (F.modulus > 0 && F.modulus < 2 ** 26)) {
    addProductNumbers(F.modulus, out as unknown as Float64Array, o, M as unknown as Mat<number>, sign, v as unknown as Float64Array, from, m);
    return;
  }
  if (M.scalar !== undefined) {
    const s = sign > 0 ? M.scalar : F.neg(M.scalar);
    const n = M.rows * m;
    for (let q = 0; q < n; q++) {
      const a = v[from + q];
      if (!F.isZero(a)) out[o + q] = F.add(out[o + q], F.mul(s, a));
    }
    return;
  }
  for (let p = 0; p < M.rows; p++) {
    for (let q = 0; q < M.cols; q++) {
      let a = M.data[p * M.cols + q];
      if (F.isZero(a)) continue;
      if (sign < 0) a = F.neg(a);
      const vo = from + q * m;
      const oo = o + p * m;
      for (let j = 0; j < m; j++) {
        const b = v[vo + j];
        if (!F.isZero(b)) out[oo + j] = F.add(out[oo + j], F.mul(a, b));
      }
    }
  }
}

/** {@link addProduct} on Float64Arrays: plain floats when p = 0, residues mod p (< 2^26, so products stay exact) otherwise. */
function addProductNumbers(p: number, out: Float64Array, o: number, M: Mat<number>, sign: number, v: Float64Array, from: number, m: number): void {
  if (M.scalar !== undefined) {
    let s = M.scalar;
    if (sign < 0) s = p > 0 ? (s === 0 ? 0 : p - s) : -s;
    const n = M.rows * m;
    if (p === 0) {
      for (let q = 0; q < n; q++) out[o + q] += s * v[from + q];
    } else {
      for (let q = 0; q < n; q++) out[o + q] = (out[o + q] + s * v[from + q]) % p;
    }
    return;
  }
  for (let r = 0; r < M.rows; r++) {
    for (let q = 0; q < M.cols; q++) {
      let a = M.data[r * M.cols + q];
      if (a === 0) continue;
      if (sign < 0) a = p > 0 ? p - a : -a;
      const vo = from + q * m;
      const oo = o + r * m;
      if (p === 0) {
        for (let j = 0; j < m; j++) out[oo + j] += a * v[vo + j];
      } else {
        for (let j = 0; j < m; j++) out[oo + j] = (out[oo + j] + a * v[vo + j]) % p;
      }
    }
  }
}

/**
 * The modulus for the inlined kernel (0 for the reals), or -1 when the
 * field needs the generic path. In GF(p) sums are reduced once per row, so
 * a row's products must add up below 2^53 without reduction.
 */
function numberKernel<E>(F: Field<E>, X: BasedComplex<E>, k: number): number {
  if (F.kind === 'real') return 0;
  if (F.kind !== 'prime') return -1;
  const p = F.modulus;
  const cob = X.cob[k];
  let widest = 0;
  for (let t = 0; t + 1 < cob.rowPtr.length; t++) widest = Math.max(widest, cob.rowPtr[t + 1] - cob.rowPtr[t]);
  let maxDim = 1;
  for (const d of X.dims) for (let i = 0; i < d.length; i++) if (d[i] > maxDim) maxDim = d[i];
  return p * p * widest * maxDim < 2 ** 53 ? p : -1;
}

/** One lift step on Float64Arrays: x_σ = −(sign·B)⁻¹ · Σ_{α≠σ} δ(α→τ)·x_α for all m columns. */
function solveNumbers(
  p: number,
  X: BasedComplex<number>,
  k: number,
  s: number,
  t: number,
  pivot: number,
  off: Int32Array,
  m: number,
  x: Float64Array,
  r: Float64Array,
  inverseOf: (b: number) => Mat<number>,
): void {
  const cob = X.cob[k];
  const n = X.dims[k + 1][t] * m;
  const invP = p > 0 ? 1 / p : 0;
  r.fill(0, 0, n);
  for (let e = cob.rowPtr[t]; e < cob.rowPtr[t + 1]; e++) {
    const b = cob.block[e];
    if (b < 0 || e === pivot) continue;
    const M = X.blocks[b];
    const negative = cob.sign[e] < 0;
    const from = off[cob.col[e]] * m;
    if (M.scalar !== undefined) {
      const c = negative ? (p > 0 ? (p - M.scalar) % p : -M.scalar) : M.scalar;
      if (c === 0) continue;
      for (let q = 0; q < n; q++) r[q] += c * x[from + q];
    } else {
      for (let row = 0; row < M.rows; row++) {
        for (let col = 0; col < M.cols; col++) {
          let a = M.data[row * M.cols + col];
          if (a === 0) continue;
          if (negative) a = p > 0 ? p - a : -a;
          const vo = from + col * m;
          const oo = row * m;
          for (let j = 0; j < m; j++) r[oo + j] += a * x[vo + j];
        }
      }
    }
  }
  if (p > 0) for (let q = 0; q < n; q++) r[q] = reduceMod(r[q], p, invP);
  const inv = inverseOf(cob.block[pivot]);
  // x_σ = −sign · B⁻¹ r
  const flip = cob.sign[pivot] > 0;
  const base = off[s] * m;
  const ns = X.dims[k][s] * m;
  if (inv.scalar !== undefined) {
    const c = flip ? (p > 0 ? (p - inv.scalar) % p : -inv.scalar) : inv.scalar;
    if (p > 0) for (let q = 0; q < ns; q++) x[base + q] = reduceMod(c * r[q], p, invP);
    else for (let q = 0; q < ns; q++) x[base + q] = c * r[q];
    return;
  }
  x.fill(0, base, base + ns);
  for (let row = 0; row < inv.rows; row++) {
    for (let col = 0; col < inv.cols; col++) {
      let a = inv.data[row * inv.cols + col];
      if (a === 0) continue;
      if (flip) a = p > 0 ? p - a : -a;
      const oo = base + row * m;
      const vo = col * m;
      for (let j = 0; j < m; j++) x[oo + j] += a * r[vo + j];
    }
  }
  if (p > 0) for (let q = 0; q < ns; q++) x[base + q] = reduceMod(x[base + q], p, invP);
}
