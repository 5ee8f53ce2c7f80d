/**
 * fast-check arbitraries for small simplicial complexes and for sheaves on
 * them that satisfy the sheaf condition by construction, so every generated
 * model file is valid input. Each case carries its model json plus what the
 * construction knows about it (the constant sheaf it is isomorphic to).
 */
import fc from 'fast-check';
import Fraction from 'fraction.js';
import { inverse, Matrix } from 'ml-matrix';
import { closure, type Cell, type Entry, type MapEntryJson, type ModelJson, type RefComplex } from './reference';

// ---------------------------------------------------------------- complexes

/** A complex as a model file writes it, plus its closure. */
export interface ComplexCase {
  /** The `simplices` list of the file: vertex order inside a simplex and list order are scrambled on purpose. */
  simplices: number[][];
  complex: RefComplex;
}

function combinations(n: number, k: number): number[][] {
  const out: number[][] = [];
  const rec = (start: number, acc: number[]) => {
    if (acc.length === k) return void out.push(acc);
    for (let i = start; i < n; i++) rec(i + 1, [...acc, i]);
  };
  rec(0, []);
  return out;
}

/** Deterministic shuffle (a small LCG), so scrambling is part of the shrinkable value. */
function shuffled<T>(xs: readonly T[], seed: number): T[] {
  const a = [...xs];
  let s = seed >>> 0 || 1;
  for (let i = a.length - 1; i > 0; i--) {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    const j = s % (i + 1);
    [a[i], a[j]] = [a[j], a[i]];
  }
  return a;
}

const upTo = <T>(xs: T[], max: number) => fc.subarray(xs, { maxLength: Math.min(max, xs.length) });

/** Vertex ids: mostly 0…30, sometimes huge (any non-negative safe integer is a valid id). */
const vertexId = fc.oneof(
  { arbitrary: fc.integer({ min: 0, max: 30 }), weight: 4 },
  { arbitrary: fc.integer({ min: 2 ** 31, max: Number.MAX_SAFE_INTEGER }), weight: 1 },
);

const vertexCount = fc.oneof({ arbitrary: fc.integer({ min: 1, max: 3 }), weight: 1 }, { arbitrary: fc.integer({ min: 4, max: 7 }), weight: 3 });

interface ComplexDraw {
  ids: number[];
  edges: number[][];
  triangles: number[][];
  tetrahedra: number[][];
  listAllVertices: boolean;
  scramble: number;
}

function writeComplex({ ids, edges, triangles, tetrahedra, listAllVertices, scramble }: ComplexDraw): ComplexCase {
  const used = new Set([...edges, ...triangles, ...tetrahedra].flat());
  const singles = ids.map((_, i) => [i]).filter(([i]) => listAllVertices || !used.has(i));
  const written = [...singles, ...edges, ...triangles, ...tetrahedra].map((s) => s.map((i) => ids[i]));
  const simplices = shuffled(
    written.map((s, i) => shuffled(s, scramble + i)),
    scramble,
  );
  return { simplices, complex: closure(simplices) };
}

/**
 * Random complexes on 1–7 vertices with non-contiguous ids (so that the
 * orientation by increasing id differs from the generation order): random
 * edges, triangles and tetrahedra; vertices in no simplex are listed as [v].
 */
export const complexArb: fc.Arbitrary<ComplexCase> = vertexCount.chain((n) =>
  fc
    .record({
      ids: fc.uniqueArray(vertexId, { minLength: n, maxLength: n }),
      edges: upTo(combinations(n, 2), 10),
      triangles: upTo(combinations(n, 3), 6),
      tetrahedra: upTo(combinations(n, 4), 2),
      listAllVertices: fc.boolean(),
      scramble: fc.nat(),
    })
    .map(writeComplex),
);

