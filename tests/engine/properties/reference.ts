/**
 * An independent reference for the cochain complex of a Gluefield model file
 * (docs/model-format.md), written from the documented mathematics only: it
 * imports nothing from the engine. Closure, orientation by increasing vertex
 * id, incidence (−1)^i for the face opposite vertex i, and the coboundary
 * block (τ, σ) = [σ:τ]·F(σ ◁ τ) are all recomputed here.
 *
 * Exact ranks use fraction.js (Gaussian elimination over Q); real ranks use
 * the singular values of ml-matrix's SVD with a relative tolerance.
 */
import Fraction from 'fraction.js';
import { Matrix, SVD } from 'ml-matrix';

/** Matrix entries as a model file may write them. */
export type Entry = number | string;

export interface MapEntryJson {
  face: number[];
  coface: number[];
  matrix?: Entry[][];
  scalar?: Entry;
}

/** The parts of a `gluefield.sheaf` file the mathematics depends on. */
export interface ModelJson {
  format: 'gluefield.sheaf';
  version: 1;
  field?: { kind: 'rational' } | { kind: 'prime'; p: number } | { kind: 'real'; tolerance?: number };
  simplices: number[][];
  stalks: { default: number; cells?: { cell: number[]; dim: number }[] };
  maps: { default: 'identity' | 'zero'; entries?: MapEntryJson[] };
}

/** A simplex as its vertex ids in increasing order (its orientation). */
export type Cell = number[];

export const cellKey = (c: readonly number[]): string => [...c].sort((a, b) => a - b).join(',');

/** The closure of a list of simplices: every face, per degree, sorted lexicographically. */
export interface RefComplex {
  cells: Cell[][];
  index: Map<string, number>[];
}

export function closure(simplices: readonly (readonly number[])[]): RefComplex {
  const byKey: Map<string, Cell>[] = [];
  const visit = (c: Cell) => {
    const k = c.length - 1;
    while (byKey.length <= k) byKey.push(new Map());
    const key = c.join(',');
    if (byKey[k].has(key)) return;
    byKey[k].set(key, c);
    if (k > 0) for (let i = 0; i <= k; i++) visit(c.filter((_, j) => j !== i));
  };
  for (const s of simplices) visit([...s].sort((a, b) => a - b));
  const lex = (a: Cell, b: Cell) => {
    for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return a[i] - b[i];
    return 0;
  };
  const cells = byKey.map((m) => [...m.values()].sort(lex));
  const index = cells.map((cs) => new Map(cs.map((c, i) => [c.join(','), i])));
  return { cells, index };
}

/** The codimension-one faces of τ = (v0 < … < vk): face i omits vi and has incidence (−1)^i. */
export function facesWithSign(tau: Cell): { face: Cell; sign: 1 | -1 }[] {
  return tau.map((_, i) => ({ face: tau.filter((_, j) => j !== i), sign: i % 2 === 0 ? 1 : -1 }));
}

/** Arithmetic the assembly is generic over: exact fractions or 64-bit floats. */
interface Scalars<S> {
  zero: S;
  one: S;
  parse(e: Entry): S;
  neg(a: S): S;
}

const fractions: Scalars<Fraction> = {
  zero: new Fraction(0),
  one: new Fraction(1),
  parse: (e) => new Fraction(e),
  neg: (a) => a.neg(),
};

const floats: Scalars<number> = {
  zero: 0,
  one: 1,
  parse: (e) => {
    if (typeof e === 'number') return e;
    const slash = e.indexOf('/');
    return slash < 0 ? Number(e) : Number(e.slice(0, slash)) / Number(e.slice(slash + 1));
  },
  neg: (a) => -a,
};

/** Everything about a model that the reference computes. */
export interface RefCochains<S> {
  complex: RefComplex;
  /** stalkDims[k][i]: the stalk dimension over the i-th k-simplex. */
  stalkDims: number[][];
  /** offsets[k][i]: first coordinate of cell i in C^k. */
  offsets: number[][];
  /** cochainDims[k] = dim C^k. */
  cochainDims: number[];
  /** delta[k]: the matrix of δ^k, dim C^(k+1) rows × dim C^k columns (δ^top has no rows). */
  delta: S[][][];
}

