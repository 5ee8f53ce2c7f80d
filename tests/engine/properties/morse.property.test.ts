/**
 * Property tests of the cohomology engine against an independent reference
 * (./reference.ts: own closure, orientation and signs; fraction.js for exact
 * ranks, ml-matrix SVD for real ranks) on random valid sheaves
 * (./generators.ts). The identities are those of docs/check-values.md,
 * "Identities that hold for every input".
 */
import fc from 'fast-check';
import type Fraction from 'fraction.js';
import { describe, expect, it } from 'vitest';
import { cohomology, sections } from '../../../shared/engine';
import {
  applyExact,
  applyModP,
  applyReal,
  columns,
  columnsOf,
  cochainFromSection,
  exactCochains,
  matMulExact,
  matMulReal,
  parseExact,
  parseReal,
  rankExact,
  rankModP,
  rankReal,
  realCochains,
  referenceDims,
  type ModelJson,
} from './reference';
import {
  denseComplexArb,
  integerRebasedArb,
  quotientArb,
  realRebasedArb,
  rebasedArb,
  rebasedOn,
  rebasedQuotientArb,
  rebasedQuotientOn,
} from './generators';

/** Kept modest so the file runs well under 20 s; raise with GLUEFIELD_PROPERTY_RUNS=<factor>. */
const FACTOR = Number(process.env.GLUEFIELD_PROPERTY_RUNS ?? 1);
const runs = (n: number) => ({ numRuns: Math.max(1, Math.round(n * FACTOR)) });

const RATIONAL = { kind: 'rational' } as const;
const REAL = { kind: 'real' } as const;
const BIG_PRIME = { kind: 'prime', p: 1000003 } as const;
/** 2^31 − 1, the largest prime the model format allows (residue products exceed 2^53 here). */
const MERSENNE_31 = { kind: 'prime', p: 2147483647 } as const;

const alternating = (v: readonly number[]) => v.reduce((s, x, k) => (k % 2 === 0 ? s + x : s - x), 0);
const exactDims = (json: ModelJson) => referenceDims(exactCochains(json), rankExact);
const realDims = (json: ModelJson) => referenceDims(realCochains(json), (m) => rankReal(m));

// ------------------------------------------------------------- shared checks

function morseMatchesDirect(json: ModelJson, field: typeof RATIONAL | typeof REAL): void {
  const direct = cohomology(json, { method: 'direct', field });
  expect(cohomology(json, { method: 'morse', field }).dims).toEqual(direct.dims);
  expect(cohomology(json, { method: 'morse', field, splitBlocks: false }).dims).toEqual(direct.dims);
}

function matchesExactReference(json: ModelJson): void {
  const ref = exactCochains(json);
  const expected = referenceDims(ref, rankExact);
  for (const method of ['morse', 'direct'] as const) {
    const r = cohomology(json, { method, field: RATIONAL });
    expect(r.cells).toEqual(ref.complex.cells.map((c) => c.length));
    expect(r.cochainDims).toEqual(ref.cochainDims);
    expect(r.dims).toEqual(expected);
  }
}

function eulerIdentity(json: ModelJson, field: typeof RATIONAL | typeof REAL): void {
  for (const method of ['morse', 'direct'] as const) {
    const r = cohomology(json, { method, field });
    expect(r.euler).toBe(alternating(r.cochainDims));
    expect(alternating(r.dims)).toBe(r.euler);
  }
}

function coboundarySquaresToZeroExact(json: ModelJson): void {
  const ref = exactCochains(json);
  for (let k = 0; k + 1 < ref.delta.length; k++) {
    const dd = matMulExact(ref.delta[k + 1], ref.delta[k], ref.cochainDims[k + 1]);
    expect(dd.every((row) => row.every((x) => x.n === 0n))).toBe(true);
  }
}

