import { cellOffsets } from '../based/BasedComplex';
import type { Mat } from '../based/Mat';
import { matchedInverses } from './matchedInverses';
import type { Vec } from '../fields/Field';
import type { Round } from './Round';

/**
 * Lift a degree-k cochain of a round's Morse complex to its input complex:
 * the chain map x ↦ (x on critical cells, x_σ = −B⁻¹·Σ δ(α→τ)·x_α on each
 * matched σ, 0 on each matched τ), i.e. −A⁻¹δ(C→T)x with A the matched part
 * of the coboundary (Sköldberg 2006). A is triangular in the order the pairs
 * were made: coreduction pairs only see earlier pairs and reduction pairs
 * only later ones, so one forward sweep then one backward sweep solve it.
 */
export function liftCochain<E>(round: Round<E>, k: number, x: Vec<E>, pivotRatio: number): Vec<E> {
  const X = round.input;
  const F = X.field;
  const off = cellOffsets(X.dims[k]);
  const outOff = cellOffsets(round.output.dims[k]);
  const y = F.newVec(off[off.length - 1]);
  const crit = round.critical[k];
  for (let j = 0; j < crit.length; j++) {
    const c = crit[j];
    for (let i = 0; i < X.dims[k][c]; i++) y[off[c] + i] = x[outOff[j] + i];
  }
  if (k + 1 >= X.dims.length) return y;
  const cob = X.cob[k];
  const sigma = round.pairSigma[k];
  const tau = round.pairTau[k];
  const kind = round.pairKind[k];
  const inverseOf = matchedInverses(X, pivotRatio);
  let widest = 0;
  for (const d of [X.dims[k], X.dims[k + 1]]) for (let i = 0; i < d.length; i++) widest = Math.max(widest, d[i]);
  // Scratch reused across pairs: a lift visits every pair, so per-pair vectors would dominate.
  const r = F.newVec(widest);
  const tmp = F.newVec(widest);
  const solve = (i: number) => {
    const s = sigma[i];
    const t = tau[i];
    const dt = X.dims[k + 1][t];
    for (let q = 0; q < dt; q++) r[q] = F.zero;
    let pivot = -1;
    for (let e = cob.rowPtr[t]; e < cob.rowPtr[t + 1]; e++) {
      const b = cob.block[e];
      if (b < 0) continue;
      const a = cob.col[e];
      if (a === s) {
        pivot = e;
        continue;
      }
      accumulate(F, r, X.blocks[b], cob.sign[e], y, off[a]);
    }
    const inv = inverseOf(cob.block[pivot]);
    // x_σ = −(sign·M)⁻¹ r = −sign · M⁻¹ r
    const ds = X.dims[k][s];
    for (let q = 0; q < ds; q++) tmp[q] = F.zero;
    accumulate(F, tmp, inv, cob.sign[pivot] > 0 ? -1 : 1, r, 0);
    for (let i2 = 0; i2 < ds; i2++) y[off[s] + i2] = tmp[i2];
  };
  for (let i = 0; i < sigma.length; i++) if (kind[i] === 0) solve(i);
  for (let i = sigma.length - 1; i >= 0; i--) if (kind[i] === 1) solve(i);
  return y;
}

/** out += sign · M · v[from ..] */
export function accumulate<E>(F: { add(a: E, b: E): E; sub(a: E, b: E): E; mul(a: E, b: E): E; isZero(a: E): boolean }, out: Vec<E>, M: Mat<E>, sign: number, v: Vec<E>, from: number): void {
  if (M.scalar !== undefined) {
    for (let i = 0; i < M.rows; i++) {
      const p = F.mul(M.scalar, v[from + i]);
      out[i] = sign > 0 ? F.add(out[i], p) : F.sub(out[i], p);
    }
    return;
  }
  for (let i = 0; i < M.rows; i++) {
    let acc = out[i];
    for (let j = 0; j < M.cols; j++) {
      const m = M.data[i * M.cols + j];
      if (F.isZero(m)) continue;
      const p = F.mul(m, v[from + j]);
      acc = sign > 0 ? F.add(acc, p) : F.sub(acc, p);
    }
    out[i] = acc;
  }
}
