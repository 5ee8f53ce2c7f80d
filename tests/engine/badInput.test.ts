/**
 * Validation of the model file (docs: shared/docs/model-format.md, "The file"),
 * one test per rule, through `readModel`. Every rejection must come back as a
 * located problem `{where, message}` that names the offending field (JSON
 * path), cell or pair, because the command line prints exactly that to the
 * user. Positive cases check the reading rules that are easy to get subtly
 * wrong (exact decimals, vertex ids, order independence).
 */
import { describe, expect, test } from 'vitest';
import { cohomology, formatProblem, readModel, type Problem } from '../../shared/engine';

type Json = Record<string, unknown>;

/** A valid model: the triangle boundary (a circle) with 1-dimensional stalks. */
function circle(extra: Json = {}): Json {
  return { format: 'gluefield.sheaf', version: 1, simplices: [[0, 1], [1, 2], [0, 2]], ...extra };
}

/** A valid model: one filled triangle [0,1,2] (all its faces by closure). */
function triangle(extra: Json = {}): Json {
  return { format: 'gluefield.sheaf', version: 1, simplices: [[0, 1, 2]], ...extra };
}

function withMaps(model: Json, entries: unknown[], extra: Json = {}): Json {
  return { ...model, maps: { entries, ...extra } };
}

function rejected(json: unknown): Problem[] {
  const r = readModel(json);
  expect(r.sheaf, 'the model should have been rejected').toBeUndefined();
  expect(r.problems.length).toBeGreaterThan(0);
  for (const p of r.problems) {
    expect(typeof p.where).toBe('string');
    expect(typeof p.message).toBe('string');
    expect(p.message.length).toBeGreaterThan(0);
  }
  return r.problems;
}

/**
 * The first problem (the one the command line prints) is at `where` and its
 * message contains every fragment.
 */
function expectFirstProblem(json: unknown, where: string, ...fragments: (string | RegExp)[]): Problem {
  const [first] = rejected(json);
  expect(first.where).toBe(where);
  for (const f of fragments) {
    if (typeof f === 'string') expect(first.message).toContain(f);
    else expect(first.message).toMatch(f);
  }
  return first;
}

function accepted(json: unknown): void {
  const r = readModel(json);
  expect(r.problems).toEqual([]);
  expect(r.sheaf).toBeDefined();
}

describe('sanity: the base models are valid', () => {
  test('circle and triangle are accepted', () => {
    accepted(circle());
    accepted(triangle());
    expect(cohomology(circle()).dims).toEqual([1, 1]);
    expect(cohomology(triangle()).dims).toEqual([1, 0, 0]);
  });
});

describe('top level', () => {
  test.each([
    ['null', null],
    ['a list', [circle()]],
    ['a string', 'gluefield.sheaf'],
    ['a number', 1],
  ])('not an object (%s)', (_label, json) => {
    const [first] = rejected(json);
    expect(formatProblem(first)).toMatch(/object/);
  });

  test.each([
    ['missing', undefined],
    ['another tag', 'gluefield.model'],
    ['wrong case', 'Gluefield.Sheaf'],
  ])('wrong format (%s)', (_label, format) => {
    const json = circle({ format });
    expectFirstProblem(json, 'format', 'gluefield.sheaf');
  });

  test.each([
    ['2', 2],
    ['"1" (a string)', '1'],
    ['missing', undefined],
  ])('wrong version (%s)', (_label, version) => {
    expectFirstProblem(circle({ version }), 'version', '1');
  });
});

