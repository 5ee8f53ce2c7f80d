/**
 * Readings on a sheaf (engine-notes.md, "Data on a sheaf"): validation, the
 * consistency radius (M. Robinson, "Sheaves are the canonical data structure
 * for sensor integration", Information Fusion 36 (2017) 208–224) and the
 * nearest global section, the latter against an independent least-squares
 * solve with ml-matrix on a different formulation (values on every cell,
 * constrained to glue).
 */
import { Matrix, SVD, solve } from 'ml-matrix';
import { describe, expect, test } from 'vitest';
import { consistencyRadius, nearestSection, readModelOrThrow, readReadings, type ModelFile, type ReadingsFile } from '../../../shared/engine';
import { maxAbsDiff, prng, rotation } from './helpers';

const REAL = { kind: 'real' } as const;

/** The constant sheaf R on a filled triangle 0-1-2 with a tail edge 2-3. */
const triangleWithTail = readModelOrThrow({ format: 'gluefield.sheaf', version: 1, field: REAL, simplices: [[0, 1, 2], [2, 3]] });

function readings(values: ReadingsFile['values']): ReadingsFile {
  return { format: 'gluefield.readings', version: 1, values };
}

const ALL_CELLS = [[0], [1], [2], [3], [0, 1], [0, 2], [1, 2], [2, 3], [0, 1, 2]];

describe('readReadings', () => {
  test('accepts cells in any vertex order, numbers and exact strings, and defaults the weight to 1', () => {
    const r = readReadings(readings([{ cell: [1, 0], value: ['1/2'] }, { cell: [3], value: [2], weight: 4 }]), triangleWithTail);
    expect(r.problems).toEqual([]);
    expect(Array.from(r.readings!.value)).toEqual([0.5, 2]);
    expect(Array.from(r.readings!.weight)).toEqual([1, 4]);
    expect(Array.from(r.readings!.degree)).toEqual([1, 0]);
  });
  test.each([
    [{ format: 'gluefield.sheaf', version: 1, values: [] }, 'format'],
    [{ format: 'gluefield.readings', version: 2, values: [] }, 'version'],
    [readings([{ cell: [0, 3], value: [1] }]), 'values[0].cell'],
    [readings([{ cell: [9], value: [1] }]), 'values[0].cell'],
    [readings([{ cell: [0], value: [1] }, { cell: [0], value: [2] }]), 'values[1].cell'],
    [readings([{ cell: [0], value: [1, 2] }]), 'values[0].value'],
    [readings([{ cell: [0], value: ['x'] }]), 'values[0].value[0]'],
    [readings([{ cell: [0], value: [1], weight: 0 }]), 'values[0].weight'],
    [readings([{ cell: [0, 0], value: [1] }]), 'values[0].cell'],
  ])('rejects %j, naming %s', (json, where) => {
    const r = readReadings(json, triangleWithTail);
    expect(r.readings).toBeUndefined();
    expect(r.problems[0].where).toBe(where);
  });
});

