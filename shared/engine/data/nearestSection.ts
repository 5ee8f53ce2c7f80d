import { cellOffsets } from '../based/BasedComplex';
import type { Computation } from '../computeCohomology';
import type { Sheaf } from '../model/Sheaf';
import { CellRestriction } from './CellRestriction';
import { DenseQR } from './DenseQR';
import { orthonormalise } from './orthonormalise';
import type { Readings } from './Readings';
import { realSections } from './realSections';

export interface NearestSection {
  /** dim H^0: the number of free parameters of a global section. */
  dimH0: number;
  /** The fitted global section on the vertices (flat C^0, stalk coordinates of each vertex in turn). */
  section: Float64Array;
  /** Its value on each assigned cell, laid out like `readings.value`. */
  fitted: Float64Array;
  /** reading − fitted, laid out like `readings.value`. */
  residual: Float64Array;
  /** ‖residual‖ per reading entry: which sensor or station disagrees, and by how much. */
  residualNorm: Float64Array;
  /** √(Σ w‖r‖² / Σ w) over the entries. */
  weightedRms: number;
  /** False when the readings do not pin the section down (it is then one of many equally good fits). */
  determined: boolean;
}

/**
 * The global section nearest to the readings in the weighted least-squares
 * sense, min Σ w_σ ‖s(σ) − a(σ)‖², where s(τ) = F(v ≤ τ) s(v) for any vertex
 * v of τ (engine-notes, "Data on a sheaf"). Solved on an orthonormal basis of
 * H^0 (dim H^0 unknowns) by QR with column pivoting; with too few readings
 * the basic solution is returned and `determined` is false.
 */
export function nearestSection(sheaf: Sheaf<unknown>, readings: Readings, options: { run?: Computation<unknown> } = {}): NearestSection {
  const basis = orthonormalise(realSections(sheaf, 0, options.run));
  const h = basis.length;
  const R = new CellRestriction(sheaf);
  const vOff = cellOffsets(sheaf.stalkDims[0]);
  const rows = readings.value.length;
  const n = readings.cell.length;
  // Value of basis vector b on the cell of entry i: F(v0 ≤ τ) b(v0).
  const valueOn = (b: Float64Array, i: number): Float64Array => {
    const k = readings.degree[i];
    const c = readings.cell[i];
    const v0 = k === 0 ? c : sheaf.complex.simplices[k].vertex(c, 0);
    const xv = b.subarray(vOff[v0], vOff[v0 + 1]);
    return k === 0 ? Float64Array.from(xv) : R.fromFirstVertex(k, c, xv);
  };
  const design = new Float64Array(rows * h);
  for (let j = 0; j < h; j++) {
    for (let i = 0; i < n; i++) {
      const vals = valueOn(basis[j], i);
      const sw = Math.sqrt(readings.weight[i]);
      for (let q = 0; q < vals.length; q++) design[(readings.offset[i] + q) * h + j] = sw * vals[q];
    }
  }
  const rhs = new Float64Array(rows);
  for (let i = 0; i < n; i++) {
    const sw = Math.sqrt(readings.weight[i]);
    for (let q = readings.offset[i]; q < readings.offset[i + 1]; q++) rhs[q] = sw * readings.value[q];
  }
  let coeffs: Float64Array = new Float64Array(h);
  let determined = h === 0;
  if (h > 0 && rows > 0) {
    const qr = new DenseQR(design, rows, h);
    coeffs = qr.solve(rhs);
    determined = qr.isFullRank();
  }
  const section = new Float64Array(vOff[vOff.length - 1]);
  for (let j = 0; j < h; j++) for (let t = 0; t < section.length; t++) section[t] += coeffs[j] * basis[j][t];
  const fitted = new Float64Array(rows);
  const residual = new Float64Array(rows);
  const residualNorm = new Float64Array(n);
  let wss = 0;
  let wsum = 0;
  for (let i = 0; i < n; i++) {
    const vals = valueOn(section, i);
    let sq = 0;
    for (let q = 0; q < vals.length; q++) {
      const at = readings.offset[i] + q;
      fitted[at] = vals[q];
      residual[at] = readings.value[at] - vals[q];
      sq += residual[at] ** 2;
    }
    residualNorm[i] = Math.sqrt(sq);
    wss += readings.weight[i] * sq;
    wsum += readings.weight[i];
  }
  return { dimH0: h, section, fitted, residual, residualNorm, weightedRms: wsum > 0 ? Math.sqrt(wss / wsum) : 0, determined };
}