describe('field', () => {
  test.each([
    ['a string', 'rational'],
    ['null', null],
    ['a list', [{ kind: 'rational' }]],
  ])('field not an object (%s)', (_label, field) => {
    expectFirstProblem(circle({ field }), 'field');
  });

  test('unknown kind', () => {
    expectFirstProblem(circle({ field: { kind: 'complex' } }), 'field.kind', '"complex"');
  });

  test.each([
    ['2.5', 2.5],
    ['"7" (a string)', '7'],
    ['missing', undefined],
  ])('prime p not an integer (%s)', (_label, p) => {
    expectFirstProblem(circle({ field: { kind: 'prime', p } }), 'field.p', 'not an integer');
  });

  test.each([12, 1, 0, -7, 91])('p not prime (%s)', (p) => {
    expectFirstProblem(circle({ field: { kind: 'prime', p } }), 'field.p', String(p), 'prime');
  });

  test('p ≥ 2^31 is rejected (2^31 itself, and the prime 2^31 + 11)', () => {
    expectFirstProblem(circle({ field: { kind: 'prime', p: 2 ** 31 } }), 'field.p', '2147483648', '2^31');
    expectFirstProblem(circle({ field: { kind: 'prime', p: 2147483659 } }), 'field.p', '2147483659', '2^31');
  });

  test('the largest allowed prime, 2^31 - 1, is accepted', () => {
    accepted(circle({ field: { kind: 'prime', p: 2147483647 } }));
  });

  test.each([
    ['0', 0],
    ['1', 1],
    ['-1e-9', -1e-9],
    ['2', 2],
    ['a string', '1e-9'],
  ])('real tolerance out of (0,1) (%s)', (_label, tolerance) => {
    expectFirstProblem(circle({ field: { kind: 'real', tolerance } }), 'field.tolerance');
  });

  test('real tolerance inside (0,1), and absent, are accepted', () => {
    accepted(circle({ field: { kind: 'real', tolerance: 0.5 } }));
    accepted(circle({ field: { kind: 'real' } }));
  });
});

describe('simplices', () => {
  test.each([
    ['missing', undefined],
    ['an object', { 0: [0, 1] }],
    ['a string', '[[0,1]]'],
  ])('simplices not a list (%s)', (_label, simplices) => {
    expectFirstProblem(circle({ simplices }), 'simplices', 'list');
  });

  test('a simplex that is empty', () => {
    expectFirstProblem(circle({ simplices: [[0, 1], []] }), 'simplices[1]', 'non-empty');
  });

  test.each([
    ['a number', 3],
    ['an object', { v: [0, 1] }],
    ['a string', '0,1'],
  ])('a simplex that is not a list (%s)', (_label, s) => {
    expectFirstProblem(circle({ simplices: [[0, 1], [1, 2], s] }), 'simplices[2]');
  });

  test.each([
    ['negative', -1, '-1'],
    ['non-integer', 1.5, '1.5'],
    ['a string', '2', '"2"'],
    ['null', null, 'null'],
  ])('a %s vertex', (_label, v, shown) => {
    expectFirstProblem(circle({ simplices: [[0, 1], [1, v]] }), 'simplices[1]', shown);
  });

  test('a repeated vertex', () => {
    expectFirstProblem(circle({ simplices: [[0, 1], [1, 2, 1]] }), 'simplices[1]', 'vertex 1', '[1,2,1]');
  });
});

describe('stalks', () => {
  test.each([
    ['negative', -1],
    ['non-integer', 1.5],
    ['a string', '2'],
  ])('stalks.default %s', (_label, d) => {
    expectFirstProblem(circle({ stalks: { default: d } }), 'stalks.default', JSON.stringify(d));
  });

  test('stalks.default 0 is allowed', () => {
    accepted(circle({ stalks: { default: 0 } }));
    expect(cohomology(circle({ stalks: { default: 0 } })).dims).toEqual([0, 0]);
  });

  test('stalks.cells: a cell whose vertex is not in the complex', () => {
    expectFirstProblem(circle({ stalks: { cells: [{ cell: [0, 9], dim: 2 }] } }), 'stalks.cells[0].cell', '[0,9]');
  });

  test('stalks.cells: a cell on known vertices that is not a simplex of the complex', () => {
    // The circle has edges only: [0,1,2] is not a cell.
    expectFirstProblem(circle({ stalks: { cells: [{ cell: [0, 1, 2], dim: 2 }] } }), 'stalks.cells[0].cell', '[0,1,2]', 'not in the complex');
  });

  test('stalks.cells: a cell listed twice (in another vertex order)', () => {
    const json = circle({
      stalks: {
        cells: [
          { cell: [0, 2], dim: 1 },
          { cell: [1], dim: 1 },
          { cell: [2, 0], dim: 1 },
        ],
      },
    });
    expectFirstProblem(json, 'stalks.cells[2]', '[2,0]', 'twice');
  });

  test.each([
    ['negative', -2],
    ['non-integer', 0.5],
    ['missing', undefined],
  ])('stalks.cells: a %s dim', (_label, dim) => {
    expectFirstProblem(circle({ stalks: { cells: [{ cell: [0, 1], dim: 1 }, { cell: [1, 2], dim }] } }), 'stalks.cells[1].dim');
  });
});

