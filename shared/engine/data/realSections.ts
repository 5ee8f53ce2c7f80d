import { computeCohomology, type Computation } from '../computeCohomology';
import { sectionVectors } from '../computeSections';
import type { Sheaf } from '../model/Sheaf';

/**
 * Cocycles whose classes form a basis of H^k, as real vectors on the
 * original cells (the layout of {@link sectionVectors}), from a given
 * computation or a fresh Morse one. Exact fields convert to doubles.
 */
export function realSections(sheaf: Sheaf<unknown>, k: number, run?: Computation<unknown>): Float64Array[] {
  const computation = run ?? computeCohomology(sheaf);
  const F = sheaf.field;
  return sectionVectors(sheaf, computation, k).map((v) => {
    const out = new Float64Array(v.length);
    for (let i = 0; i < v.length; i++) out[i] = F.toNumber(v[i]);
    return out;
  });
}