function assemble<S>(json: ModelJson, R: Scalars<S>): RefCochains<S> {
  const complex = closure(json.simplices);
  const top = complex.cells.length - 1;
  const stalkDims = complex.cells.map((cs) => cs.map(() => json.stalks.default));
  for (const { cell, dim } of json.stalks.cells ?? []) {
    const k = cell.length - 1;
    const i = complex.index[k]?.get(cellKey(cell));
    if (i === undefined) throw new Error(`reference: stalk cell [${cell}] is not in the complex`);
    stalkDims[k][i] = dim;
  }
  const offsets = stalkDims.map((ds) => {
    const off = [0];
    for (const d of ds) off.push(off[off.length - 1] + d);
    return off;
  });
  const cochainDims = offsets.map((o) => o[o.length - 1]);

  const given = new Map<string, MapEntryJson>();
  for (const e of json.maps.entries ?? []) given.set(`${cellKey(e.face)}|${cellKey(e.coface)}`, e);
  const restriction = (face: Cell, coface: Cell, rows: number, cols: number): S[][] => {
    const e = given.get(`${face.join(',')}|${coface.join(',')}`);
    const diag = (c: S) => Array.from({ length: rows }, (_, r) => Array.from({ length: cols }, (_, q) => (r === q ? c : R.zero)));
    if (e?.matrix) return e.matrix.map((row) => row.map((x) => R.parse(x)));
    if (e?.scalar !== undefined) return diag(R.parse(e.scalar));
    if (json.maps.default === 'zero') return diag(R.zero);
    if (rows !== cols) throw new Error(`reference: identity default between dimensions ${cols} and ${rows}`);
    return diag(R.one);
  };

  const delta: S[][][] = [];
  for (let k = 0; k <= top; k++) {
    const rows = k < top ? cochainDims[k + 1] : 0;
    const m: S[][] = Array.from({ length: rows }, () => new Array<S>(cochainDims[k]).fill(R.zero));
    if (k < top) {
      complex.cells[k + 1].forEach((tau, t) => {
        for (const { face, sign } of facesWithSign(tau)) {
          const s = complex.index[k].get(face.join(','))!;
          const block = restriction(face, tau, stalkDims[k + 1][t], stalkDims[k][s]);
          block.forEach((row, r) =>
            row.forEach((x, c) => {
              m[offsets[k + 1][t] + r][offsets[k][s] + c] = sign === 1 ? x : R.neg(x);
            }),
          );
        }
      });
    }
    delta.push(m);
  }
  return { complex, stalkDims, offsets, cochainDims, delta };
}

/** The exact cochain complex over Q (entries parsed exactly, "p/q" strings included). */
export const exactCochains = (json: ModelJson): RefCochains<Fraction> => assemble(json, fractions);

/** The cochain complex in 64-bit floating point. */
export const realCochains = (json: ModelJson): RefCochains<number> => assemble(json, floats);

/** Rank over Q by Gaussian elimination on fraction.js values. */
export function rankExact(m: readonly (readonly Fraction[])[]): number {
  const a = m.map((row) => [...row]);
  const rows = a.length;
  const cols = rows ? a[0].length : 0;
  let rank = 0;
  for (let c = 0; c < cols && rank < rows; c++) {
    let p = rank;
    while (p < rows && a[p][c].n === 0n) p++;
    if (p === rows) continue;
    [a[rank], a[p]] = [a[p], a[rank]];
    const pivot = a[rank][c];
    for (let r = rank + 1; r < rows; r++) {
      if (a[r][c].n === 0n) continue;
      const f = a[r][c].div(pivot);
      for (let q = c; q < cols; q++) if (a[rank][q].n !== 0n) a[r][q] = a[r][q].sub(f.mul(a[rank][q]));
    }
    rank++;
  }
  return rank;
}

/** A rational as a residue mod p (its denominator must be invertible mod p). */
export function residue(x: Fraction, p: bigint): bigint {
  const num = (((x.s * x.n) % p) + p) % p;
  return (num * modPow(x.d % p, p - 2n, p)) % p;
}

function modPow(b: bigint, e: bigint, p: bigint): bigint {
  let r = 1n;
  for (let x = b, k = e; k > 0n; k >>= 1n, x = (x * x) % p) if (k & 1n) r = (r * x) % p;
  return r;
}

/** Rank over GF(p) (p prime) by Gaussian elimination on BigInt residues. */
export function rankModP(m: readonly (readonly Fraction[])[], prime: number): number {
  const p = BigInt(prime);
  const a = m.map((row) => row.map((x) => residue(x, p)));
  const rows = a.length;
  const cols = rows ? a[0].length : 0;
  let rank = 0;
  for (let c = 0; c < cols && rank < rows; c++) {
    let q = rank;
    while (q < rows && a[q][c] === 0n) q++;
    if (q === rows) continue;
    [a[rank], a[q]] = [a[q], a[rank]];
    const inv = modPow(a[rank][c], p - 2n, p);
    for (let r = rank + 1; r < rows; r++) {
      if (a[r][c] === 0n) continue;
      const f = (a[r][c] * inv) % p;
      for (let j = c; j < cols; j++) a[r][j] = (((a[r][j] - f * a[rank][j]) % p) + p) % p;
    }
    rank++;
  }
  return rank;
}