describe('maps: default', () => {
  test.each([
    ['"id"', 'id'],
    ['"Identity"', 'Identity'],
    ['1', 1],
    ['a list', ['identity']],
  ])('maps.default not identity/zero (%s)', (_label, def) => {
    expectFirstProblem(circle({ maps: { default: def } }), 'maps.default', 'identity', 'zero');
  });

  test('identity default between stalks of different dimension names both cells and both dims', () => {
    // Edge [1,2] has a 2-dimensional stalk, its vertices 1-dimensional ones.
    const json = circle({ stalks: { default: 1, cells: [{ cell: [1, 2], dim: 2 }] } });
    const problems = rejected(json);
    const first = problems[0];
    expect(first.where).toBe('maps.default');
    expect(first.message).toMatch(/\[(1|2)\] \(dimension 1\)/);
    expect(first.message).toContain('[1,2] (dimension 2)');
    // Both offending pairs are named somewhere; the untouched edges are not.
    const all = problems.map(formatProblem).join('\n');
    expect(all).toContain('[1] (dimension 1)');
    expect(all).toContain('[2] (dimension 1)');
    expect(all).not.toContain('[0,1]');
    expect(all).not.toContain('[0,2]');
  });

  test('the mismatched pair is fine once it has an explicit entry, and with the zero default', () => {
    const stalks = { default: 1, cells: [{ cell: [1, 2], dim: 2 }] };
    accepted(
      circle({
        stalks,
        maps: {
          entries: [
            { face: [1], coface: [1, 2], matrix: [[1], [0]] },
            { face: [2], coface: [1, 2], matrix: [[1], [0]] },
          ],
        },
      }),
    );
    accepted(circle({ stalks, maps: { default: 'zero' } }));
  });
});

