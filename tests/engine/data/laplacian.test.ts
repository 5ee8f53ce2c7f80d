/**
 * The sheaf Laplacian over the reals. Hodge theorem for cellular sheaves:
 * dim ker L^k = dim H^k, and the harmonic representatives are cocycles
 * orthogonal to the coboundaries (J. Hansen, R. Ghrist, "Toward a spectral
 * theory of cellular sheaves", J. Applied and Computational Topology 3
 * (2019) 315–358). Frame alignment: with orthogonal maps on a cycle, the
 * smallest eigenvalue of L^0 vanishes exactly when the rotations compose to
 * the identity (A. Singer, "Angular synchronization by eigenvectors and
 * semidefinite programming", Appl. Comput. Harmon. Anal. 30 (2011) 20–36,
 * from memory); for plane rotations with holonomy θ around an n-cycle the
 * spectrum is 2 − 2cos((2πj ± θ)/n), so λ_min = 2 − 2cos(θ/n) (the magnetic
 * Laplacian of a cycle, from memory).
 */
import { EigenvalueDecomposition } from 'ml-matrix';
import { describe, expect, test } from 'vitest';
import {
  computeCohomology,
  coboundaryMatrix,
  csrMatTVec,
  csrMatVec,
  harmonicRepresentatives,
  laplacianSpectrum,
  readModelOrThrow,
  sheafLaplacian,
  smallestEigenvalues,
  type ModelFile,
} from '../../../shared/engine';
import { constantSheaf, kleinBottle, projectivePlane, sphere2, torus, wedgeOfCircles } from '../fixtures/triangulations';
import { maxAbsDiff, prng, rotation, toMatrix } from './helpers';

const REAL = { kind: 'real' } as const;

/** A ring of n stations with random plane rotations whose product around the ring is a turn by θ. */
function rotationRing(n: number, theta: number, seed = 1): ModelFile {
  const rand = prng(seed);
  const angles = Array.from({ length: n - 1 }, () => rand() * 2 - 1);
  const closing = angles.reduce((a, b) => a + b, 0) + theta;
  const entries = angles.map((t, i) => ({ face: [i], coface: [i, i + 1], matrix: rotation(t) }));
  entries.push({ face: [0], coface: [0, n - 1], matrix: rotation(closing) });
  return {
    format: 'gluefield.sheaf',
    version: 1,
    field: REAL,
    simplices: [...angles.map((_, i) => [i, i + 1]), [0, n - 1]],
    stalks: { default: 2 },
    maps: { default: 'identity', entries },
  };
}

const CASES: { name: string; model: ModelFile }[] = [
  { name: 'torus', model: { ...constantSheaf(torus(5)), field: REAL } },
  { name: 'Klein bottle (real: 1, 1, 0)', model: { ...constantSheaf(kleinBottle(5)), field: REAL } },
  { name: 'real projective plane (real: 1, 0, 0)', model: { ...constantSheaf(projectivePlane()), field: REAL } },
  { name: '2-sphere, stalk R^2', model: { ...constantSheaf(sphere2(), 2), field: REAL } },
  { name: 'wedge of 3 circles', model: { ...constantSheaf(wedgeOfCircles(3)), field: REAL } },
  { name: 'consistent rotation ring', model: rotationRing(7, 0) },
  { name: 'rotation ring with a 10° misclosure', model: rotationRing(7, Math.PI / 18) },
];

describe('harmonic dimension = cohomology dimension (Hansen–Ghrist 2019)', () => {
  for (const { name, model } of CASES) {
    test(name, () => {
      const sheaf = readModelOrThrow(model);
      const run = computeCohomology(sheaf);
      for (let k = 0; k <= sheaf.complex.dimension; k++) {
        const L = sheafLaplacian(sheaf, k);
        // Independent count: near-zero eigenvalues of the dense L^k by ml-matrix.
        const ev = new EigenvalueDecomposition(toMatrix(L), { assumeSymmetric: true }).realEigenvalues;
        const scale = Math.max(1, ...ev.map(Math.abs));
        expect(ev.filter((x) => Math.abs(x) < 1e-8 * scale).length).toBe(run.report.dims[k]);
        const h = harmonicRepresentatives(sheaf, k, run);
        expect(h.vectors).toHaveLength(run.report.dims[k]);
        expect(h.residual).toBeLessThan(1e-9);
        // Harmonic = cocycle and orthogonal to the coboundaries: δ^k h = 0 and δ^(k−1)ᵀ h = 0.
        const up = coboundaryMatrix(sheaf, k);
        const down = coboundaryMatrix(sheaf, k - 1);
        for (const v of h.vectors) {
          expect(Math.max(0, ...csrMatVec(up, v).map(Math.abs))).toBeLessThan(1e-9);
          expect(Math.max(0, ...csrMatTVec(down, v).map(Math.abs))).toBeLessThan(1e-9);
        }
        // The engine's own smallest eigenvalues find the same kernel.
        const small = smallestEigenvalues(L, Math.min(L.rows, run.report.dims[k] + 1));
        expect(small.values.filter((x) => Math.abs(x) < 1e-8 * small.scale).length).toBe(run.report.dims[k]);
      }
    });
  }
});

