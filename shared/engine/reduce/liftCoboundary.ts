import { cellOffsets, type BasedComplex } from '../based/BasedComplex';
import { invert, isZeroMat, denseMat, type Mat } from '../based/Mat';
import type { Field, Vec } from '../fields/Field';
import { CRITICAL, type Matching } from './matchCells';
import type { MorseEntries } from './MorseEntries';

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
  const inverses = new Map<number, Mat<E>>();
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
    const b = cob.block[pivot];
    let inv = inverses.get(b);
    if (!inv) {
      const found = invert(F, X.blocks[b], pivotRatio);
      if (!found) throw new Error('internal check failed: a matched block is not invertible');
      inv = found.inv;
      inverses.set(b, inv);
    }
    // x_σ = −(sign·M)⁻¹ r
    const base = off[s] * m;
    for (let q = 0; q < dims[s] * m; q++) x[base + q] = F.zero;
    addProduct(F, x, base, inv, cob.sign[pivot] > 0 ? -1 : 1, r, 0, m);
  };
  for (let i = 0; i < sigma.length; i++) if (kind[i] === 0) solve(i);
  for (let i = sigma.length - 1; i >= 0; i--) if (kind[i] === 1) solve(i);

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
