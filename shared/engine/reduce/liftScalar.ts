import type { BasedComplex } from '../based/BasedComplex';
import { scalarMat, type Mat } from '../based/Mat';
import type { Field } from '../fields/Field';
import { reduceMod } from './reduceMod';
import { CRITICAL, type Matching } from './matchCells';
import type { MorseEntries } from './MorseEntries';

/**
 * The lift of {@link liftCoboundary} for a degree whose every block is λ·I,
 * in the reals or a prime field small enough for exact doubles: the usual
 * case of a constant or locally constant sheaf.
 *
 * Coordinates never mix, so a cell carries one value per critical column
 * instead of one per coordinate, and each entry's signed scalar is read from
 * a table by block id: a pair's step is a few multiply-adds over its row.
 * Returns undefined when a block is not scalar or sums could leave the
 * exact range, and the general lift takes over.
 */
export function liftScalar(X: BasedComplex<number>, mt: Matching, k: number): MorseEntries<number> | undefined {
  const F = X.field as Field<number>;
  const real = F.kind === 'real';
  if (!real && F.kind !== 'prime') return undefined;
  const p = real ? 0 : F.modulus;
  const cob = X.cob[k];
  const { rowPtr, col, block, sign } = cob;
  // Signed scalar of each block id, and the factor −(sign·λ)⁻¹ a matched block solves with.
  const nb = X.blocks.length;
  const pos = new Float64Array(nb);
  const neg = new Float64Array(nb);
  const solvePos = new Float64Array(nb);
  const solveNeg = new Float64Array(nb);
  const scalar = new Uint8Array(nb);
  let allScalar = true;
  for (let b = 0; b < nb; b++) {
    const M = X.blocks[b];
    if (M.scalar === undefined) {
      allScalar = false;
      continue;
    }
    const s = M.scalar;
    scalar[b] = 1;
    pos[b] = s;
    neg[b] = F.neg(s);
    if (!F.isZero(s)) {
      const inv = F.inv(s);
      solvePos[b] = F.neg(inv);
      solveNeg[b] = inv;
    }
  }
  let widest = 0;
  for (let t = 0; t + 1 < rowPtr.length; t++) {
    const w = rowPtr[t + 1] - rowPtr[t];
    if (w > widest) widest = w;
  }
  // Blocks are shared by id: only a complex holding some non-scalar block needs its entries checked.
  if (!allScalar) for (let e = 0; e < block.length; e++) if (block[e] >= 0 && !scalar[block[e]]) return undefined;
  // A row's products are summed before one reduction: they must stay exact.
  if (p > 0 && (p >= 2 ** 26 || p * p * widest >= 2 ** 53)) return undefined;

  const { offset } = mt.index;
  const dims = X.dims[k];
  const base = offset[k];
  const critical: number[] = [];
  for (let c = 0; c < dims.length; c++) if (dims[c] > 0 && mt.state[base + c] === CRITICAL) critical.push(c);
  const m = critical.length;
  const out: MorseEntries<number> = { rows: [], cols: [], mats: [] };
  if (m === 0) return out;
  const x = new Float64Array(dims.length * m);
  critical.forEach((c, j) => {
    x[c * m + j] = 1;
  });
  const invP = p > 0 ? 1 / p : 0;
  const sigma = mt.pairSigma[k];
  const tau = mt.pairTau[k];
  const kind = mt.pairKind[k];
  const entryOf = mt.pairEntry[k];
  const r = new Float64Array(m);

  /** x_σ = −(sign·λ)⁻¹ Σ_{α≠σ} δ(α→τ) x_α for the pair i. */
  const step = (i: number) => {
    const t = tau[i];
    const pivot = entryOf[i];
    const end = rowPtr[t + 1];
    const bp = block[pivot];
    const f = sign[pivot] < 0 ? solveNeg[bp] : solvePos[bp];
    const to = sigma[i] * m;
    if (m === 1) {
      let acc = 0;
      for (let e = rowPtr[t]; e < end; e++) {
        const b = block[e];
        if (b < 0 || e === pivot) continue;
        acc += (sign[e] < 0 ? neg[b] : pos[b]) * x[col[e]];
      }
      x[to] = p > 0 ? reduceMod(reduceMod(acc, p, invP) * f, p, invP) : acc * f;
      return;
    }
    if (m === 2) {
      // Two columns (a torus's two independent loops, say): kept in registers.
      let a0 = 0;
      let a1 = 0;
      for (let e = rowPtr[t]; e < end; e++) {
        const b = block[e];
        if (b < 0 || e === pivot) continue;
        const c = sign[e] < 0 ? neg[b] : pos[b];
        const from = 2 * col[e];
        a0 += c * x[from];
        a1 += c * x[from + 1];
      }
      if (p > 0) {
        x[to] = reduceMod(reduceMod(a0, p, invP) * f, p, invP);
        x[to + 1] = reduceMod(reduceMod(a1, p, invP) * f, p, invP);
      } else {
        x[to] = a0 * f;
        x[to + 1] = a1 * f;
      }
      return;
    }
    r.fill(0);
    for (let e = rowPtr[t]; e < end; e++) {
      const b = block[e];
      if (b < 0 || e === pivot) continue;
      const c = sign[e] < 0 ? neg[b] : pos[b];
      const from = col[e] * m;
      for (let j = 0; j < m; j++) r[j] += c * x[from + j];
    }
    if (p > 0) for (let j = 0; j < m; j++) x[to + j] = reduceMod(reduceMod(r[j], p, invP) * f, p, invP);
    else for (let j = 0; j < m; j++) x[to + j] = r[j] * f;
  };
  for (let i = 0; i < sigma.length; i++) if (kind[i] === 0) step(i);
  for (let i = sigma.length - 1; i >= 0; i--) if (kind[i] === 1) step(i);

  // δ_M on the critical (k+1)-cells: one scalar block per critical column reached.
  const up = X.dims[k + 1];
  const upBase = offset[k + 1];
  for (let t = 0; t < up.length; t++) {
    if (mt.state[upBase + t] !== CRITICAL) continue;
    r.fill(0);
    for (let e = rowPtr[t]; e < rowPtr[t + 1]; e++) {
      const b = block[e];
      if (b < 0) continue;
      const c = sign[e] < 0 ? neg[b] : pos[b];
      const from = col[e] * m;
      for (let j = 0; j < m; j++) r[j] += c * x[from + j];
    }
    for (let j = 0; j < m; j++) {
      const v = p > 0 ? reduceMod(r[j], p, invP) : r[j];
      const mat: Mat<number> = scalarMat(up[t], v);
      if (F.negligible(v, mt.scale[k])) continue;
      out.rows.push(upBase + t);
      out.cols.push(base + critical[j]);
      out.mats.push(mat);
    }
  }
  return out;
}