/** Dense complexes on exactly 7 vertices: 10–35 triangles and up to 12 tetrahedra (up to 98 cells). */
export const denseComplexArb: fc.Arbitrary<ComplexCase> = fc
  .record({
    ids: fc.uniqueArray(vertexId, { minLength: 7, maxLength: 7 }),
    edges: upTo(combinations(7, 2), 5),
    triangles: fc.subarray(combinations(7, 3), { minLength: 10 }),
    tetrahedra: upTo(combinations(7, 4), 12),
    listAllVertices: fc.boolean(),
    scramble: fc.nat(),
  })
  .map(writeComplex);

const allCells = (c: RefComplex): Cell[] => c.cells.flat();

/** Every codimension-one pair σ ◁ τ with τ of degree ≥ 1. */
function facePairs(c: RefComplex): { face: Cell; coface: Cell }[] {
  const out: { face: Cell; coface: Cell }[] = [];
  for (let k = 1; k < c.cells.length; k++) {
    for (const tau of c.cells[k]) for (let i = 0; i < tau.length; i++) out.push({ face: tau.filter((_, j) => j !== i), coface: tau });
  }
  return out;
}

// ---------------------------------------------------------- exact matrices

type FMat = Fraction[][];
const F0 = new Fraction(0);
const F1 = new Fraction(1);

const identityF = (d: number): FMat => Array.from({ length: d }, (_, i) => Array.from({ length: d }, (_, j) => (i === j ? F1 : F0)));

function mulF(a: FMat, b: FMat): FMat {
  const inner = b.length;
  const cols = inner ? b[0].length : 0;
  return a.map((row) => Array.from({ length: cols }, (_, j) => row.reduce((s, x, i) => (i < inner ? s.add(x.mul(b[i][j])) : s), F0)));
}

/** Determinant by elimination (d ≤ 3 here). */
function detF(m: FMat): Fraction {
  const a = m.map((r) => [...r]);
  let det = F1;
  for (let c = 0; c < a.length; c++) {
    const p = a.findIndex((row, r) => r >= c && row[c].n !== 0n);
    if (p < 0) return F0;
    if (p !== c) {
      [a[p], a[c]] = [a[c], a[p]];
      det = det.neg();
    }
    det = det.mul(a[c][c]);
    for (let r = c + 1; r < a.length; r++) {
      const f = a[r][c].div(a[c][c]);
      for (let q = c; q < a.length; q++) a[r][q] = a[r][q].sub(f.mul(a[c][q]));
    }
  }
  return det;
}

/** Inverse by Gauss–Jordan; the caller guarantees invertibility. */
function invF(m: FMat): FMat {
  const d = m.length;
  const a = m.map((row, i) => [...row, ...identityF(d)[i]]);
  for (let c = 0; c < d; c++) {
    const p = a.findIndex((row, r) => r >= c && row[c].n !== 0n);
    [a[p], a[c]] = [a[c], a[p]];
    const piv = a[c][c];
    a[c] = a[c].map((x) => x.div(piv));
    for (let r = 0; r < d; r++) {
      if (r === c || a[r][c].n === 0n) continue;
      const f = a[r][c];
      a[r] = a[r].map((x, q) => x.sub(f.mul(a[c][q])));
    }
  }
  return a.map((row) => row.slice(d));
}

/**
 * A fraction as a model-file entry: a JSON integer, or a "p/q" string; with
 * `decimal`, a terminating fraction is written as an exact decimal string
 * ("-0.125"), which the rational field must read exactly (model-format.md).
 */
export function entryOf(x: Fraction, decimal = false): Entry {
  const sign = x.s < 0n ? -1n : 1n;
  const num = sign * x.n;
  if (x.d === 1n) return Number(num);
  if (decimal) {
    let d = x.d;
    let twos = 0;
    let fives = 0;
    while (d % 2n === 0n) (d /= 2n), twos++;
    while (d % 5n === 0n) (d /= 5n), fives++;
    if (d === 1n) {
      const places = Math.max(twos, fives);
      const scaled = (x.n * 10n ** BigInt(places)) / x.d;
      const digits = scaled.toString().padStart(places + 1, '0');
      return `${sign < 0n ? '-' : ''}${digits.slice(0, -places)}.${digits.slice(-places)}`;
    }
  }
  return `${num}/${x.d}`;
}

