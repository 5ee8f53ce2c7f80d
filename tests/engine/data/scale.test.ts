/**
 * Data on a sheaf at the planned scale of a levelling or sensor network
 * (product-brief.md: 10^3–10^5 cells): a 10^5-cell net adjusts, and
 * readings on a 10^5-cell triangulated sheet are checked and fitted, in
 * seconds. Invariants only; the exact values are checked on small cases.
 */
import { describe, expect, test } from 'vitest';
import { adjustObservations, consistencyRadius, nearestSection, readModelOrThrow, readReadings, type ReadingsFile } from '../../../shared/engine';

const REAL = { kind: 'real' } as const;

describe('10^5 cells', () => {
  test('a 180 × 180 grid net (96 840 cells) adjusts: σ0 ≈ the simulated noise, dof = lines − unknowns', () => {
    const N = 180;
    const id = (i: number, j: number) => i * N + j;
    const simplices: number[][] = [];
    for (let i = 0; i < N; i++) {
      for (let j = 0; j < N; j++) {
        if (i + 1 < N) simplices.push([id(i, j), id(i + 1, j)]);
        if (j + 1 < N) simplices.push([id(i, j), id(i, j + 1)]);
      }
    }
    const sheaf = readModelOrThrow({ format: 'gluefield.sheaf', version: 1, field: REAL, simplices });
    const E = sheaf.complex.simplices[1];
    const height = (v: number) => 100 + 20 * Math.sin(v / 97) + Math.cos(v / 13);
    // Deterministic noise with standard deviation 1 mm: a sum of 12 uniforms minus 6.
    let s = 12345;
    const uniform = () => ((s = (s * 1103515245 + 12345) % 2147483648) / 2147483648);
    const noise = () => (Array.from({ length: 12 }, uniform).reduce((a, b) => a + b, 0) - 6) * 0.001;
    const values = Float64Array.from({ length: E.size }, (_, e) => height(E.vertex(e, 1)) - height(E.vertex(e, 0)) + noise());
    const adj = adjustObservations(sheaf, { values, weights: new Float64Array(E.size).fill(1), fixed: [{ vertex: 0, value: [height(0)] }] });
    expect(sheaf.complex.simplices[0].size + E.size).toBe(96_840);
    expect(adj.dof).toBe(E.size - (N * N - 1));
    expect(adj.sigma0!).toBeGreaterThan(0.0009);
    expect(adj.sigma0!).toBeLessThan(0.0011);
    expect(adj.unexplained!.cocycle).toBe(true);
  });

  test('readings on every vertex of a 10^5-cell triangulated sheet: radius and nearest section', () => {
    const N = 130;
    const id = (i: number, j: number) => i * N + j;
    const simplices: number[][] = [];
    for (let i = 0; i + 1 < N; i++) {
      for (let j = 0; j + 1 < N; j++) {
        simplices.push([id(i, j), id(i + 1, j), id(i + 1, j + 1)], [id(i, j), id(i, j + 1), id(i + 1, j + 1)]);
      }
    }
    const sheaf = readModelOrThrow({ format: 'gluefield.sheaf', version: 1, field: REAL, simplices });
    const cells = sheaf.complex.simplices.reduce((n, t) => n + t.size, 0);
    expect(cells).toBeGreaterThan(100_000);
    const values: ReadingsFile['values'] = [];
    for (let v = 0; v < N * N; v++) values.push({ cell: [v], value: [v === 777 ? 5.5 : 5] });
    // And every edge at the common value, so vertex–edge pairs are assigned.
    const E = sheaf.complex.simplices[1];
    for (let e = 0; e < E.size; e++) values.push({ cell: [E.vertex(e, 0), E.vertex(e, 1)], value: [5] });
    const r = readReadings({ format: 'gluefield.readings', version: 1, values }, sheaf).readings!;
    const radius = consistencyRadius(sheaf, r, { worst: 3 });
    expect(radius.pairs).toBe(2 * E.size);
    expect(radius.max).toBeCloseTo(0.5, 12);
    expect(radius.worst[0].face).toEqual([777]);
    const fit = nearestSection(sheaf, r);
    expect(fit.dimH0).toBe(1);
    const mean = 5 + 0.5 / r.cell.length;
    expect(fit.section[0]).toBeCloseTo(mean, 9);
    expect(fit.residualNorm[777]).toBeCloseTo(0.5 - 0.5 / r.cell.length, 9);
  });
});
