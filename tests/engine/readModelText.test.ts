import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { readModel, readModelText } from '../../shared/engine';
import { splitModelText } from '../../shared/engine/model/scanSimplices';

/** What a reader made of a file, in plain terms both paths can be compared on. */
function outcome(r: ReturnType<typeof readModel>) {
  if (!r.sheaf) return { problems: r.problems };
  const c = r.sheaf.complex;
  return {
    ids: Array.from(c.vertexIds),
    cells: c.simplices.map((t) => Array.from(t.vertices.subarray(0, t.size * t.width))),
    faces: c.faces.map((f) => Array.from(f)),
    stalks: r.sheaf.stalkDims.map((d) => Array.from(d)),
  };
}

const both = (text: string) => [outcome(readModelText(text)), outcome(readModel(JSON.parse(text)))];

describe('reading a model file from its text', () => {
  test('the simplex list is scanned into flat ids and ends', () => {
    const split = splitModelText('{"format":"gluefield.sheaf","version":1,"simplices":[[0,1,2],[ 2 , 3 ],\n[17]]}');
    expect(split).toBeDefined();
    expect(Array.from(split!.simplices.ids)).toEqual([0, 1, 2, 2, 3, 17]);
    expect(Array.from(split!.simplices.ends)).toEqual([3, 5, 6]);
    expect(JSON.parse(split!.rest)).toEqual({ format: 'gluefield.sheaf', version: 1, simplices: [] });
  });

  test.each([
    ['a negative id', '[[0,-1]]'],
    ['a fraction', '[[0,1.0]]'],
    ['an exponent', '[[0,1e2]]'],
    ['a leading zero', '[[0,01]]'],
    ['an empty simplex', '[[0,1],[]]'],
    ['an id past 2^31 − 1', '[[0,2147483648]]'],
    ['a string id', '[[0,"1"]]'],
    ['a bare number', '[0,1]'],
    ['not a list', '{"a":1}'],
  ])('%s is left to the ordinary path', (_, list) => {
    expect(splitModelText(`{"format":"gluefield.sheaf","version":1,"simplices":${list}}`)).toBeUndefined();
  });

  test('a key written with escapes, or a second simplex list, is left to the ordinary path (JSON.parse keeps the last key)', () => {
    expect(splitModelText('{"simpl\\u0069ces":[[0,1]]}')).toBeUndefined();
    const twice = '{"format":"gluefield.sheaf","version":1,"simplices":[[0,1]],"simplices":[[0,1,2]]}';
    expect(splitModelText(twice)).toBeUndefined();
    const [fromText, parsed] = both(twice);
    expect(fromText).toEqual(parsed);
    expect((fromText as { cells: number[][] }).cells[2]).toHaveLength(3);
  });

  test('strings holding brackets, quotes and the word simplices do not confuse the scan', () => {
    const text = JSON.stringify({
      format: 'gluefield.sheaf',
      version: 1,
      name: 'a "simplices": [[9,9]] ] } \\ name',
      vertices: [{ id: 0, label: '[{"simplices":1}]' }],
      simplices: [[0, 1, 2], [1, 3]],
      stalks: { default: 2, entries: [{ cell: [3], dim: 1 }] },
    });
    expect(splitModelText(text)).toBeDefined();
    const [fromText, parsed] = both(text);
    expect(fromText).toEqual(parsed);
  });

  test('text that is not JSON throws the SyntaxError JSON.parse gives, positions against the file as written', () => {
    for (const text of ['{"format":"gluefield.sheaf","version":1,"simplices":[[0,1]],}', '{"simplices":[[0,1]], "stalks": {default: 1}}', '{"simplices":[[0,1]]']) {
      let expected = '';
      try {
        JSON.parse(text);
      } catch (err) {
        expected = (err as Error).message;
      }
      expect(expected).not.toBe('');
      expect(() => readModelText(text)).toThrow(SyntaxError);
      expect(() => readModelText(text)).toThrow(expected);
    }
  });

  test('a vertex repeated in a simplex gets the same located message on both paths', () => {
    const text = '{"format":"gluefield.sheaf","version":1,"simplices":[[0,1,2],[3,4,3]]}';
    const [fromText, parsed] = both(text);
    expect(fromText).toEqual(parsed);
    expect(fromText).toEqual({ problems: [{ where: 'simplices[1]', message: 'vertex 3 appears twice in [3,4,3]' }] });
  });

  test('property: any simplex list, however spaced, reads the same from the text as from JSON.parse', () => {
    const simplex = fc.uniqueArray(fc.oneof(fc.nat(40), fc.nat(3_000_000_000)), { minLength: 1, maxLength: 4 });
    const space = fc.constantFrom('', ' ', '\n', '\t ', '\r\n');
    fc.assert(
      fc.property(fc.array(simplex, { maxLength: 30 }), space, fc.boolean(), fc.boolean(), (simplices, ws, repeat, mapsFirst) => {
        if (repeat && simplices.length > 0 && simplices[0].length > 1) simplices[0][1] = simplices[0][0];
        const list = `[${ws}${simplices.map((s) => `[${ws}${s.join(`${ws},${ws}`)}${ws}]`).join(`,${ws}`)}${ws}]`;
        const maps = `"maps":${ws}{"default":"identity"}`;
        const text = mapsFirst
          ? `{${ws}"format":"gluefield.sheaf",${maps},"version":1,${ws}"simplices"${ws}:${ws}${list}${ws}}`
          : `{"format":"gluefield.sheaf","version":1,"simplices":${list},${ws}${maps}}`;
        const [fromText, parsed] = both(text);
        expect(fromText).toEqual(parsed);
      }),
      { numRuns: 300 },
    );
  });
});