const isScalar = (m: FMat) => m.every((row, i) => row.length === m.length && row.every((x, j) => (i === j ? x.equals(m[0][0]) : x.n === 0n)));

/** How a map is written: as a `scalar` when it is c·I and `scalars` is on, else as a matrix. */
function writeMap(face: Cell, coface: Cell, m: FMat, style: WriteStyle): MapEntryJson {
  if (style.scalars && m.length > 0 && isScalar(m)) return { face, coface, scalar: entryOf(m[0][0], style.decimals) };
  return { face, coface, matrix: m.map((row) => row.map((x) => entryOf(x, style.decimals))) };
}

/** Spelling choices of a model file that must not change its meaning. */
export interface WriteStyle {
  scalars: boolean;
  decimals: boolean;
}

export const writeStyleArb: fc.Arbitrary<WriteStyle> = fc.record({ scalars: fc.boolean(), decimals: fc.boolean() });

const isIdentity = (m: FMat) => m.every((row, i) => row.length === m.length && row.every((x, j) => x.equals(i === j ? 1 : 0)));
const isZero = (m: FMat) => m.every((row) => row.every((x) => x.n === 0n));

// ------------------------------------------------- (a) re-based constant sheaves

/** A sheaf isomorphic to the constant sheaf Q^d, and that constant sheaf. */
export interface RebasedCase {
  d: number;
  json: ModelJson;
  /** The constant sheaf Q^d on the same complex (identity maps by default). */
  constant: ModelJson;
}

const constantJson = (simplices: number[][], d: number, field?: ModelJson['field']): ModelJson => ({
  format: 'gluefield.sheaf',
  version: 1,
  ...(field ? { field } : {}),
  simplices,
  stalks: { default: d },
  maps: { default: 'identity' },
});

/**
 * Invertible P (d×d) from nine small integers: the top-left block, shifted by
 * c·I for the first c in 0…d that makes it invertible (a d×d matrix has at
 * most d eigenvalues, so one of d+1 shifts works).
 */
function invertibleFrom(raw: readonly number[], d: number): FMat {
  const m = Array.from({ length: d }, (_, i) => Array.from({ length: d }, (_, j) => new Fraction(raw[i * 3 + j])));
  for (let c = 0; ; c++) {
    const shifted = m.map((row, i) => row.map((x, j) => (i === j ? x.add(c) : x)));
    if (detF(shifted).n !== 0n) return shifted;
  }
}

/** Unimodular P = L·D·U (unit triangular L, U and D = diag(±1)), so P and P⁻¹ are integral. */
function unimodularFrom(raw: readonly number[], d: number): FMat {
  const L = Array.from({ length: d }, (_, i) => Array.from({ length: d }, (_, j) => new Fraction(i === j ? 1 : i > j ? raw[i * 3 + j] : 0)));
  const U = Array.from({ length: d }, (_, i) => Array.from({ length: d }, (_, j) => new Fraction(i === j ? 1 : i < j ? raw[i * 3 + j] : 0)));
  const D = Array.from({ length: d }, (_, i) => Array.from({ length: d }, (_, j) => new Fraction(i !== j ? 0 : raw[i * 4] < 0 ? -1 : 1)));
  return mulF(mulF(L, D), U);
}