function morseStatsConsistent(json: ModelJson, field: typeof RATIONAL | typeof REAL): void {
  const r = cohomology(json, { method: 'morse', field });
  const m = r.morse!;
  expect(m).toBeDefined();
  expect(alternating(m.criticalCochainDims)).toBe(r.euler);
  expect(alternating(m.blockCriticalCochainDims)).toBe(r.euler);
  r.dims.forEach((h, k) => {
    expect(m.criticalCochainDims[k]).toBeGreaterThanOrEqual(h);
    expect(m.blockCriticalCochainDims[k]).toBeGreaterThanOrEqual(m.criticalCochainDims[k]);
    expect(m.blockCriticalCochainDims[k]).toBeLessThanOrEqual(r.cochainDims[k]);
  });
}

/**
 * Every basis vector of H^k is a cocycle (δ^k x = 0 exactly) and the basis
 * is independent modulo im δ^(k−1): rank [δ^(k−1) | X] = rank δ^(k−1) + dim H^k.
 */
function sectionsAreCohomologyBasisExact(json: ModelJson, method: 'morse' | 'direct'): void {
  const ref = exactCochains(json);
  const dims = referenceDims(ref, rankExact);
  for (let k = 0; k < ref.cochainDims.length; k++) {
    const s = sections(json, k, { method, field: RATIONAL });
    expect(s.basis.length).toBe(dims[k]);
    const X = s.basis.map((b) => cochainFromSection(ref, k, s.cells, b, parseExact, parseExact(0)));
    for (const x of X) expect(applyExact(ref, k, x).every((y) => y.n === 0n)).toBe(true);
    const image: Fraction[][] = k > 0 ? columnsOf(ref.delta[k - 1], ref.cochainDims[k - 1]) : [];
    const rImage = k > 0 ? rankExact(ref.delta[k - 1]) : 0;
    expect(rankExact(columns([...image, ...X], ref.cochainDims[k]))).toBe(rImage + X.length);
  }
}

/** As {@link sectionsAreCohomologyBasisExact} over GF(p): residues, cocycles mod p, rank mod p. */
function sectionsAreCohomologyBasisModP(json: ModelJson, method: 'morse' | 'direct', p: number): void {
  const ref = exactCochains(json);
  const field = { kind: 'prime', p } as const;
  const dims = cohomology(json, { method, field }).dims;
  for (let k = 0; k < ref.cochainDims.length; k++) {
    const s = sections(json, k, { method, field });
    expect(s.basis.length).toBe(dims[k]);
    for (const v of s.basis.flat(2)) expect(Number.isInteger(v) && (v as number) >= 0 && (v as number) < p).toBe(true);
    const X = s.basis.map((b) => cochainFromSection(ref, k, s.cells, b, parseExact, parseExact(0)));
    for (const x of X) expect(applyModP(ref, k, x, p).every((y) => y === 0n)).toBe(true);
    const image: Fraction[][] = k > 0 ? columnsOf(ref.delta[k - 1], ref.cochainDims[k - 1]) : [];
    const rImage = k > 0 ? rankModP(ref.delta[k - 1], p) : 0;
    expect(rankModP(columns([...image, ...X], ref.cochainDims[k]), p)).toBe(rImage + X.length);
  }
}

// ------------------------------------------------- (a) re-based constant sheaves