describe('smallestEigenvalues (shift-and-invert subspace iteration)', () => {
  test('agrees with a dense ml-matrix eigendecomposition on a 400-unknown Laplacian', () => {
    // A ring of 200 plane rotations with a 30° misclosure: L^0 is 400 × 400, beyond the dense cut-off.
    const sheaf = readModelOrThrow(rotationRing(200, Math.PI / 6, 3));
    const L = sheafLaplacian(sheaf, 0);
    const mine = smallestEigenvalues(L, 6);
    expect(mine.converged).toBe(true);
    expect(mine.iterations).toBeGreaterThan(0);
    const ref = [...new EigenvalueDecomposition(toMatrix(L), { assumeSymmetric: true }).realEigenvalues].sort((a, b) => a - b);
    expect(maxAbsDiff(mine.values, ref.slice(0, 6))).toBeLessThan(1e-9);
    for (let i = 0; i < 6; i++) expect(mine.residuals[i]).toBeLessThan(1e-8);
  });
});

describe('frame alignment: λ_min(L^0) ≈ 0 iff the rotations are consistent (Singer 2011, from memory)', () => {
  const n = 12;
  test('consistent ring: λ1 = λ2 = 0 (dim H^0 = 2), then a gap', () => {
    const sheaf = readModelOrThrow(rotationRing(n, 0, 9));
    const { values } = smallestEigenvalues(sheafLaplacian(sheaf, 0), 3);
    expect(Math.abs(values[0])).toBeLessThan(1e-12);
    expect(Math.abs(values[1])).toBeLessThan(1e-12);
    expect(values[2]).toBeCloseTo(2 - 2 * Math.cos((2 * Math.PI) / n), 10);
    expect(computeCohomology(sheaf).report.dims[0]).toBe(2);
  });
  test.each([1, 5, 20, 90])('misclosure %d°: λ_min = 2 − 2cos(θ/n) > 0, twice (from memory)', (deg) => {
    const theta = (deg * Math.PI) / 180;
    const sheaf = readModelOrThrow(rotationRing(n, theta, deg));
    const { values } = smallestEigenvalues(sheafLaplacian(sheaf, 0), 2);
    const expected = 2 - 2 * Math.cos(theta / n);
    expect(values[0]).toBeGreaterThan(0);
    expect(values[0]).toBeCloseTo(expected, 10);
    expect(values[1]).toBeCloseTo(expected, 10);
    expect(computeCohomology(sheaf).report.dims[0]).toBe(0);
  });
  test('laplacianSpectrum counts the harmonic dimension: 2 when consistent, 0 with a 1° misclosure', () => {
    expect(laplacianSpectrum(readModelOrThrow(rotationRing(n, 0, 4)), 0, 4).harmonicDimension).toBe(2);
    const off = laplacianSpectrum(readModelOrThrow(rotationRing(n, Math.PI / 180, 4)), 0, 4);
    expect(off.harmonicDimension).toBe(0);
    expect(off.values[0]).toBeCloseTo(2 - 2 * Math.cos(Math.PI / 180 / n), 10);
  });
  test('the measure grows with the misclosure, on a 300-station ring (iterative branch)', () => {
    const lambdas = [0, 2, 8, 30].map((deg) => smallestEigenvalues(sheafLaplacian(readModelOrThrow(rotationRing(300, (deg * Math.PI) / 180, 5)), 0), 1).values[0]);
    expect(Math.abs(lambdas[0])).toBeLessThan(1e-12);
    for (let i = 1; i < lambdas.length; i++) expect(lambdas[i]).toBeGreaterThan(lambdas[i - 1]);
    expect(lambdas[3]).toBeCloseTo(2 - 2 * Math.cos((30 * Math.PI) / 180 / 300), 10);
  });
});