describe('maps: entries', () => {
  test('a face that is not in the complex', () => {
    const json = withMaps(circle(), [{ face: [7], coface: [0, 1], scalar: 1 }]);
    expectFirstProblem(json, 'maps.entries[0].face', '[7]');
  });

  test('a coface that is not in the complex', () => {
    const json = withMaps(circle(), [
      { face: [0], coface: [0, 1], scalar: 1 },
      { face: [1], coface: [0, 1, 2], scalar: 1 },
    ]);
    expectFirstProblem(json, 'maps.entries[1].coface', '[0,1,2]', 'not in the complex');
  });

  test('a face that is a face of codimension two ([0] of [0,1,2])', () => {
    const json = withMaps(triangle(), [{ face: [0], coface: [0, 1, 2], matrix: [[1]] }]);
    expectFirstProblem(json, 'maps.entries[0]', '[0]', '[0,1,2]', 'codimension-one');
  });

  test('a face that is not a face at all ([3] of [0,1])', () => {
    const json = { format: 'gluefield.sheaf', version: 1, simplices: [[0, 1], [2, 3]], maps: { entries: [{ face: [3], coface: [0, 1], scalar: 1 }] } };
    expectFirstProblem(json, 'maps.entries[0]', '[3]', '[0,1]', 'codimension-one');
  });

  test('a face that equals its coface ([0,1] of [0,1])', () => {
    const json = withMaps(circle(), [{ face: [0, 1], coface: [0, 1], scalar: 1 }]);
    expectFirstProblem(json, 'maps.entries[0]', '[0,1]', 'codimension-one');
  });

  test('a matrix with the wrong number of rows', () => {
    const json = withMaps(circle({ stalks: { default: 2 } }), [{ face: [0], coface: [0, 1], matrix: [[1, 0]] }]);
    expectFirstProblem(json, 'maps.entries[0].matrix', '[0] ◁ [0,1]', '2×2', '1 rows');
  });

  test('a matrix row of the wrong length', () => {
    const json = withMaps(circle({ stalks: { default: 2 } }), [{ face: [0], coface: [0, 1], matrix: [[1, 0], [0, 1, 0]] }]);
    expectFirstProblem(json, 'maps.entries[0].matrix[1]', '[0] ◁ [0,1]', 'row 1', '2 entries', 'got 3');
  });

  test('a matrix that is not a list of lists', () => {
    const json = withMaps(circle(), [{ face: [0], coface: [0, 1], matrix: 1 }]);
    expectFirstProblem(json, 'maps.entries[0].matrix', '[0] ◁ [0,1]');
  });

  test('both matrix and scalar', () => {
    const json = withMaps(circle(), [{ face: [1], coface: [1, 2], matrix: [[1]], scalar: 1 }]);
    expectFirstProblem(json, 'maps.entries[0]', '[1] ◁ [1,2]', 'exactly one');
  });

  test('neither matrix nor scalar', () => {
    const json = withMaps(circle(), [{ face: [1], coface: [1, 2] }]);
    expectFirstProblem(json, 'maps.entries[0]', '[1] ◁ [1,2]', 'exactly one');
  });

  test('a scalar between stalks of unequal dimension', () => {
    const json = withMaps(circle({ stalks: { default: 1, cells: [{ cell: [0, 1], dim: 2 }] } }), [
      { face: [0], coface: [0, 1], scalar: 3 },
    ]);
    expectFirstProblem(json, 'maps.entries[0]', '[0] ◁ [0,1]', 'scalar', '1', '2');
  });

  test.each([
    ['"abc"', 'abc', '"abc"'],
    ['null', null, 'null'],
    ['true', true, 'true'],
    ['a list', [1], '[1]'],
    ['an empty string', '', '""'],
    ['"1/2/3"', '1/2/3', '"1/2/3"'],
  ])('an unreadable scalar (%s)', (_label, value, shown) => {
    const json = withMaps(circle(), [{ face: [0], coface: [0, 1], scalar: value }]);
    expectFirstProblem(json, 'maps.entries[0].scalar', '[0] ◁ [0,1]', shown);
  });

  test.each([
    ['"abc"', 'abc'],
    ['null', null],
    ['true', true],
  ])('an unreadable matrix entry (%s) is located by row and column', (_label, value) => {
    const json = withMaps(circle({ stalks: { default: 2 } }), [
      { face: [0], coface: [0, 1], scalar: 1 },
      { face: [1], coface: [1, 2], matrix: [[1, 0], [value, 1]] },
    ]);
    expectFirstProblem(json, 'maps.entries[1].matrix[1][0]', '[1] ◁ [1,2]', JSON.stringify(value));
  });

  test('a zero denominator "1/0"', () => {
    const json = withMaps(circle(), [{ face: [0], coface: [0, 1], scalar: '1/0' }]);
    expectFirstProblem(json, 'maps.entries[0].scalar', '[0] ◁ [0,1]', '"1/0"', 'zero denominator');
  });

  test('a zero denominator inside a matrix, in the prime field too', () => {
    const json = withMaps(circle({ field: { kind: 'prime', p: 5 } }), [{ face: [2], coface: [0, 2], matrix: [['3/0']] }]);
    expectFirstProblem(json, 'maps.entries[0].matrix[0][0]', '[2] ◁ [0,2]', '"3/0"');
  });

  test('a denominator not invertible mod p ("1/3" with p = 3)', () => {
    const json = withMaps(circle({ field: { kind: 'prime', p: 3 } }), [{ face: [0], coface: [0, 1], scalar: '1/3' }]);
    expectFirstProblem(json, 'maps.entries[0].scalar', '[0] ◁ [0,1]', '"1/3"', 'prime:3');
  });

  test('a denominator not invertible mod p via a decimal (0.1 with p = 5, since 0.1 = 1/10)', () => {
    const json = withMaps(circle({ field: { kind: 'prime', p: 5 } }), [{ face: [0], coface: [0, 1], scalar: 0.1 }]);
    expectFirstProblem(json, 'maps.entries[0].scalar', '[0] ◁ [0,1]', 'prime:5');
  });

  test('a pair given twice (second time with the coface in another vertex order)', () => {
    const json = withMaps(circle(), [
      { face: [0], coface: [0, 1], scalar: 2 },
      { face: [1], coface: [1, 2], scalar: 1 },
      { face: [0], coface: [1, 0], scalar: 2 },
    ]);
    expectFirstProblem(json, 'maps.entries[2]', '[0] ◁ [1,0]', 'twice');
  });

  test('an entry that is not an object', () => {
    const json = withMaps(circle(), [{ face: [0], coface: [0, 1], scalar: 1 }, 'identity']);
    expectFirstProblem(json, 'maps.entries[1]');
  });
});

