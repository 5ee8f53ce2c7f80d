import { cochainDims, type BasedComplex } from './based/BasedComplex';
import { fromSheaf } from './based/fromSheaf';
import type { CohomologyReport, Method } from './CohomologyReport';
import type { Sheaf } from './model/Sheaf';
import type { Control } from './reduce/Cancelled';
import { morseReduce, type Reduction } from './reduce/morseReduce';
import { cohomologyDims } from './solve/ranks';

export interface ComputeOptions {
  method?: Method;
  splitBlocks?: boolean;
  control?: Control;
}

/** A finished computation: the report plus what is needed to lift bases later. */
export interface Computation<E> {
  report: CohomologyReport;
  complex: BasedComplex<E>;
  reduction: Reduction<E> | undefined;
}

const UNCERTAIN_FACTOR = 1e3;

/** Cohomology dimensions of a validated sheaf, by Morse reduction or directly. */
export function computeCohomology<E>(sheaf: Sheaf<E>, options: ComputeOptions = {}): Computation<E> {
  const method = options.method ?? 'morse';
  const t0 = performance.now();
  const X = fromSheaf(sheaf);
  const t1 = performance.now();
  const reduction = method === 'morse' ? morseReduce(X, { splitBlocks: options.splitBlocks, control: options.control }) : undefined;
  const small = reduction ? reduction.output : X;
  const t2 = performance.now();
  const solved = cohomologyDims(small, options.control);
  const t3 = performance.now();

  const d = cochainDims(X);
  const euler = alternating(d);
  if (alternating(solved.dims) !== euler || (reduction && alternating(cochainDims(small)) !== euler)) {
    throw new Error('internal check failed: the Euler characteristic changed during the computation');
  }
  const real = sheaf.field.kind === 'real';
  const tol = sheaf.field.tolerance;
  const report: CohomologyReport = {
    dims: solved.dims,
    cells: X.dims.map((c) => c.length),
    cochainDims: d,
    euler,
    field: sheaf.field.label,
    method,
    ms: { build: round(t1 - t0), reduce: round(t2 - t1), solve: round(t3 - t2), total: round(t3 - t0) },
  };
  if (reduction) {
    report.morse = {
      criticalCells: reduction.criticalCells,
      criticalCochainDims: cochainDims(small),
      rounds: reduction.rounds.length,
      blockCriticalCochainDims: reduction.blockCochainDims,
    };
    if (real && Number.isFinite(reduction.smallestPivot)) report.morse.smallestPivot = reduction.smallestPivot;
  }
  if (real) {
    if (Number.isFinite(solved.smallestPivot)) report.smallestPivot = solved.smallestPivot;
    report.numericallyUncertain =
      solved.smallestPivot < tol * UNCERTAIN_FACTOR || solved.largestDropped > tol / UNCERTAIN_FACTOR;
  }
  return { report, complex: X, reduction };
}

function alternating(v: number[]): number {
  return v.reduce((s, x, k) => (k % 2 === 0 ? s + x : s - x), 0);
}

export function round(ms: number): number {
  return Math.round(ms * 10) / 10;
}