describe('consistencyRadius', () => {
  test('a full assignment of a global section has radius 0 (Robinson 2017)', () => {
    const r = readReadings(readings(ALL_CELLS.map((cell) => ({ cell, value: [5] }))), triangleWithTail).readings!;
    const c = consistencyRadius(triangleWithTail, r);
    // Face pairs σ < τ: the triangle has 6 proper faces, each of the 4 edges 2 vertices.
    expect(c.pairs).toBe(6 + 4 * 2);
    expect(c.max).toBe(0);
    expect(c.rms).toBe(0);
  });
  test('one bad edge reading shows in its three pairs: max 0.3, rms √(3·0.09/14), worst pairs listed', () => {
    const values = ALL_CELLS.map((cell) => ({ cell, value: [cell.join() === '0,1' ? 5.3 : 5] }));
    const c = consistencyRadius(triangleWithTail, readReadings(readings(values), triangleWithTail).readings!);
    expect(c.max).toBeCloseTo(0.3, 12);
    expect(c.rms).toBeCloseTo(Math.sqrt((3 * 0.09) / 14), 12);
    const top = c.worst.slice(0, 3).map((p) => `${p.face}<${p.coface}`).sort();
    expect(top).toEqual(['0,1<0,1,2', '0<0,1', '1<0,1']);
    expect(c.worst[3].mismatch).toBe(0);
  });
  test('faces of codimension two go through the composite map: a rescaled constant sheaf is consistent on its section', () => {
    // Stalk scales s(σ); every map F(σ ◁ τ) = s(τ)/s(σ), so x(σ) = s(σ) glues (and the sheaf condition holds).
    const s: Record<string, number> = { '0': 1, '1': 2, '2': 4, '0,1': 3, '0,2': 5, '1,2': 7, '0,1,2': 11 };
    const entries: NonNullable<ModelFile['maps']>['entries'] = [];
    for (const tau of ['0,1', '0,2', '1,2', '0,1,2']) {
      const t = tau.split(',').map(Number);
      for (let i = 0; i < t.length; i++) {
        const face = t.filter((_, j) => j !== i);
        entries.push({ face, coface: t, scalar: s[tau] / s[face.join()] });
      }
    }
    const sheaf = readModelOrThrow({ format: 'gluefield.sheaf', version: 1, field: REAL, simplices: [[0, 1, 2]], maps: { default: 'identity', entries } });
    const r = readReadings(readings(Object.entries(s).map(([k, v]) => ({ cell: k.split(',').map(Number), value: [v] }))), sheaf).readings!;
    const c = consistencyRadius(sheaf, r);
    expect(c.pairs).toBe(6 + 3 * 2);
    expect(c.max).toBeLessThan(1e-12);
    // Only the vertex 0 and the triangle: one pair of codimension two, F(0 ≤ 012) = 11.
    const r2 = readReadings(readings([{ cell: [0], value: [1] }, { cell: [0, 1, 2], value: [12] }]), sheaf).readings!;
    const c2 = consistencyRadius(sheaf, r2);
    expect(c2.pairs).toBe(1);
    expect(c2.max).toBeCloseTo(1, 12);
  });
});