describe('sheaf condition', () => {
  test('a broken diamond on a triangle is rejected, naming the diamond cells', () => {
    // Via [0,1]: 1·2 = 2, via [0,2]: 1·1 = 1.
    const json = withMaps(triangle(), [{ face: [0], coface: [0, 1], scalar: 2 }]);
    const first = expectFirstProblem(json, 'maps', 'sheaf condition');
    expect(first.message).toContain('[0] ◁ [0,1] ◁ [0,1,2]');
    expect(first.message).toContain('[0] ◁ [0,2] ◁ [0,1,2]');
    // The diamonds at [1] and [2] commute and are not named.
    expect(first.message).not.toContain('[1] ◁');
    expect(first.message).not.toContain('[2] ◁');
  });

  test('a broken diamond made of matrices, in the prime field', () => {
    const json = withMaps(triangle({ field: { kind: 'prime', p: 7 }, stalks: { default: 2 } }), [
      { face: [1, 2], coface: [0, 1, 2], matrix: [[0, 1], [1, 0]] },
    ]);
    const first = expectFirstProblem(json, 'maps', 'sheaf condition');
    expect(first.message).toContain('[1,2]');
    expect(first.message).toContain('[0,1,2]');
  });

  test('a commuting diamond with non-identity maps is accepted', () => {
    // Scale everything into [0,1,2] by 3 and every vertex into its edges by 1: both routes give 3.
    const json = withMaps(triangle(), [
      { face: [0, 1], coface: [0, 1, 2], scalar: 3 },
      { face: [0, 2], coface: [0, 1, 2], scalar: 3 },
      { face: [1, 2], coface: [0, 1, 2], scalar: 3 },
    ]);
    accepted(json);
    expect(cohomology(json).dims).toEqual([1, 0, 0]);
  });
});

describe('vertices', () => {
  test.each([
    ['a string', 'a'],
    ['null', null],
    ['a list', [1]],
  ])('a non-numeric x (%s)', (_label, x) => {
    const json = circle({ vertices: [{ id: 0, x: 0, y: 0 }, { id: 1, x, y: 1 }] });
    expectFirstProblem(json, 'vertices[1].x');
  });

  test('numeric positions and labels are accepted and ignored by the mathematics', () => {
    const json = circle({ vertices: [{ id: 0, x: 0.5, y: -1, label: 'S-01' }, { id: 1, x: 2, y: 3, z: 4 }] });
    accepted(json);
    expect(cohomology(json).dims).toEqual([1, 1]);
  });
});

