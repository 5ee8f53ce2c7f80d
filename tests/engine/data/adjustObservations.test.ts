/**
 * Weighted least-squares adjustment of observations on edges
 * (engine-notes.md, "Data on a sheaf"). The adjusted values are checked
 * against an independent solve with ml-matrix on a design matrix written out
 * here from the documented orientation (δ⁰x on edge a < b is x_b − x_a);
 * σ0 = √(vᵀWv / dof) with dof = observations − unknowns is common practice
 * in adjustment computations (Ghilani, Adjustment Computations, from memory).
 */
import { Matrix, solve } from 'ml-matrix';
import { describe, expect, test } from 'vitest';
import { adjustObservations, readModelOrThrow, type Sheaf } from '../../../shared/engine';
import { maxAbsDiff, prng } from './helpers';

const REAL = { kind: 'real' } as const;

function graphSheaf(edges: [number, number][], extra: number[][] = []): Sheaf<unknown> {
  return readModelOrThrow({ format: 'gluefield.sheaf', version: 1, field: REAL, simplices: [...edges, ...extra] });
}

/** Observations b and weights in the complex's edge order, from a function of (a, b) with a < b. */
function observe(sheaf: Sheaf<unknown>, f: (a: number, b: number) => number, w: (a: number, b: number) => number = () => 1) {
  const E = sheaf.complex.simplices[1];
  const values = new Float64Array(E.size);
  const weights = new Float64Array(E.size);
  for (let e = 0; e < E.size; e++) {
    values[e] = f(E.vertex(e, 0), E.vertex(e, 1));
    weights[e] = w(E.vertex(e, 0), E.vertex(e, 1));
  }
  return { values, weights };
}

describe('adjustObservations on a constant sheaf R (a levelling-type net)', () => {
  const rand = prng(2024);
  const n = 14;
  const edges: [number, number][] = [];
  for (let v = 1; v < n; v++) edges.push([Math.floor(rand() * v), v]);
  for (let k = 0; k < 12; k++) {
    const a = Math.floor(rand() * n);
    const b = Math.floor(rand() * n);
    if (a !== b && !edges.some(([p, q]) => (p === Math.min(a, b) && q === Math.max(a, b)) || (q === Math.min(a, b) && p === Math.max(a, b)))) edges.push([Math.min(a, b), Math.max(a, b)]);
  }
  const sheaf = graphSheaf(edges.map(([a, b]) => [Math.min(a, b), Math.max(a, b)]));
  const truth = Array.from({ length: n }, () => rand() * 100);
  const weight = new Map<string, number>();
  const { values, weights } = observe(
    sheaf,
    (a, b) => truth[b] - truth[a] + (rand() - 0.5) * 0.01,
    (a, b) => {
      const w = 0.5 + rand() * 2;
      weight.set(`${a},${b}`, w);
      return w;
    },
  );
  const fixedVertices = [0, 5];
  const adj = adjustObservations(sheaf, { values, weights, fixed: fixedVertices.map((v) => ({ vertex: v, value: [truth[v]] })) });

  test('adjusted values agree with an independent weighted least-squares solve (ml-matrix)', () => {
    const free = Array.from({ length: n }, (_, v) => v).filter((v) => !fixedVertices.includes(v));
    const E = sheaf.complex.simplices[1];
    const rows: number[][] = [];
    const rhs: number[] = [];
    for (let e = 0; e < E.size; e++) {
      const a = E.vertex(e, 0);
      const b = E.vertex(e, 1);
      const sw = Math.sqrt(weights[e]);
      const row = free.map((v) => (v === b ? sw : v === a ? -sw : 0));
      let r = values[e];
      if (fixedVertices.includes(b)) r -= truth[b];
      if (fixedVertices.includes(a)) r += truth[a];
      rows.push(row);
      rhs.push(sw * r);
    }
    const ref = solve(new Matrix(rows), Matrix.columnVector(rhs)).to1DArray();
    expect(maxAbsDiff(free.map((v) => adj.x[v]), ref)).toBeLessThan(1e-9);
    for (const v of fixedVertices) expect(adj.x[v]).toBe(truth[v]);
  });

  test('dof = observations − unknowns and σ0 = √(vᵀWv / dof) (common practice)', () => {
    expect(adj.observations).toBe(sheaf.complex.simplices[1].size);
    expect(adj.unknowns).toBe(n - 2);
    expect(adj.rank).toBe(n - 2);
    expect(adj.dof).toBe(adj.observations - (n - 2));
    let vwv = 0;
    for (let e = 0; e < adj.residual.length; e++) vwv += weights[e] * adj.residual[e] ** 2;
    expect(adj.weightedSquares).toBeCloseTo(vwv, 12);
    expect(adj.sigma0).toBeCloseTo(Math.sqrt(vwv / adj.dof), 12);
    expect(adj.undetermined).toHaveLength(0);
  });

  test('residuals are W-orthogonal to every correction of the free unknowns (normal equations)', () => {
    const E = sheaf.complex.simplices[1];
    const g = new Float64Array(n);
    for (let e = 0; e < E.size; e++) {
      g[E.vertex(e, 1)] += weights[e] * adj.residual[e];
      g[E.vertex(e, 0)] -= weights[e] * adj.residual[e];
    }
    for (let v = 0; v < n; v++) if (!fixedVertices.includes(v)) expect(Math.abs(g[v])).toBeLessThan(1e-10);
  });
});