describe('nearestSection', () => {
  test('on a connected constant sheaf the fit is the weighted mean (hand computation)', () => {
    // Vertices 0, 1, 2 read 1, 2, 3 with weights 1, 1, 2: mean (1 + 2 + 6) / 4 = 2.25.
    const r = readReadings(readings([{ cell: [0], value: [1] }, { cell: [1], value: [2] }, { cell: [2], value: [3], weight: 2 }]), triangleWithTail).readings!;
    const fit = nearestSection(triangleWithTail, r);
    expect(fit.dimH0).toBe(1);
    expect(fit.determined).toBe(true);
    for (const x of fit.section) expect(x).toBeCloseTo(2.25, 12);
    expect(maxAbsDiff(fit.residual, [-1.25, -0.25, 0.75])).toBeLessThan(1e-12);
    expect(fit.weightedRms).toBeCloseTo(Math.sqrt((1.25 ** 2 + 0.25 ** 2 + 2 * 0.75 ** 2) / 4), 12);
  });

  test('a ring of plane rotations: agrees with an independent constrained least-squares solve (ml-matrix)', () => {
    // Stations 0…4 in a ring; edge (i, i+1) in the frame of i+1 (identity), i maps by T_i;
    // the closing edge (0, 4) maps 0 by the product, so the ring is consistent: dim H^0 = 2.
    const n = 5;
    const angles = [0.3, -0.7, 1.1, 0.25];
    const maps: number[][][] = angles.map(rotation);
    const total = rotation(angles.reduce((a, b) => a + b, 0));
    const edges: [number, number, number[][]][] = angles.map((_, i) => [i, i + 1, maps[i]]);
    edges.push([0, n - 1, total]);
    const sheaf = readModelOrThrow({
      format: 'gluefield.sheaf',
      version: 1,
      field: REAL,
      simplices: edges.map(([a, b]) => [a, b]),
      stalks: { default: 2 },
      maps: { default: 'identity', entries: edges.map(([a, b, m]) => ({ face: [a], coface: [a, b], matrix: m })) },
    });
    const rand = prng(42);
    const cells = [[0], [2], [3], [0, 1], [3, 4], [0, 4]];
    const values = cells.map((cell) => ({ cell, value: [rand() * 4 - 2, rand() * 4 - 2], weight: 0.5 + rand() }));
    const r = readReadings(readings(values), sheaf).readings!;
    const fit = nearestSection(sheaf, r);
    expect(fit.dimH0).toBe(2);
    expect(fit.determined).toBe(true);

    // Reference: unknowns on every cell (5 vertices, then 5 edges, 2 each), constrained by
    // F(v ◁ e) x_v = x_e at both ends of every edge; fit the readings on the null space.
    const vIdx = (v: number) => 2 * v;
    const eIdx = (e: number) => 2 * n + 2 * e;
    const C: number[][] = [];
    edges.forEach(([a, b, m], e) => {
      for (const [v, M] of [[a, m], [b, [[1, 0], [0, 1]]]] as const) {
        for (let row = 0; row < 2; row++) {
          const line = new Array(4 * n).fill(0);
          line[vIdx(v)] = M[row][0];
          line[vIdx(v) + 1] = M[row][1];
          line[eIdx(e) + row] = -1;
          C.push(line);
        }
      }
    });
    const svd = new SVD(new Matrix(C));
    const sv = svd.diagonal;
    const V = svd.rightSingularVectors;
    const nullCols = sv.map((x, i) => [x, i] as const).filter(([x]) => x < 1e-10).map(([, i]) => i);
    expect(nullCols).toHaveLength(2);
    const N = new Matrix(4 * n, 2);
    nullCols.forEach((c, j) => {
      for (let i = 0; i < 4 * n; i++) N.set(i, j, V.get(i, c));
    });
    const cellCoord = (cell: number[]) => (cell.length === 1 ? vIdx(cell[0]) : eIdx(edges.findIndex(([a, b]) => a === cell[0] && b === cell[1])));
    const rows: number[][] = [];
    const rhs: number[] = [];
    values.forEach(({ cell, value, weight }) => {
      for (let q = 0; q < 2; q++) {
        rows.push(N.getRow(cellCoord(cell) + q).map((x) => Math.sqrt(weight!) * x));
        rhs.push(Math.sqrt(weight!) * value[q]);
      }
    });
    const c = solve(new Matrix(rows), Matrix.columnVector(rhs)).to1DArray();
    const xAll = N.mmul(Matrix.columnVector(c)).to1DArray();
    const refFitted = values.flatMap(({ cell }) => [xAll[cellCoord(cell)], xAll[cellCoord(cell) + 1]]);
    expect(maxAbsDiff(fit.fitted, refFitted)).toBeLessThan(1e-9);
    expect(maxAbsDiff(fit.section, xAll.slice(0, 2 * n))).toBeLessThan(1e-9);
  });

  test('too few readings: the fit is one of many and says so', () => {
    // Two components (a vertex 9 on its own): dim H^0 = 2, readings only on the first.
    const sheaf = readModelOrThrow({ format: 'gluefield.sheaf', version: 1, field: REAL, simplices: [[0, 1], [9]] });
    const r = readReadings(readings([{ cell: [0], value: [3] }]), sheaf).readings!;
    const fit = nearestSection(sheaf, r);
    expect(fit.dimH0).toBe(2);
    expect(fit.determined).toBe(false);
    expect(fit.residualNorm[0]).toBeLessThan(1e-12);
  });
});