describe('re-based constant sheaves F(σ◁τ) = P_τ P_σ⁻¹ over Q', () => {
  it('Morse and direct methods give the same dimensions, with and without split blocks (check-values: identities)', () => {
    fc.assert(fc.property(rebasedArb, ({ json }) => morseMatchesDirect(json, RATIONAL)), runs(80));
  });

  it('dim H^k = dim C^k − rank δ^k − rank δ^(k−1) against a fraction.js elimination (rank–nullity)', () => {
    fc.assert(fc.property(rebasedArb, ({ json }) => matchesExactReference(json)), runs(80));
  });

  it('Σ(−1)^k dim C^k = Σ(−1)^k dim H^k = euler (rank–nullity)', () => {
    fc.assert(fc.property(rebasedArb, ({ json }) => eulerIdentity(json, RATIONAL)), runs(60));
  });

  it('δ^(k+1) δ^k = 0 on the independently assembled coboundaries (sheaf condition, model-format.md)', () => {
    fc.assert(fc.property(rebasedArb, ({ json }) => coboundarySquaresToZeroExact(json)), runs(60));
  });

  it('has the cohomology of the constant sheaf Q^d (isomorphic sheaves, common practice; Hatcher ch. 3)', () => {
    fc.assert(
      fc.property(rebasedArb, ({ json, constant, d }) => {
        const c = cohomology(constant, { method: 'direct', field: RATIONAL }).dims;
        expect(cohomology(json, { method: 'morse', field: RATIONAL }).dims).toEqual(c);
        expect(cohomology(json, { method: 'direct', field: RATIONAL }).dims).toEqual(c);
        // A constant sheaf of dimension d multiplies every Betti number by d (check-values.md, Hatcher).
        const betti = exactDims({ ...constant, stalks: { default: 1 } });
        expect(c).toEqual(betti.map((b) => d * b));
      }),
      runs(60),
    );
  });

  it('Morse critical cochain dimensions keep the Euler characteristic and bound dim H^k (Forman 1998)', () => {
    fc.assert(fc.property(rebasedArb, ({ json }) => morseStatsConsistent(json, RATIONAL)), runs(60));
  });

  it('sections of H^k are cocycles, independent modulo coboundaries (engine-notes: checks worth keeping)', () => {
    fc.assert(
      fc.property(rebasedArb, fc.constantFrom('morse' as const, 'direct' as const), ({ json }, method) =>
        sectionsAreCohomologyBasisExact(json, method),
      ),
      runs(50),
    );
  });

  it('GF(1000003), GF(2^31 − 1) and Q agree on integer inputs (unimodular re-basing; check-values: identities)', () => {
    fc.assert(
      fc.property(integerRebasedArb, ({ json }) => {
        const q = cohomology(json, { method: 'direct', field: RATIONAL }).dims;
        for (const field of [BIG_PRIME, MERSENNE_31]) {
          expect(cohomology(json, { method: 'morse', field }).dims).toEqual(q);
          expect(cohomology(json, { method: 'direct', field }).dims).toEqual(q);
        }
      }),
      runs(60),
    );
  });

  it('sections over GF(p) are cocycles mod p and independent modulo coboundaries (rank mod p)', () => {
    fc.assert(
      fc.property(integerRebasedArb, fc.constantFrom('morse' as const, 'direct' as const), fc.constantFrom(1000003, 2147483647), ({ json }, method, p) =>
        sectionsAreCohomologyBasisModP(json, method, p),
      ),
      runs(50),
    );
  });
});

// --------------------------------------------------------- (b) quotient sheaves

