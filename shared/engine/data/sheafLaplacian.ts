import type { Sheaf } from '../model/Sheaf';
import { coboundaryMatrix } from './coboundaryMatrix';
import { csrAdd, csrMultiply, csrTranspose, type CsrMatrix } from './CsrMatrix';

/**
 * The sheaf Laplacian L^k = δ^k* δ^k + δ^(k−1) δ^(k−1)* over the reals, the
 * adjoints taken for the standard inner product on every stalk (J. Hansen,
 * R. Ghrist, "Toward a spectral theory of cellular sheaves", J. Applied and
 * Computational Topology 3 (2019) 315–358). Symmetric positive
 * semidefinite; its kernel, the harmonic k-cochains, has dimension dim H^k.
 */
export function sheafLaplacian(sheaf: Sheaf<unknown>, k: number): CsrMatrix {
  const up = coboundaryMatrix(sheaf, k);
  const down = coboundaryMatrix(sheaf, k - 1);
  const upPart = csrMultiply(csrTranspose(up), up);
  const downPart = csrMultiply(down, csrTranspose(down));
  return csrAdd(upPart, downPart);
}