describe('reading numbers exactly', () => {
  test('JSON number 0.1 is exactly 1/10 in the rational field: monodromy 0.1·10 = 1 gives [1,1]', () => {
    const json = withMaps(circle(), [
      { face: [0], coface: [0, 1], scalar: 0.1 },
      { face: [1], coface: [1, 2], scalar: 10 },
    ]);
    accepted(json);
    expect(cohomology(json, { method: 'morse' }).dims).toEqual([1, 1]);
    expect(cohomology(json, { method: 'direct' }).dims).toEqual([1, 1]);
  });

  test('the control: monodromy 2 kills both groups', () => {
    const json = withMaps(circle(), [{ face: [0], coface: [0, 1], scalar: 2 }]);
    expect(cohomology(json).dims).toEqual([0, 0]);
  });

  test('JSON 0.1 inside a matrix, three times: 0.1·0.1·100 = 1', () => {
    const json = withMaps(circle(), [
      { face: [0], coface: [0, 1], matrix: [[0.1]] },
      { face: [1], coface: [1, 2], matrix: [[0.1]] },
      { face: [0], coface: [0, 2], matrix: [[0.01]] },
    ]);
    // Monodromy around 0→1→2→0 is 0.1·0.1 / 0.01 = 1 exactly.
    expect(cohomology(json).dims).toEqual([1, 1]);
  });

  test('"0.125" and "-3/7" are accepted and read exactly', () => {
    const a = withMaps(circle(), [
      { face: [0], coface: [0, 1], scalar: '0.125' },
      { face: [1], coface: [1, 2], scalar: 8 },
    ]);
    const b = withMaps(circle(), [
      { face: [0], coface: [0, 1], scalar: '-3/7' },
      { face: [1], coface: [1, 2], scalar: '-7/3' },
    ]);
    accepted(a);
    accepted(b);
    expect(cohomology(a).dims).toEqual([1, 1]);
    expect(cohomology(b).dims).toEqual([1, 1]);
    // -3/7 alone is a non-trivial monodromy.
    expect(cohomology(withMaps(circle(), [{ face: [0], coface: [0, 1], scalar: '-3/7' }])).dims).toEqual([0, 0]);
  });

  test('decimal strings with exponents and JSON numbers in exponent form are exact', () => {
    const json = withMaps(circle(), [
      { face: [0], coface: [0, 1], scalar: 1e-7 },
      { face: [1], coface: [1, 2], scalar: '1e7' },
    ]);
    expect(cohomology(json).dims).toEqual([1, 1]);
  });

  test('in the prime field a fraction is n·d⁻¹: "1/2"·2 = 1 in GF(5)', () => {
    const json = withMaps(circle({ field: { kind: 'prime', p: 5 } }), [
      { face: [0], coface: [0, 1], scalar: '1/2' },
      { face: [1], coface: [1, 2], scalar: 2 },
    ]);
    expect(cohomology(json).dims).toEqual([1, 1]);
  });

  test('in the prime field entries are reduced mod p: 6 = 1 in GF(5)', () => {
    const json = withMaps(circle({ field: { kind: 'prime', p: 5 } }), [{ face: [0], coface: [0, 1], scalar: 6 }]);
    expect(cohomology(json).dims).toEqual([1, 1]);
  });

  // Contract: "In the prime field, entries are reduced mod P and a fraction's
  // denominator must be invertible mod P." The decimal 0.5 is exactly 1/2, and
  // 2 is invertible mod 5 (2⁻¹ = 3), so 0.5 is a valid entry of GF(5).
  test('in the prime field the decimal 0.5 = 1/2 is accepted (2 is invertible mod 5): 0.5·2 = 1 in GF(5)', () => {
    for (const half of [0.5, '0.5']) {
      const json = withMaps(circle({ field: { kind: 'prime', p: 5 } }), [
        { face: [0], coface: [0, 1], scalar: half },
        { face: [1], coface: [1, 2], scalar: 2 },
      ]);
      expect(readModel(json).problems).toEqual([]);
      expect(cohomology(json).dims).toEqual([1, 1]);
    }
  });
});

