import { cellOffsets } from '../based/BasedComplex';
import type { Sheaf } from '../model/Sheaf';
import { coboundaryMatrix } from './coboundaryMatrix';
import type { CsrMatrix } from './CsrMatrix';
import { csrFromTriplets, csrMatTVec, csrMatVec, csrMaxAbs, csrMultiply, csrTranspose } from './CsrMatrix';
import { removeCoboundaries } from './harmonicRepresentatives';
import { norm } from './orthonormalise';
import { SelectedInverse } from './SelectedInverse';
import { SparseCholesky } from './SparseCholesky';

/** Observations on edges: a 1-cochain with a weight per edge, and optional known vertex values. */
export interface EdgeObservations {
  /** b, flat over the edges in the complex's order (each edge's stalk coordinates in turn). */
  values: ArrayLike<number>;
  /** Weight of each edge's observation (per edge cell); 0 leaves the edge unobserved. */
  weights: ArrayLike<number>;
  /** Vertices held at known values (benchmarks, supports), by dense vertex index. */
  fixed?: { vertex: number; value: ArrayLike<number> }[];
}

export interface Adjustment {
  /** x̂ on the vertices (flat C^0); fixed vertices keep their values. */
  x: Float64Array;
  /** b − δ⁰x̂ on observed edges, 0 on the others. */
  residual: Float64Array;
  /** Observed coordinates, free unknowns, and the rank of the design δ⁰ on the free unknowns. */
  observations: number;
  unknowns: number;
  rank: number;
  /** Degrees of freedom (redundancy) = observations − rank. */
  dof: number;
  /** vᵀWv, the weighted sum of squared residuals. */
  weightedSquares: number;
  /** A-posteriori standard deviation of unit weight √(vᵀWv / dof); undefined when dof = 0. */
  sigma0: number | undefined;
  /** Vertices with a free coordinate the observations and fixed values do not determine. */
  undetermined: Int32Array;
  /**
   * The part of b no x can explain, as its class in H^1: the harmonic
   * representative (orthogonal to every coboundary). Present when every
   * edge is observed. `cocycle` is false when δ¹b ≠ 0 (triangles whose
   * edges disagree), and then b has no class.
   */
  unexplained?: { harmonic: Float64Array; norm: number; cocycle: boolean };
  /**
   * Per observed coordinate r, the cofactor of the adjusted observation
   * (A Q_x̂x̂ Aᵀ)_rr with Q_x̂x̂ = (AᵀWA)⁻¹ over the free unknowns; 0 on
   * unobserved ones. Its residual's cofactor is 1/w_r minus this, and the
   * redundancy number is 1 − w_r times this (common practice in adjustment
   * computations). Present with the `cofactors` option when every free
   * unknown is determined.
   */
  adjustedCofactor?: Float64Array;
}

export interface AdjustOptions {
  /** Compute the class of b in H^1 (one more factorisation, of the unweighted Laplacian); default true. */
  unexplained?: boolean;
  /** Compute {@link Adjustment.adjustedCofactor} from the entries of (AᵀWA)⁻¹ on its pattern; default false. */
  cofactors?: boolean;
}

/**
 * Weighted least-squares adjustment of observations on edges: x̂ minimising
 * ‖W^½(δ⁰x − b)‖² over the free vertex coordinates (engine-notes, "Data on a
 * sheaf"), by a sparse LDLᵀ factorisation of the normal matrix δ⁰ᵀWδ⁰.
 * Residuals, redundancy and σ0 follow common practice in adjustment
 * computations (e.g. Ghilani, Adjustment Computations, from memory).
 */