describe('quotient sheaves V/ΣK_v over Q (non-invertible maps, zero stalks)', () => {
  it('Morse and direct methods give the same dimensions, with and without split blocks (check-values: identities)', () => {
    fc.assert(fc.property(quotientArb, ({ json }) => morseMatchesDirect(json, RATIONAL)), runs(100));
  });

  it('dim H^k = dim C^k − rank δ^k − rank δ^(k−1) against a fraction.js elimination (rank–nullity)', () => {
    fc.assert(fc.property(quotientArb, ({ json }) => matchesExactReference(json)), runs(100));
  });

  it('Σ(−1)^k dim C^k = Σ(−1)^k dim H^k = euler (rank–nullity)', () => {
    fc.assert(fc.property(quotientArb, ({ json }) => eulerIdentity(json, RATIONAL)), runs(60));
  });

  it('δ^(k+1) δ^k = 0 on the independently assembled coboundaries (sheaf condition, model-format.md)', () => {
    fc.assert(fc.property(quotientArb, ({ json }) => coboundarySquaresToZeroExact(json)), runs(60));
  });

  it('Morse critical cochain dimensions keep the Euler characteristic and bound dim H^k (Forman 1998)', () => {
    fc.assert(fc.property(quotientArb, ({ json }) => morseStatsConsistent(json, RATIONAL)), runs(80));
  });

  it('sections of H^k are cocycles, independent modulo coboundaries (engine-notes: checks worth keeping)', () => {
    fc.assert(
      fc.property(quotientArb, fc.constantFrom('morse' as const, 'direct' as const), ({ json }, method) =>
        sectionsAreCohomologyBasisExact(json, method),
      ),
      runs(60),
    );
  });

  it('GF(1000003), GF(2^31 − 1) and Q agree (small denominators, invertible mod p; check-values: identities)', () => {
    fc.assert(
      fc.property(quotientArb, ({ json }) => {
        const q = cohomology(json, { method: 'direct', field: RATIONAL }).dims;
        for (const field of [BIG_PRIME, MERSENNE_31]) {
          expect(cohomology(json, { method: 'morse', field }).dims).toEqual(q);
          expect(cohomology(json, { method: 'direct', field }).dims).toEqual(q);
        }
      }),
      runs(60),
    );
  });

  it('sections over GF(p) are cocycles mod p and independent modulo coboundaries (rank mod p)', () => {
    fc.assert(
      fc.property(quotientArb, fc.constantFrom('morse' as const, 'direct' as const), fc.constantFrom(1000003, 2147483647), ({ json }, method, p) =>
        sectionsAreCohomologyBasisModP(json, method, p),
      ),
      runs(40),
    );
  });

  it('the real field agrees with Q and with an ml-matrix SVD rank of the float coboundaries', () => {
    fc.assert(
      fc.property(quotientArb, ({ json }) => {
        const q = exactDims(json);
        expect(realDims(json)).toEqual(q);
        expect(cohomology(json, { method: 'morse', field: REAL }).dims).toEqual(q);
        expect(cohomology(json, { method: 'direct', field: REAL }).dims).toEqual(q);
      }),
      runs(60),
    );
  });
});

// ------------------------------------------- (b′) re-based quotient sheaves

describe('re-based quotient sheaves F′ = P_τ F P_σ⁻¹ over Q (dense non-invertible blocks)', () => {
  it('Morse (with and without split blocks) and direct agree and match the fraction.js reference (rank–nullity)', () => {
    fc.assert(
      fc.property(rebasedQuotientArb, ({ json }) => {
        morseMatchesDirect(json, RATIONAL);
        matchesExactReference(json);
        coboundarySquaresToZeroExact(json);
      }),
      runs(80),
    );
  });

  it('has the cohomology of the quotient sheaf it re-bases (isomorphic sheaves, common practice)', () => {
    fc.assert(
      fc.property(rebasedQuotientArb, ({ json, plain }) => {
        const expected = cohomology(plain.json, { method: 'direct', field: RATIONAL }).dims;
        expect(cohomology(json, { method: 'morse', field: RATIONAL }).dims).toEqual(expected);
        expect(exactDims(json)).toEqual(expected);
      }),
      runs(60),
    );
  });

  it('Morse statistics keep the Euler characteristic; sections are a basis of H^k (rank–nullity; engine-notes checks)', () => {
    fc.assert(
      fc.property(rebasedQuotientArb, fc.constantFrom('morse' as const, 'direct' as const), ({ json }, method) => {
        eulerIdentity(json, RATIONAL);
        morseStatsConsistent(json, RATIONAL);
        sectionsAreCohomologyBasisExact(json, method);
      }),
      runs(60),
    );
  });

  it('GF(1000003), GF(2^31 − 1), the real field and Q agree (check-values: identities; ml-matrix SVD reference)', () => {
    fc.assert(
      fc.property(rebasedQuotientArb, ({ json }) => {
        const q = exactDims(json);
        expect(realDims(json)).toEqual(q);
        for (const method of ['morse', 'direct'] as const) {
          expect(cohomology(json, { method, field: BIG_PRIME }).dims).toEqual(q);
          expect(cohomology(json, { method, field: MERSENNE_31 }).dims).toEqual(q);
          expect(cohomology(json, { method, field: REAL }).dims).toEqual(q);
        }
      }),
      runs(60),
    );
  });
});

