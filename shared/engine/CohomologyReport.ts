/** The answer of a cohomology computation, exactly as the command line prints it. */
export interface CohomologyReport {
  dims: number[];
  cells: number[];
  cochainDims: number[];
  euler: number;
  field: string;
  method: Method;
  morse?: MorseStats;
  /** Real field: the smallest pivot the final elimination accepted, relative to the matrix scale. */
  smallestPivot?: number;
  /** Real field: some rank decision was close to the tolerance. */
  numericallyUncertain?: boolean;
  ms: PhaseTimes;
}

export type Method = 'morse' | 'direct';

export interface MorseStats {
  criticalCells: number[];
  criticalCochainDims: number[];
  rounds: number;
  /** Critical cochain dimensions the whole-block rule leaves before any split round. */
  blockCriticalCochainDims: number[];
  /** Real field: the smallest pivot accepted when pairing. */
  smallestPivot?: number;
}

export interface PhaseTimes {
  build: number;
  reduce: number;
  solve: number;
  total: number;
}