function buildRebased(c: ComplexCase, d: number, pool: number[][], integral: boolean, omitIdentity: boolean, style: WriteStyle): RebasedCase {
  const P = new Map<string, FMat>();
  allCells(c.complex).forEach((cell, g) => {
    const raw = pool[g];
    P.set(cell.join(','), raw === undefined ? identityF(d) : integral ? unimodularFrom(raw, d) : invertibleFrom(raw, d));
  });
  const entries: MapEntryJson[] = [];
  for (const { face, coface } of facePairs(c.complex)) {
    // F(σ ◁ τ) = P_τ · P_σ⁻¹: every diamond composes to P_ω P_σ⁻¹, so the sheaf condition holds exactly.
    const m = mulF(P.get(coface.join(','))!, invF(P.get(face.join(','))!));
    if (omitIdentity && isIdentity(m)) continue;
    entries.push(writeMap(face, coface, m, style));
  }
  return {
    d,
    json: { ...constantJson(c.simplices, d), maps: { default: 'identity', entries } },
    constant: constantJson(c.simplices, d),
  };
}

const rawMatrix = fc.array(fc.integer({ min: -3, max: 3 }), { minLength: 9, maxLength: 9 });

/**
 * (a) Re-based constant sheaves: stalk Q^d (d = 1…3) everywhere, a random
 * invertible integer matrix P_σ per cell (cells beyond the pool keep P = I),
 * F(σ ◁ τ) = P_τ·P_σ⁻¹ written as exact fractions.
 */
export const rebasedOn = (complexes: fc.Arbitrary<ComplexCase> = complexArb): fc.Arbitrary<RebasedCase> =>
  fc
    .record({
      complex: complexes,
      d: fc.integer({ min: 1, max: 3 }),
      pool: fc.array(rawMatrix, { maxLength: 100, size: 'max' }),
      omitIdentity: fc.boolean(),
      style: writeStyleArb,
    })
    .map(({ complex, d, pool, omitIdentity, style }) => buildRebased(complex, d, pool, false, omitIdentity, style));

export const rebasedArb = rebasedOn();

/** As {@link rebasedArb} with unimodular P_σ: every map has integer entries. */
export const integerRebasedOn = (complexes: fc.Arbitrary<ComplexCase> = complexArb): fc.Arbitrary<RebasedCase> =>
  fc
    .record({
      complex: complexes,
      d: fc.integer({ min: 1, max: 3 }),
      pool: fc.array(rawMatrix, { maxLength: 100, size: 'max' }),
      omitIdentity: fc.boolean(),
      style: writeStyleArb,
    })
    .map(({ complex, d, pool, omitIdentity, style }) => buildRebased(complex, d, pool, true, omitIdentity, style));

export const integerRebasedArb = integerRebasedOn();

// --------------------------------------------------------- (b) quotient sheaves

export interface QuotientCase {
  n: number;
  /** kernels[vertex id]: the vectors spanning K_v. */
  kernels: Record<number, number[][]>;
  json: ModelJson;
}

/** Reduced row echelon form of the rows spanning a subspace: its nonzero rows and their pivot columns. */
function rref(vectors: readonly (readonly number[])[], n: number): { rows: FMat; pivots: number[] } {
  const a = vectors.map((v) => v.map((x) => new Fraction(x)));
  const pivots: number[] = [];
  let r = 0;
  for (let c = 0; c < n && r < a.length; c++) {
    const p = a.findIndex((row, i) => i >= r && row[c].n !== 0n);
    if (p < 0) continue;
    [a[p], a[r]] = [a[r], a[p]];
    const piv = a[r][c];
    a[r] = a[r].map((x) => x.div(piv));
    for (let i = 0; i < a.length; i++) {
      if (i === r || a[i][c].n === 0n) continue;
      const f = a[i][c];
      a[i] = a[i].map((x, q) => x.sub(f.mul(a[r][q])));
    }
    pivots.push(c);
    r++;
  }
  return { rows: a.slice(0, r), pivots };
}

/**
 * The quotient V → V/K for V = Q^n, coordinates of V/K = the non-pivot
 * coordinates after reducing modulo the RREF rows: q(v)_j = v_j − Σ_i v_(p_i)·R_i[j].
 * Its kernel is exactly K; L (insert the non-pivot coordinates, zeros at the
 * pivots) is a section, q·L = I.
 */
