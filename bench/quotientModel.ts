import Fraction from 'fraction.js';
import type { MapEntry, ModelFile } from '../shared/engine';
import { torusSimplices } from './torusModel';

/** Directions in Q^3; any three are independent, so stalks drop 2 → 1 → 0 over mixed cells. */
const DIRECTIONS = [
  [1, 0, 0],
  [0, 1, 0],
  [0, 0, 1],
  [1, 1, 1],
];

interface Quotient {
  /** q: V → V/S as rows over the non-pivot coordinates */
  q: Fraction[][];
  /** L: V/S → V, a section of q */
  L: Fraction[][];
}

/** q and its section for V/span(directions in mask), from the RREF of the spanning rows. */
function quotient(mask: number): Quotient {
  const rows: Fraction[][] = [];
  DIRECTIONS.forEach((d, i) => {
    if (mask & (1 << i)) rows.push(d.map((x) => new Fraction(x)));
  });
  const pivots: number[] = [];
  let r = 0;
  for (let c = 0; c < 3 && r < rows.length; c++) {
    const p = rows.findIndex((row, i) => i >= r && !row[c].equals(0));
    if (p < 0) continue;
    [rows[r], rows[p]] = [rows[p], rows[r]];
    const inv = rows[r][c].inverse();
    rows[r] = rows[r].map((x) => x.mul(inv));
    for (let i = 0; i < rows.length; i++) {
      if (i !== r && !rows[i][c].equals(0)) {
        const f = rows[i][c];
        rows[i] = rows[i].map((x, j) => x.sub(f.mul(rows[r][j])));
      }
    }
    pivots.push(c);
    r++;
  }
  const free = [0, 1, 2].filter((c) => !pivots.includes(c));
  // v mod S, read in the free coordinates: v_f − Σ_p v_p · R[p][f]
  const q = free.map((f) => [0, 1, 2].map((c) => {
    if (c === f) return new Fraction(1);
    const pi = pivots.indexOf(c);
    return pi >= 0 ? rows[pi][f].neg() : new Fraction(0);
  }));
  const L = [0, 1, 2].map((c) => free.map((f) => new Fraction(c === f ? 1 : 0)));
  return { q, L };
}

function mul(A: Fraction[][], B: Fraction[][]): Fraction[][] {
  return A.map((row) => B[0].map((_, j) => row.reduce((s, a, k) => s.add(a.mul(B[k][j])), new Fraction(0))));
}

/**
 * A sheaf with many rank-deficient maps: V = Q^3 modulo the direction of
 * each vertex, F(σ) = V / Σ_{v∈σ} K_v and F(σ◁τ) the induced quotient map.
 * Vertex stalks have dimension 2, edges mostly 1, triangles mostly 0: no
 * vertex-to-edge block is invertible, yet every map has rank one.
 */
export function quotientTorus(n: number, field: ModelFile['field']): ModelFile {
  const simplices = torusSimplices(n);
  let seed = 12345;
  const rand = () => {
    seed = (Math.imul(seed, 1103515245) + 12345) >>> 0;
    return seed >>> 16;
  };
  const dirOf = Array.from({ length: n * n }, () => rand() % DIRECTIONS.length);
  const maskOf = (cell: number[]) => cell.reduce((m, v) => m | (1 << dirOf[v]), 0);
  const cache = new Map<number, Quotient>();
  const quot = (mask: number) => cache.get(mask) ?? (cache.set(mask, quotient(mask)), cache.get(mask)!);
  const dimOf = (cell: number[]) => quot(maskOf(cell)).q.length;

  const edges = new Map<string, number[]>();
  for (const t of simplices) {
    const s = [...t].sort((a, b) => a - b);
    for (const e of [[s[0], s[1]], [s[0], s[2]], [s[1], s[2]]]) edges.set(e.join(','), e);
  }
  const cells = [...Array.from({ length: n * n }, (_, v) => [v]), ...edges.values(), ...simplices.map((t) => [...t].sort((a, b) => a - b))];
  const stalkCells = cells.map((cell) => ({ cell, dim: dimOf(cell) })).filter((c) => c.dim !== 2);
  const entries: MapEntry[] = [];
  const addPair = (face: number[], coface: number[]) => {
    const qf = quot(maskOf(face));
    const qc = quot(maskOf(coface));
    if (qf.q.length === 0 || qc.q.length === 0) return;
    const m = mul(qc.q, qf.L);
    entries.push({ face, coface, matrix: m.map((row) => row.map((x) => x.toFraction())) });
  };
  for (const e of edges.values()) {
    addPair([e[0]], e);
    addPair([e[1]], e);
  }
  for (const t0 of simplices) {
    const t = [...t0].sort((a, b) => a - b);
    addPair([t[1], t[2]], t);
    addPair([t[0], t[2]], t);
    addPair([t[0], t[1]], t);
  }
  return {
    format: 'gluefield.sheaf',
    version: 1,
    name: `quotient sheaf on torus ${n}×${n}`,
    field,
    simplices,
    stalks: { default: 2, cells: stalkCells },
    maps: { default: 'zero', entries },
  };
}