export function adjustObservations(sheaf: Sheaf<unknown>, obs: EdgeObservations, options: AdjustOptions = {}): Adjustment {
  if (sheaf.complex.dimension < 1) throw new RangeError('observations on edges need a complex with edges');
  const D = coboundaryMatrix(sheaf, 0);
  const edgeOff = cellOffsets(sheaf.stalkDims[1]);
  const vertOff = cellOffsets(sheaf.stalkDims[0]);
  const m = D.rows;
  const n = D.cols;
  if (obs.values.length !== m) throw new RangeError(`observations have ${obs.values.length} coordinates, the edges ${m}`);
  if (obs.weights.length !== edgeOff.length - 1) throw new RangeError(`weights has ${obs.weights.length} entries, there are ${edgeOff.length - 1} edges`);
  const rowWeight = new Float64Array(m);
  let observations = 0;
  for (let e = 0; e + 1 < edgeOff.length; e++) {
    const w = obs.weights[e];
    if (!(w >= 0) || !Number.isFinite(w)) throw new RangeError(`weight ${w} of edge ${e} must be a non-negative number`);
    for (let q = edgeOff[e]; q < edgeOff[e + 1]; q++) rowWeight[q] = w;
    if (w > 0) observations += edgeOff[e + 1] - edgeOff[e];
  }
  const x = new Float64Array(n);
  const isFixed = new Uint8Array(n);
  for (const f of obs.fixed ?? []) {
    const d = vertOff[f.vertex + 1] - vertOff[f.vertex];
    if (f.value.length !== d) throw new RangeError(`fixed value of vertex ${f.vertex} has ${f.value.length} coordinates, its stalk ${d}`);
    for (let q = 0; q < d; q++) {
      isFixed[vertOff[f.vertex] + q] = 1;
      x[vertOff[f.vertex] + q] = f.value[q];
    }
  }
  const freeIndex = new Int32Array(n).fill(-1);
  const freeCoord: number[] = [];
  for (let c = 0; c < n; c++) if (!isFixed[c]) freeIndex[c] = freeCoord.push(c) - 1;
  // b' = b − δ⁰ x_fixed, and the design on the free coordinates.
  const reduced = Float64Array.from(obs.values);
  const fixedPart = csrMatVec(D, x);
  const tr: number[] = [];
  const tc: number[] = [];
  const tv: number[] = [];
  for (let r = 0; r < m; r++) {
    reduced[r] -= fixedPart[r];
    for (let e = D.rowPtr[r]; e < D.rowPtr[r + 1]; e++) {
      const c = freeIndex[D.col[e]];
      if (c < 0) continue;
      tr.push(r);
      tc.push(c);
      tv.push(D.val[e]);
    }
  }
  const A = csrFromTriplets(m, freeCoord.length, tr, tc, tv);
  const At = csrTranspose(A);
  const chol = new SparseCholesky(csrMultiply(At, A, rowWeight));
  const weighted = Float64Array.from(reduced, (b, r) => b * rowWeight[r]);
  const xFree = chol.solve(csrMatTVec(A, weighted));
  // One step of iterative refinement on the normal equations.
  const fit = csrMatVec(A, xFree);
  const again = chol.solve(csrMatTVec(A, Float64Array.from(reduced, (b, r) => (b - fit[r]) * rowWeight[r])));
  for (let i = 0; i < xFree.length; i++) xFree[i] += again[i];
  freeCoord.forEach((c, i) => (x[c] = xFree[i]));

  const predicted = csrMatVec(D, x);
  const residual = new Float64Array(m);
  let weightedSquares = 0;
  for (let r = 0; r < m; r++) {
    if (rowWeight[r] === 0) continue;
    residual[r] = obs.values[r] - predicted[r];
    weightedSquares += rowWeight[r] * residual[r] ** 2;
  }
  const rank = chol.rank;
  const dof = observations - rank;
  const undetermined = undeterminedVertices(chol, freeCoord, vertOff);
  return {
    x,
    residual,
    observations,
    unknowns: freeCoord.length,
    rank,
    dof,
    weightedSquares,
    sigma0: dof > 0 ? Math.sqrt(weightedSquares / dof) : undefined,
    undetermined,
    unexplained: options.unexplained !== false && observations === m ? unexplainedPart(sheaf, D, obs.values, residual) : undefined,
    adjustedCofactor: options.cofactors && !chol.isSingular() ? adjustedCofactors(A, rowWeight, new SelectedInverse(chol), chol) : undefined,
  };
}

/**
 * aᵀ Z a for each observed row a of the design. Only pairs of one row's
 * unknowns are needed, and each such pair is an entry of AᵀWA, so it is on
 * the selected inverse's pattern, unless the row's contributions cancelled
 * exactly there; such a row is solved for directly.
 */
function adjustedCofactors(A: CsrMatrix, rowWeight: Float64Array, Z: SelectedInverse, chol: SparseCholesky): Float64Array {
  const out = new Float64Array(A.rows);
  rows: for (let r = 0; r < A.rows; r++) {
    if (rowWeight[r] === 0) continue;
    const a = A.rowPtr[r];
    const b = A.rowPtr[r + 1];
    let q = 0;
    for (let e = a; e < b; e++) {
      q += A.val[e] * A.val[e] * Z.diagonal[A.col[e]];
      for (let f = e + 1; f < b; f++) {
        const z = Z.find(A.col[e], A.col[f]);
        if (z === undefined) {
          const row = new Float64Array(A.cols);
          for (let g = a; g < b; g++) row[A.col[g]] = A.val[g];
          const solved = chol.solve(row);
          out[r] = 0;
          for (let g = a; g < b; g++) out[r] += A.val[g] * solved[A.col[g]];
          continue rows;
        }
        q += 2 * A.val[e] * A.val[f] * z;
      }
    }
    out[r] = q;
  }
  return out;
}

/** Vertices touched by the kernel of the normal matrix (the datum defect). */
function undeterminedVertices(chol: SparseCholesky, freeCoord: number[], vertOff: Int32Array): Int32Array {
  if (!chol.isSingular()) return new Int32Array(0);
  const vertexOf = (coord: number) => {
    let lo = 0;
    let hi = vertOff.length - 2;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (vertOff[mid] <= coord) lo = mid;
      else hi = mid - 1;
    }
    return lo;
  };
  const out = new Set<number>();
  for (const v of chol.nullVectors()) {
    let big = 0;
    for (let i = 0; i < v.length; i++) big = Math.max(big, Math.abs(v[i]));
    for (let i = 0; i < v.length; i++) if (Math.abs(v[i]) > 1e-8 * big) out.add(vertexOf(freeCoord[i]));
  }
  return Int32Array.from([...out].sort((a, b) => a - b));
}

function unexplainedPart(sheaf: Sheaf<unknown>, D: ReturnType<typeof coboundaryMatrix>, b: ArrayLike<number>, residual: Float64Array) {
  let cocycle = true;
  if (sheaf.complex.dimension >= 2) {
    const D1 = coboundaryMatrix(sheaf, 1);
    const db = csrMatVec(D1, b);
    cocycle = norm(db) <= 1e-9 * Math.max(1, csrMaxAbs(D1)) * Math.max(norm(b), 1e-300);
  }
  // [b] = [residual]: they differ by δ⁰x̂.
  const [harmonic] = removeCoboundaries(D, [residual]);
  return { harmonic, norm: norm(harmonic), cocycle };
}