function quotient(vectors: readonly (readonly number[])[], n: number): { q: FMat; L: FMat; free: number[] } {
  const { rows, pivots } = rref(vectors, n);
  const free = Array.from({ length: n }, (_, j) => j).filter((j) => !pivots.includes(j));
  const q = free.map((j) => {
    const row = Array.from({ length: n }, (_, c) => (c === j ? F1 : F0));
    rows.forEach((R, i) => {
      row[pivots[i]] = R[j].neg();
    });
    return row;
  });
  const L = Array.from({ length: n }, (_, c) => free.map((j) => (c === j ? F1 : F0)));
  return { q, L, free };
}

function buildQuotient(
  c: ComplexCase,
  n: number,
  pool: number[][][],
  mapsDefault: 'identity' | 'zero',
  stalkDefault: number,
  style: WriteStyle,
  rebase: readonly (readonly number[])[] = [],
): QuotientCase {
  const vertexIds = c.complex.cells[0].map(([v]) => v);
  const kernels: Record<number, number[][]> = {};
  vertexIds.forEach((v, i) => {
    kernels[v] = (pool[i] ?? []).map((vec) => vec.slice(0, n));
  });
  const Q = new Map<string, ReturnType<typeof quotient>>();
  for (const cell of allCells(c.complex)) Q.set(cell.join(','), quotient(cell.flatMap((v) => kernels[v]), n));
  const stalkCells = allCells(c.complex)
    .map((cell) => ({ cell, dim: Q.get(cell.join(','))!.free.length }))
    .filter(({ dim }) => dim !== stalkDefault);
  // Optional change of basis P_σ in every stalk (identity beyond the pool): F' = P_τ F P_σ⁻¹ is an isomorphic sheaf.
  const P = new Map<string, FMat>();
  allCells(c.complex).forEach((cell, g) => {
    const dim = Q.get(cell.join(','))!.free.length;
    P.set(cell.join(','), rebase[g] === undefined ? identityF(dim) : invertibleFrom(rebase[g], dim));
  });
  const entries: MapEntryJson[] = [];
  for (const { face, coface } of facePairs(c.complex)) {
    // K_σ ⊆ K_τ, so F = q_τ·L_σ is the induced map V/K_σ → V/K_τ, and the composites are q_ω·L_σ.
    const induced = mulF(Q.get(coface.join(','))!.q, Q.get(face.join(','))!.L);
    const m = mulF(mulF(P.get(coface.join(','))!, induced), invF(P.get(face.join(','))!));
    const square = Q.get(coface.join(','))!.free.length === Q.get(face.join(','))!.free.length;
    if (mapsDefault === 'identity' && square && isIdentity(m)) continue;
    if (mapsDefault === 'zero' && isZero(m)) continue;
    entries.push(writeMap(face, coface, m, style));
  }
  return {
    n,
    kernels,
    json: {
      format: 'gluefield.sheaf',
      version: 1,
      simplices: c.simplices,
      stalks: { default: stalkDefault, cells: stalkCells },
      maps: { default: mapsDefault, entries },
    },
  };
}

/** Per vertex (in increasing id order), 0–2 vectors with entries in −2…2 spanning K_v. */
const kernelPool = fc.array(fc.array(fc.array(fc.integer({ min: -2, max: 2 }), { minLength: 3, maxLength: 3 }), { maxLength: 2 }), { maxLength: 7 });

/**
 * (b) Quotient sheaves V/ΣK_v: V = Q^n (n = 1…3), each vertex a subspace K_v
 * spanned by 0–2 random vectors with entries in −2…2, the stalk over σ is
 * V / span(K_v : v ∈ σ) and the maps are the induced quotient maps. They are
 * not invertible in general and stalks of dimension 0 occur. Maps equal to
 * the file's default (identity or zero) are left out of `maps.entries`, and
 * `stalks.default` is random, so only cells of other dimension are listed.
 */
