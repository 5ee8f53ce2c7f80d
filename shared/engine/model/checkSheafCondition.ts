import { simplexIds, type SimplicialComplex } from '../complex/SimplicialComplex';
import type { Field } from '../fields/Field';
import { matEquals, mulMat, denseMat, type Mat } from '../based/Mat';
import type { ProblemList } from './Problem';

const NAMED = 3;

/**
 * Every codimension-two diamond σ ◁ τ1, τ2 ◁ ω must commute:
 * F(τ1◁ω)F(σ◁τ1) = F(τ2◁ω)F(σ◁τ2). A diamond whose four maps all come from
 * the same default commutes trivially, so only simplices touching an
 * explicit map are examined. Reports the first failing diamonds by name.
 */
export function checkSheafCondition<E>(
  complex: SimplicialComplex,
  dims: Int32Array[],
  restriction: Int32Array[],
  maps: Mat<E>[],
  explicit: Uint8Array[],
  F: Field<E>,
  problems: ProblemList,
): void {
  const failures: string[] = [];
  let failed = 0;
  const block = (k: number, e: number, rows: number, cols: number): Mat<E> => {
    const id = restriction[k][e];
    return id >= 0 ? maps[id] : denseMat(rows, cols, F.newVec(rows * cols));
  };
  for (let k = 2; k <= complex.dimension; k++) {
    if (!hasAny(explicit[k]) && !hasAny(explicit[k - 1])) continue;
    const facesK = complex.faces[k];
    const facesL = complex.faces[k - 1];
    const n = complex.simplices[k].size;
    for (let w = 0; w < n; w++) {
      if (!touchesExplicit(w, k, facesK, explicit)) continue;
      const base = w * (k + 1);
      for (let i = 0; i < k + 1; i++) {
        for (let j = i + 1; j < k + 1; j++) {
          const t1 = facesK[base + i];
          const t2 = facesK[base + j];
          const e1 = t1 * k + (j - 1);
          const e2 = t2 * k + i;
          const sigma = facesL[e1];
          const dw = dims[k][w];
          const d1 = dims[k - 1][t1];
          const d2 = dims[k - 1][t2];
          const ds = dims[k - 2][sigma];
          if (dw === 0 || ds === 0) continue;
          const p1 = d1 === 0 ? denseMat(dw, ds, F.newVec(dw * ds)) : mulMat(F, block(k, base + i, dw, d1), block(k - 1, e1, d1, ds));
          const p2 = d2 === 0 ? denseMat(dw, ds, F.newVec(dw * ds)) : mulMat(F, block(k, base + j, dw, d2), block(k - 1, e2, d2, ds));
          if (!matEquals(F, p1, p2)) {
            failed++;
            if (failures.length < NAMED) {
              const name = (kk: number, s: number) => `[${simplexIds(complex, kk, s).join(',')}]`;
              failures.push(`${name(k - 2, sigma)} ◁ ${name(k - 1, t1)} ◁ ${name(k, w)} differs from ${name(k - 2, sigma)} ◁ ${name(k - 1, t2)} ◁ ${name(k, w)}`);
            }
          }
        }
      }
    }
  }
  if (failed > 0) {
    const more = failed > failures.length ? ` (and ${failed - failures.length} more)` : '';
    problems.add('maps', `sheaf condition fails: ${failures.join('; ')}${more}`);
  }
}

function hasAny(a: Uint8Array | undefined): boolean {
  if (!a) return false;
  for (let i = 0; i < a.length; i++) if (a[i]) return true;
  return false;
}

function touchesExplicit(w: number, k: number, facesK: Int32Array, explicit: Uint8Array[]): boolean {
  const base = w * (k + 1);
  const lower = explicit[k - 1];
  for (let i = 0; i <= k; i++) {
    if (explicit[k][base + i]) return true;
    const t = facesK[base + i];
    for (let j = 0; j < k; j++) if (lower[t * k + j]) return true;
  }
  return false;
}
