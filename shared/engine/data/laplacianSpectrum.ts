import type { Sheaf } from '../model/Sheaf';
import { sheafLaplacian } from './sheafLaplacian';
import { smallestEigenvalues, type EigenOptions } from './smallestEigenvalues';

export interface LaplacianSpectrum {
  degree: number;
  /** The smallest eigenvalues of L^k, increasing. */
  values: number[];
  /** How many of them are zero within `zeroTolerance · scale`: a lower bound on dim H^k (equal when count exceeds it). */
  harmonicDimension: number;
  /** The row-sum bound on ‖L^k‖ the tolerances are relative to. */
  scale: number;
  converged: boolean;
}

/**
 * The bottom of the spectrum of the sheaf Laplacian L^k as an inconsistency
 * measure: for readings-like data (frames to align, stations to level) the
 * smallest eigenvalue of L^0 is 0 exactly when a global section exists in
 * every direction that was asked for, and grows with the misclosure
 * (Hansen–Ghrist 2019; Singer 2011 for rotations).
 */
export function laplacianSpectrum(sheaf: Sheaf<unknown>, k: number, count = 6, options: EigenOptions & { zeroTolerance?: number } = {}): LaplacianSpectrum {
  const L = sheafLaplacian(sheaf, k);
  const eig = smallestEigenvalues(L, count, options);
  const zero = (options.zeroTolerance ?? 1e-9) * (eig.scale || 1);
  const values = Array.from(eig.values);
  return {
    degree: k,
    values,
    harmonicDimension: values.filter((x) => Math.abs(x) <= zero).length,
    scale: eig.scale,
    converged: eig.converged,
  };
}