// ------------------------------------------- dense complexes on 7 vertices

describe('dense complexes on 7 vertices (10–35 triangles, up to 12 tetrahedra)', () => {
  it('re-based constant sheaves: Morse = direct = constant sheaf = fraction.js reference (rank–nullity; isomorphic sheaves)', () => {
    fc.assert(
      fc.property(rebasedOn(denseComplexArb), ({ json, constant }) => {
        const expected = exactDims(constant);
        expect(cohomology(json, { method: 'morse', field: RATIONAL }).dims).toEqual(expected);
        expect(cohomology(json, { method: 'direct', field: RATIONAL }).dims).toEqual(expected);
      }),
      runs(20),
    );
  });

  it('re-based quotient sheaves: Morse (split or not) = direct = reference, and the sections are a basis', () => {
    fc.assert(
      fc.property(rebasedQuotientOn(denseComplexArb), ({ json }) => {
        morseMatchesDirect(json, RATIONAL);
        matchesExactReference(json);
        morseStatsConsistent(json, RATIONAL);
        sectionsAreCohomologyBasisExact(json, 'morse');
      }),
      runs(20),
    );
  });
});

// ---------------------------------------------- (c) re-based sheaves over R

describe('re-based constant sheaves over R (float entries)', () => {
  it('dims from Morse and direct equal the ml-matrix SVD reference and the constant sheaf over Q (rank–nullity; isomorphic sheaves)', () => {
    fc.assert(
      fc.property(realRebasedArb, ({ json, constant }) => {
        const expected = exactDims(constant);
        expect(realDims(json)).toEqual(expected);
        expect(cohomology(json, { method: 'morse' }).dims).toEqual(expected);
        expect(cohomology(json, { method: 'direct' }).dims).toEqual(expected);
        expect(cohomology(json, { method: 'morse', splitBlocks: false }).dims).toEqual(expected);
      }),
      runs(80),
    );
  });

  it('Σ(−1)^k dim C^k = Σ(−1)^k dim H^k and the Morse statistics keep it (rank–nullity)', () => {
    fc.assert(
      fc.property(realRebasedArb, ({ json }) => {
        eulerIdentity(json, REAL);
        morseStatsConsistent(json, REAL);
      }),
      runs(60),
    );
  });

  it('δ^(k+1) δ^k = 0 within rounding on the independently assembled coboundaries', () => {
    fc.assert(
      fc.property(realRebasedArb, ({ json }) => {
        const ref = realCochains(json);
        for (let k = 0; k + 1 < ref.delta.length; k++) {
          const dd = matMulReal(ref.delta[k + 1], ref.delta[k], ref.cochainDims[k + 1]);
          for (const row of dd) for (const x of row) expect(Math.abs(x)).toBeLessThan(1e-12);
        }
      }),
      runs(60),
    );
  });

  it('sections of H^k are cocycles within tolerance and independent modulo coboundaries (SVD rank)', () => {
    fc.assert(
      fc.property(realRebasedArb, fc.constantFrom('morse' as const, 'direct' as const), ({ json, constant }, method) => {
        const ref = realCochains(json);
        const dims = exactDims(constant);
        for (let k = 0; k < ref.cochainDims.length; k++) {
          const s = sections(json, k, { method });
          expect(s.basis.length).toBe(dims[k]);
          const X = s.basis.map((b) => cochainFromSection(ref, k, s.cells, b, parseReal, 0));
          for (const x of X) {
            const scale = Math.max(1, ...x.map(Math.abs));
            for (const y of applyReal(ref, k, x)) expect(Math.abs(y)).toBeLessThan(1e-9 * scale * Math.max(1, x.length));
          }
          const image = k > 0 ? columnsOf(ref.delta[k - 1], ref.cochainDims[k - 1]) : [];
          const rImage = k > 0 ? rankReal(ref.delta[k - 1]) : 0;
          expect(rankReal(columns([...image, ...X], ref.cochainDims[k]))).toBe(rImage + X.length);
        }
      }),
      runs(50),
    );
  });
});
