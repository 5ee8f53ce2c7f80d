import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { readModel } from '../../shared/engine';

/** The scalar of the map [0] ◁ [0,1], read from a model whose only entry writes it as `value`. */
function scalarOf(value: unknown, field: object) {
  const r = readModel({
    format: 'gluefield.sheaf',
    version: 1,
    field,
    simplices: [[0, 1]],
    maps: { entries: [{ face: [0], coface: [0, 1], scalar: value }] },
  });
  if (!r.sheaf) return { problems: r.problems.map((p) => p.message) };
  const id = r.sheaf.restriction[1][1]; // entry of [0] in [0,1] (opposite vertex 1)
  return { value: id < 0 ? 0 : r.sheaf.maps[id].scalar };
}

/** The same number written so that it misses the small-number reader (16 digits) and takes the exact one. */
const padded = (n: number, d: number) => `${n < 0 ? '-' : ''}${String(Math.abs(n)).padStart(16, '0')}/${String(d).padStart(16, '0')}`;

describe('matrix entries: small numbers and the exact reader agree', () => {
  const fields = [{ kind: 'prime', p: 1000003 }, { kind: 'prime', p: 7 }, { kind: 'real' }];
  test.each(fields)('property: n/d, n and "n" read the same as through big integers (%o)', (field) => {
    fc.assert(
      fc.property(fc.integer({ min: -1e9, max: 1e9 }), fc.integer({ min: 1, max: 1e9 }), (n, d) => {
        // Messages quote the entry as written, so compare what was read, or that both refused.
        const same = (a: ReturnType<typeof scalarOf>, b: ReturnType<typeof scalarOf>) =>
          'value' in b ? expect(a).toEqual(b) : expect(a.problems?.[0]).toMatch(/is not invertible in prime:7/);
        const slow = scalarOf(padded(n, d), field);
        same(scalarOf(`${n}/${d}`, field), slow);
        same(scalarOf(` ${n} / ${d} `, field), slow);
        const whole = scalarOf(padded(n, 1), field);
        expect(scalarOf(n, field)).toEqual(whole);
        expect(scalarOf(String(n), field)).toEqual(whole);
      }),
      { numRuns: 200 },
    );
  });

  test('a zero or non-invertible denominator still gets the exact reader’s message', () => {
    expect(scalarOf('3/0', { kind: 'real' })).toEqual({ problems: ['pair [0] ◁ [0,1]: "3/0" has a zero denominator'] });
    expect(scalarOf('3/14', { kind: 'prime', p: 7 }).problems?.[0]).toMatch(/denominator of "3\/14" is not invertible in prime:7/);
  });
});
