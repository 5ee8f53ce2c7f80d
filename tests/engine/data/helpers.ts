import { Matrix } from 'ml-matrix';
import type { CsrMatrix } from '../../../shared/engine';

/** Deterministic pseudo-random numbers (mulberry32). */
export function prng(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A CSR matrix as an ml-matrix Matrix (the independent reference). */
export function toMatrix(A: CsrMatrix): Matrix {
  const M = Matrix.zeros(A.rows, A.cols);
  for (let r = 0; r < A.rows; r++) for (let e = A.rowPtr[r]; e < A.rowPtr[r + 1]; e++) M.set(r, A.col[e], M.get(r, A.col[e]) + A.val[e]);
  return M;
}

export function maxAbsDiff(a: ArrayLike<number>, b: ArrayLike<number>): number {
  expectSameLength(a, b);
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i] - b[i]));
  return m;
}

function expectSameLength(a: ArrayLike<number>, b: ArrayLike<number>): void {
  if (a.length !== b.length) throw new Error(`lengths differ: ${a.length} and ${b.length}`);
}

/** A rotation of the plane by `angle` radians, as model-file matrix rows. */
export function rotation(angle: number): number[][] {
  const c = Math.cos(angle);
  const s = Math.sin(angle);
  return [
    [c, -s],
    [s, c],
  ];
}
