import { cochainDims, type BasedComplex } from '../based/BasedComplex';
import { splitToScalars } from '../based/splitToScalars';
import type { Vec } from '../fields/Field';
import type { Control } from './Cancelled';
import { liftCochain } from './lift';
import { morseRound } from './morseRound';
import type { Round } from './Round';

export const DEFAULT_PIVOT_RATIO = 1e-3;
const MAX_ROUNDS = 64;

export interface ReduceOptions {
  /** Pair inside non-invertible blocks at the level of basis vectors once blocks stop pairing (default true). */
  splitBlocks?: boolean;
  pivotRatio?: number;
  control?: Control;
}

/**
 * A chain of reductions from a based complex to a much smaller one with the
 * same cohomology, computed once; results are read from its fields.
 */
export interface Reduction<E> {
  readonly input: BasedComplex<E>;
  readonly output: BasedComplex<E>;
  /** Every round in order; block rounds first, then split rounds. */
  readonly rounds: Round<E>[];
  /** Index in `rounds` of the first split round (rounds.length when none). */
  readonly splitFrom: number;
  /** Critical cochain dimensions left by the block rule alone. */
  readonly blockCochainDims: number[];
  /** Critical cells per degree: cells of the block complex keeping at least one coordinate. */
  readonly criticalCells: number[];
  readonly smallestPivot: number;
  readonly pivotRatio: number;
  /** Lift a degree-k cochain of `output` back to `input`. */
  lift(k: number, x: Vec<E>): Vec<E>;
  /** Cells of `input` (degree k) that are still critical after the last round, increasing. */
  criticalInput(k: number): Int32Array;
}

/**
 * Morse reduction by rounds until nothing pairs: first whole blocks, then
 * (if anything is left to gain) single coordinates of the split complex.
 */
export function morseReduce<E>(X0: BasedComplex<E>, options: ReduceOptions = {}): Reduction<E> {
  const pivotRatio = options.pivotRatio ?? DEFAULT_PIVOT_RATIO;
  const rounds: Round<E>[] = [];
  let X = X0;
  const runRounds = () => {
    while (rounds.length < MAX_ROUNDS && hasEntries(X)) {
      const r = morseRound(X, { pivotRatio, control: options.control });
      if (r.pairs === 0) break;
      rounds.push(r);
      X = r.output;
    }
  };
  runRounds();
  const splitFrom = rounds.length;
  const blockComplex = X;
  const blockCochainDims = cochainDims(X);
  let parent: Int32Array[] | undefined;
  if (options.splitBlocks !== false && hasEntries(X) && X.dims.some((d) => d.some((n) => n > 1))) {
    const { split, parent: p } = splitToScalars(X);
    X = split;
    runRounds();
    if (rounds.length > splitFrom) parent = p;
    else X = blockComplex;
  }
  const output = X;
  const criticalCells = parent ? countParents(rounds, splitFrom, parent, output) : output.dims.map(countNonEmpty);
  let smallestPivot = Infinity;
  for (const r of rounds) smallestPivot = Math.min(smallestPivot, r.smallestPivot);
  return {
    input: X0,
    output,
    rounds,
    splitFrom,
    blockCochainDims,
    criticalCells,
    smallestPivot,
    pivotRatio,
    criticalInput(k) {
      const seen = new Set<number>();
      const out = output.dims[k];
      for (let i = 0; i < out.length; i++) {
        if (out[i] === 0) continue;
        let c = i;
        for (let r = rounds.length - 1; r >= 0; r--) {
          c = rounds[r].critical[k][c];
          // Crossing from the split rounds to the block rounds: a coordinate becomes its cell.
          if (r === splitFrom && parent) c = parent[k][c];
        }
        seen.add(c);
      }
      return Int32Array.from([...seen].sort((a, b) => a - b));
    },
    lift(k, x) {
      let v = x;
      // Split and block complexes share their flat coordinates, so only rounds act.
      for (let i = rounds.length - 1; i >= 0; i--) v = liftCochain(rounds[i], k, v, pivotRatio);
      return v;
    },
  };
}

function hasEntries(X: BasedComplex<unknown>): boolean {
  return X.cob.some((c) => c.block.some((b) => b >= 0));
}

/** Distinct cells of the block complex behind the coordinates left after the split rounds. */
function countParents(rounds: Round<unknown>[], splitFrom: number, parent: Int32Array[], output: BasedComplex<unknown>): number[] {
  return output.dims.map((d, k) => {
    const seen = new Set<number>();
    for (let i = 0; i < d.length; i++) {
      let c = i;
      for (let r = rounds.length - 1; r >= splitFrom; r--) c = rounds[r].critical[k][c];
      seen.add(parent[k][c]);
    }
    return seen.size;
  });
}

/** Cells with a non-zero space (a cell with a zero stalk is never critical). */
function countNonEmpty(d: Int32Array): number {
  let n = 0;
  for (let i = 0; i < d.length; i++) if (d[i] > 0) n++;
  return n;
}