/** δ^k · x over GF(p), for x given by residues (as a sections report in a prime field writes them). */
export function applyModP(ref: RefCochains<Fraction>, k: number, x: readonly Fraction[], prime: number): bigint[] {
  const p = BigInt(prime);
  return ref.delta[k].map((row) => row.reduce((acc, a, j) => (acc + residue(a, p) * residue(x[j], p)) % p, 0n));
}

/** Relative tolerance below which a singular value counts as zero (chosen for small well-conditioned inputs). */
export const REAL_RANK_TOLERANCE = 1e-8;

/** Numerical rank: singular values of ml-matrix's SVD above `tol` × the largest one. */
export function rankReal(m: readonly (readonly number[])[], tol = REAL_RANK_TOLERANCE): number {
  if (m.length === 0 || m[0].length === 0) return 0;
  const s = new SVD(new Matrix(m.map((r) => [...r])), { autoTranspose: true }).diagonal;
  const top = Math.max(...s);
  return top === 0 ? 0 : s.filter((x) => x > tol * top).length;
}

/** dim H^k = dim C^k − rank δ^k − rank δ^(k−1) (rank–nullity). */
export function referenceDims<S>(ref: RefCochains<S>, rank: (m: S[][]) => number): number[] {
  const ranks = ref.delta.map(rank);
  return ref.cochainDims.map((d, k) => d - ranks[k] - (k > 0 ? ranks[k - 1] : 0));
}

export function matMulExact(a: readonly (readonly Fraction[])[], b: readonly (readonly Fraction[])[], inner: number): Fraction[][] {
  const cols = b.length ? b[0].length : 0;
  return a.map((row) => {
    const out = new Array<Fraction>(cols).fill(fractions.zero);
    for (let i = 0; i < inner; i++) {
      if (row[i].n === 0n) continue;
      for (let j = 0; j < cols; j++) if (b[i][j].n !== 0n) out[j] = out[j].add(row[i].mul(b[i][j]));
    }
    return out;
  });
}

export function matMulReal(a: readonly (readonly number[])[], b: readonly (readonly number[])[], inner: number): number[][] {
  const cols = b.length ? b[0].length : 0;
  return a.map((row) => {
    const out = new Array<number>(cols).fill(0);
    for (let i = 0; i < inner; i++) for (let j = 0; j < cols; j++) out[j] += row[i] * b[i][j];
    return out;
  });
}

/**
 * A basis vector of a `sections` report as a coordinate vector of C^k in the
 * reference's cell order. `cells` are the report's k-simplices (vertex ids),
 * `values[c]` the value vector on cells[c].
 */
export function cochainFromSection<S>(
  ref: RefCochains<S>,
  k: number,
  cells: readonly (readonly number[])[],
  values: readonly (readonly Entry[])[],
  parse: (e: Entry) => S,
  zero: S,
): S[] {
  const x = new Array<S>(ref.cochainDims[k]).fill(zero);
  const seen = new Set<number>();
  cells.forEach((cell, c) => {
    const i = ref.complex.index[k].get(cellKey(cell));
    if (i === undefined) throw new Error(`sections names [${cell}], not a ${k}-simplex of the complex`);
    if (seen.has(i)) throw new Error(`sections names [${cell}] twice`);
    seen.add(i);
    if (values[c].length !== ref.stalkDims[k][i]) {
      throw new Error(`sections gives ${values[c].length} values on [${cell}], whose stalk has dimension ${ref.stalkDims[k][i]}`);
    }
    values[c].forEach((v, j) => {
      x[ref.offsets[k][i] + j] = parse(v);
    });
  });
  if (seen.size !== ref.complex.cells[k].length) throw new Error(`sections lists ${seen.size} of ${ref.complex.cells[k].length} ${k}-simplices`);
  return x;
}

export const parseExact = (e: Entry): Fraction => fractions.parse(e);
export const parseReal = (e: Entry): number => floats.parse(e);

/** δ^k · x over Q. */
export function applyExact(ref: RefCochains<Fraction>, k: number, x: readonly Fraction[]): Fraction[] {
  return ref.delta[k].map((row) => row.reduce((acc, a, j) => (a.n === 0n || x[j].n === 0n ? acc : acc.add(a.mul(x[j]))), fractions.zero));
}

/** δ^k · x in floating point. */
export function applyReal(ref: RefCochains<number>, k: number, x: readonly number[]): number[] {
  return ref.delta[k].map((row) => row.reduce((acc, a, j) => acc + a * x[j], 0));
}

/** Columns → matrix: the i-th vector becomes the i-th column. */
export function columns<S>(vectors: readonly (readonly S[])[], length: number): S[][] {
  return Array.from({ length }, (_, r) => vectors.map((v) => v[r]));
}

/** Columns of a matrix as vectors. */
export function columnsOf<S>(m: readonly (readonly S[])[], cols: number): S[][] {
  return Array.from({ length: cols }, (_, c) => m.map((row) => row[c]));
}