describe('the unexplained part as a class in H^1', () => {
  test('a cycle of 5 with misclosure w: harmonic representative w/5 on every edge around it (hand computation)', () => {
    // Edges 0-1, 1-2, 2-3, 3-4 walked upwards, 0-4 walked 4 → 0 around the loop.
    const sheaf = graphSheaf([[0, 1], [1, 2], [2, 3], [3, 4], [0, 4]]);
    const w = 0.025;
    const { values, weights } = observe(sheaf, (a, b) => (b - a) * 1.5 + (a === 0 && b === 1 ? w : 0));
    const adj = adjustObservations(sheaf, { values, weights, fixed: [{ vertex: 0, value: [0] }] });
    const E = sheaf.complex.simplices[1];
    const u = adj.unexplained!;
    expect(u.cocycle).toBe(true);
    for (let e = 0; e < E.size; e++) {
      const walkedUp = !(E.vertex(e, 0) === 0 && E.vertex(e, 1) === 4);
      expect(u.harmonic[e]).toBeCloseTo(walkedUp ? w / 5 : -w / 5, 12);
    }
    expect(u.norm).toBeCloseTo(w / Math.sqrt(5), 12);
    expect(adj.dof).toBe(1);
  });
  test('consistent observations leave no class; a filled triangle with disagreeing edges is not a cocycle', () => {
    const loop = graphSheaf([[0, 1], [1, 2], [0, 2]]);
    const ok = adjustObservations(loop, observe(loop, (a, b) => b * b - a * a));
    expect(ok.unexplained!.norm).toBeLessThan(1e-12);
    const filled = graphSheaf([], [[0, 1, 2]]);
    const bad = adjustObservations(filled, observe(filled, (a, b) => b - a + (a === 0 && b === 2 ? 0.1 : 0)));
    expect(bad.unexplained!.cocycle).toBe(false);
  });
});

describe('undetermined unknowns', () => {
  test('a piece with no fixed vertex is reported vertex by vertex, and the rank drops by one per piece', () => {
    const sheaf = graphSheaf([[0, 1], [1, 2], [3, 4], [4, 5], [3, 5]]);
    const adj = adjustObservations(sheaf, { ...observe(sheaf, (a, b) => b - a), fixed: [{ vertex: 0, value: [0] }] });
    expect(Array.from(adj.undetermined)).toEqual([3, 4, 5]);
    expect(adj.rank).toBe(4);
    expect(adj.dof).toBe(5 - 4);
  });
  test('an unobserved edge (weight 0) does not count and does not tie its ends', () => {
    const sheaf = graphSheaf([[0, 1], [1, 2]]);
    const obs = observe(sheaf, (a, b) => b - a, (a) => (a === 1 ? 0 : 1));
    const adj = adjustObservations(sheaf, { ...obs, fixed: [{ vertex: 0, value: [0] }] });
    expect(adj.observations).toBe(1);
    expect(Array.from(adj.undetermined)).toEqual([2]);
    expect(adj.unexplained).toBeUndefined();
  });
});

describe('stalks of dimension 2', () => {
  test('relative offsets in the plane on a ring of rotations: against ml-matrix on the written-out design', () => {
    // Edge (i, i+1) with stalk in the frame of i+1: x_{i+1} − T_i x_i; closing edge (0, 3): x_3 − T x_0.
    const angles = [0.4, -0.2, 0.9];
    const R = (t: number) => [[Math.cos(t), -Math.sin(t)], [Math.sin(t), Math.cos(t)]];
    const total = angles.reduce((a, b) => a + b, 0) + 0.01; // a small inconsistency
    const edges: [number, number, number[][]][] = [[0, 1, R(angles[0])], [1, 2, R(angles[1])], [2, 3, R(angles[2])], [0, 3, R(total)]];
    const sheaf = readModelOrThrow({
      format: 'gluefield.sheaf',
      version: 1,
      field: REAL,
      simplices: edges.map(([a, b]) => [a, b]),
      stalks: { default: 2 },
      maps: { default: 'identity', entries: edges.map(([a, b, m]) => ({ face: [a], coface: [a, b], matrix: m })) },
    });
    const rand = prng(7);
    const E = sheaf.complex.simplices[1];
    const b = Float64Array.from({ length: 2 * E.size }, () => rand() - 0.5);
    const w = Float64Array.from({ length: E.size }, () => 1 + rand());
    const adj = adjustObservations(sheaf, { values: b, weights: w, fixed: [{ vertex: 0, value: [1, 0] }] });
    const rows: number[][] = [];
    const rhs: number[] = [];
    for (let e = 0; e < E.size; e++) {
      const [p, q, M] = edges.find(([p, q]) => p === E.vertex(e, 0) && q === E.vertex(e, 1))!;
      const sw = Math.sqrt(w[e]);
      for (let r = 0; r < 2; r++) {
        const row = new Array(6).fill(0); // free unknowns: vertices 1, 2, 3
        if (q > 0) row[2 * (q - 1) + r] += sw;
        let target = b[2 * e + r];
        if (p > 0) {
          row[2 * (p - 1)] -= sw * M[r][0];
          row[2 * (p - 1) + 1] -= sw * M[r][1];
        } else target += M[r][0] * 1 + M[r][1] * 0;
        rows.push(row);
        rhs.push(sw * target);
      }
    }
    const ref = solve(new Matrix(rows), Matrix.columnVector(rhs)).to1DArray();
    expect(maxAbsDiff(Array.from(adj.x.subarray(2)), ref)).toBeLessThan(1e-9);
    expect(adj.dof).toBe(8 - 6);
  });
});