describe('vertex ids and order', () => {
  test('large vertex ids (around 10^12) work, in stalks and maps too', () => {
    const A = 1e12;
    const B = 1e12 + 7;
    const C = 3e12;
    const json = {
      format: 'gluefield.sheaf',
      version: 1,
      simplices: [[A, B], [B, C], [C, A]],
      stalks: { default: 1, cells: [{ cell: [C, A], dim: 1 }] },
      maps: { entries: [{ face: [C], coface: [A, C], scalar: 2 }] },
    };
    accepted(json);
    expect(cohomology(json).dims).toEqual([0, 0]);
    expect(cohomology({ ...json, maps: undefined }).dims).toEqual([1, 1]);
    expect(cohomology(json).cells).toEqual([3, 3]);
  });

  test('sparse vertex ids give the same answer as dense ones', () => {
    const relabel = (v: number) => [0, 1_000, 999_999, 5_000_000, 2 ** 40][v];
    const dense = {
      format: 'gluefield.sheaf',
      version: 1,
      simplices: [[0, 1, 2], [2, 3], [3, 4], [4, 2]],
      stalks: { default: 2 },
      maps: { entries: [{ face: [3], coface: [3, 4], matrix: [[0, 1], [1, 0]] }] },
    };
    const sparse = {
      ...dense,
      simplices: dense.simplices.map((s) => s.map(relabel)),
      maps: { entries: [{ face: [relabel(3)], coface: [relabel(3), relabel(4)], matrix: [[0, 1], [1, 0]] }] },
    };
    const a = cohomology(dense);
    const b = cohomology(sparse);
    // A disc with a circle attached at vertex 2, stalks 2, swap monodromy on the circle:
    // Mayer–Vietoris gives H^0 = 1 (constants fixed by the swap), H^1 = 1, H^2 = 0.
    expect(a.dims).toEqual([1, 1, 0]);
    expect(b.dims).toEqual(a.dims);
    expect(b.cells).toEqual(a.cells);
    expect(b.cochainDims).toEqual(a.cochainDims);
  });

  test('simplices listed in any vertex order (and list order) give the same result', () => {
    // A 5×5 torus grid with a circle attached at vertex 0, stalks 2, and a
    // swap matrix on one edge of the circle; then permute everything.
    const n = 5;
    const v = (i: number, j: number) => (i % n) * n + (j % n);
    const tri: number[][] = [];
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) tri.push([v(i, j), v(i + 1, j), v(i + 1, j + 1)], [v(i, j), v(i, j + 1), v(i + 1, j + 1)]);
    }
    const extra = [[0, 100], [100, 101], [101, 0]];
    const base = {
      format: 'gluefield.sheaf',
      version: 1,
      simplices: [...tri, ...extra],
      stalks: { default: 2 },
      maps: { entries: [{ face: [100], coface: [100, 101], matrix: [[0, 1], [1, 0]] }] },
    };
    let seed = 12345;
    const rand = () => {
      seed = (seed * 1103515245 + 12345) % 2 ** 31;
      return seed / 2 ** 31;
    };
    const shuffle = <T>(a: T[]): T[] => {
      const b = [...a];
      for (let i = b.length - 1; i > 0; i--) {
        const j = Math.floor(rand() * (i + 1));
        [b[i], b[j]] = [b[j], b[i]];
      }
      return b;
    };
    const expected = cohomology(base);
    // Mayer–Vietoris: torus 2·[1,2,1], circle with swap monodromy [1,1], glued
    // along a point with a 2-dimensional stalk: H^0 = 1, H^1 = 5, H^2 = 2 (euler 0 + 0 - 2).
    expect(expected.dims).toEqual([1, 5, 2]);
    for (let trial = 0; trial < 4; trial++) {
      const permuted = {
        ...base,
        simplices: shuffle(base.simplices.map((s) => shuffle(s))),
        maps: { entries: [{ face: [100], coface: [101, 100], matrix: [[0, 1], [1, 0]] }] },
      };
      for (const method of ['morse', 'direct'] as const) {
        const got = cohomology(permuted, { method });
        expect(got.dims).toEqual(expected.dims);
        expect(got.cells).toEqual(expected.cells);
        expect(got.cochainDims).toEqual(expected.cochainDims);
      }
    }
  });

  test('a simplex listed twice, in two orders, and faces listed explicitly change nothing', () => {
    const json = { format: 'gluefield.sheaf', version: 1, simplices: [[0, 1], [1, 0], [2, 1], [0, 2], [2], [1, 0]] };
    const r = cohomology(json);
    expect(r.dims).toEqual([1, 1]);
    expect(r.cells).toEqual([3, 3]);
  });

  test('an isolated vertex listed as [v] counts as a component', () => {
    const r = cohomology(circle({ simplices: [[0, 1], [1, 2], [0, 2], [42]] }));
    expect(r.dims).toEqual([2, 1]);
    expect(r.cells).toEqual([4, 3]);
  });
});