export const quotientOn = (complexes: fc.Arbitrary<ComplexCase> = complexArb): fc.Arbitrary<QuotientCase> =>
  fc
    .record({
      complex: complexes,
      n: fc.integer({ min: 1, max: 3 }),
      pool: kernelPool,
      mapsDefault: fc.constantFrom('identity' as const, 'zero' as const),
      stalkDefault: fc.integer({ min: 0, max: 3 }),
      style: writeStyleArb,
    })
    .map(({ complex, n, pool, mapsDefault, stalkDefault, style }) => buildQuotient(complex, n, pool, mapsDefault, stalkDefault, style));

export const quotientArb = quotientOn();

// ------------------------------------------------ (c) re-based sheaves over R

/**
 * (c) Re-based constant sheaves over the reals: P_σ = 2I + A with |A_ij| ≤ 0.5
 * (three decimals), strictly diagonally dominant and so invertible and well
 * conditioned; F(σ ◁ τ) = P_τ·P_σ⁻¹ in 64-bit floating point.
 */
export const realRebasedOn = (complexes: fc.Arbitrary<ComplexCase> = complexArb): fc.Arbitrary<RebasedCase> =>
  fc
    .record({
      complex: complexes,
      d: fc.integer({ min: 1, max: 3 }),
      pool: fc.array(fc.array(fc.integer({ min: -500, max: 500 }), { minLength: 9, maxLength: 9 }), { maxLength: 100, size: 'max' }),
    })
    .map(({ complex, d, pool }) => {
      const field = { kind: 'real' as const };
      const P = new Map<string, Matrix>();
      allCells(complex.complex).forEach((cell, g) => {
        const raw = pool[g];
        P.set(
          cell.join(','),
          new Matrix(Array.from({ length: d }, (_, i) => Array.from({ length: d }, (_, j) => (i === j ? 2 : 0) + (raw ? raw[i * 3 + j] / 1000 : 0)))),
        );
      });
      const entries: MapEntryJson[] = facePairs(complex.complex).map(({ face, coface }) => ({
        face,
        coface,
        matrix: P.get(coface.join(','))!.mmul(inverse(P.get(face.join(','))!)).to2DArray(),
      }));
      return {
        d,
        json: { ...constantJson(complex.simplices, d, field), maps: { default: 'identity', entries } },
        constant: constantJson(complex.simplices, d),
      };
    });

export const realRebasedArb = realRebasedOn();

/** A quotient sheaf and the same sheaf with every stalk re-based by a random invertible P_σ. */
export interface RebasedQuotientCase {
  plain: QuotientCase;
  json: ModelJson;
}

/**
 * (b′) Quotient sheaves re-based stalk by stalk, F' = P_τ F P_σ⁻¹: isomorphic
 * to the plain quotient sheaf, but with dense non-invertible blocks.
 */
export const rebasedQuotientOn = (complexes: fc.Arbitrary<ComplexCase> = complexArb): fc.Arbitrary<RebasedQuotientCase> =>
  fc
    .record({
      complex: complexes,
      n: fc.integer({ min: 1, max: 3 }),
      pool: kernelPool,
      mapsDefault: fc.constantFrom('identity' as const, 'zero' as const),
      stalkDefault: fc.integer({ min: 0, max: 3 }),
      style: writeStyleArb,
      rebase: fc.array(rawMatrix, { maxLength: 100, size: 'max' }),
    })
    .map(({ complex, n, pool, mapsDefault, stalkDefault, style, rebase }) => ({
      plain: buildQuotient(complex, n, pool, mapsDefault, stalkDefault, style),
      json: buildQuotient(complex, n, pool, mapsDefault, stalkDefault, style, rebase).json,
    }));

export const rebasedQuotientArb = rebasedQuotientOn();
