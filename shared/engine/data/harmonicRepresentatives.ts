import type { Computation } from '../computeCohomology';
import type { Sheaf } from '../model/Sheaf';
import { coboundaryMatrix } from './coboundaryMatrix';
import { csrMatTVec, csrMatVec, csrMultiply, csrTranspose, type CsrMatrix } from './CsrMatrix';
import { norm, principalBasis } from './orthonormalise';
import { realSections } from './realSections';
import { sheafLaplacian } from './sheafLaplacian';
import { SparseCholesky } from './SparseCholesky';

export interface Harmonic {
  /** An orthonormal basis of the harmonic k-cochains, one per dimension of H^k. */
  vectors: Float64Array[];
  /** max ‖L^k h‖ over the basis: how harmonic they came out (≈ 0). */
  residual: number;
}

/**
 * Harmonic representatives of H^k over the reals: each cocycle of a basis of
 * H^k minus its orthogonal projection on the coboundaries im δ^(k−1), then
 * an orthonormal basis of their span. The harmonic representative of a class
 * is the canonical, smallest one (Hodge theory; Hansen–Ghrist 2019).
 */
export function harmonicRepresentatives(sheaf: Sheaf<unknown>, k: number, run?: Computation<unknown>): Harmonic {
  const cocycles = realSections(sheaf, k, run);
  const projected = k === 0 ? cocycles : removeCoboundaries(coboundaryMatrix(sheaf, k - 1), cocycles);
  const vectors = principalBasis(projected, projected.length);
  const L = sheafLaplacian(sheaf, k);
  let residual = 0;
  for (const h of vectors) residual = Math.max(residual, norm(csrMatVec(L, h)));
  return { vectors, residual };
}

/**
 * z − B y with y a least-squares solution of B y ≈ z: the part of each z
 * orthogonal to the image of B. One factorisation of BᵀB serves all z.
 */
export function removeCoboundaries(B: CsrMatrix, zs: ArrayLike<number>[]): Float64Array[] {
  if (zs.length === 0) return [];
  const normal = csrMultiply(csrTranspose(B), B);
  const chol = new SparseCholesky(normal);
  return zs.map((z) => {
    const out = Float64Array.from(z);
    // One step of iterative refinement mops up what the factorisation left.
    for (let pass = 0; pass < 2; pass++) {
      const y = chol.solve(csrMatTVec(B, out));
      const By = csrMatVec(B, y);
      for (let i = 0; i < out.length; i++) out[i] -= By[i];
    }
    return out;
  });
}
