/**
 * The CSV simplex list importer: one simplex per row, optional header,
 * comma/semicolon/tab delimiters, and a located problem for every kind of
 * bad row (shared/import/simplexCsv.ts).
 */
import { describe, expect, test } from 'vitest';
import type { ModelFile, Problem } from '../../shared/engine';
import { importSimplexCsv } from '../../shared/import';

function model(text: string, options?: Parameters<typeof importSimplexCsv>[1]): ModelFile {
  const r = importSimplexCsv(text, options);
  if (!('model' in r)) throw new Error(`expected a model, got ${JSON.stringify(r.problems)}`);
  return r.model;
}

function problems(text: string): Problem[] {
  const r = importSimplexCsv(text);
  if (!('problems' in r)) throw new Error('expected problems');
  return r.problems;
}

describe('importSimplexCsv reads', () => {
  test('each row as the vertex ids of one simplex, into a constant sheaf over the rationals', () => {
    expect(model('0,1,2\n2,3\n4\n')).toEqual({
      format: 'gluefield.sheaf',
      version: 1,
      field: { kind: 'rational' },
      simplices: [[0, 1, 2], [2, 3], [4]],
      stalks: { default: 1 },
      maps: { default: 'identity' },
    });
  });

  test('a first row that is not all integers as a header, and skips it', () => {
    expect(model('a,b,c\n0,1,2\n').simplices).toEqual([[0, 1, 2]]);
    expect(model('v0,v1\n5,7\n').simplices).toEqual([[5, 7]]);
  });

  test('a first row of integers as data', () => {
    expect(model('3,4\n0,1\n').simplices).toEqual([[3, 4], [0, 1]]);
  });

  test('semicolon and tab delimiters', () => {
    expect(model('a;b;c\n0;1;2\n1;2;3\n').simplices).toEqual([[0, 1, 2], [1, 2, 3]]);
    expect(model('0\t1\n1\t2\n').simplices).toEqual([[0, 1], [1, 2]]);
  });

  test('blank trailing cells, blank lines, spaces around ids, quotes, CRLF and a byte order mark', () => {
    expect(model('\uFEFF0, 1, 2\r\n\r\n2,3,,\r\n"4",,,\r\n').simplices).toEqual([[0, 1, 2], [2, 3], [4]]);
  });

  test('rows of up to 8 vertices', () => {
    expect(model('0,1,2,3,4,5,6,7\n').simplices).toEqual([[0, 1, 2, 3, 4, 5, 6, 7]]);
  });

  test('the name, field and stalk dimension from the options', () => {
    const m = model('0,1\n', { name: 'wires', field: { kind: 'prime', p: 3 }, stalkDim: 2 });
    expect(m.name).toBe('wires');
    expect(m.field).toEqual({ kind: 'prime', p: 3 });
    expect(m.stalks).toEqual({ default: 2 });
  });
});

describe('importSimplexCsv reports, located by line and column', () => {
  test('a cell that is not a vertex id', () => {
    expect(problems('0,1\n1,2\n2,3\n3,4\n4,x\n')).toEqual([{ where: 'line 5, column 2', message: '"x" is not a vertex id' }]);
  });

  test('negative and fractional ids', () => {
    expect(problems('0,-1\n1.5,2\n')).toEqual([
      { where: 'line 1, column 2', message: '"-1" is not a vertex id' },
      { where: 'line 2, column 1', message: '"1.5" is not a vertex id' },
    ]);
  });

  test('a vertex repeated in a row', () => {
    expect(problems('0,1\n2,3,2\n')).toEqual([{ where: 'line 2, column 3', message: 'vertex 2 appears twice in the row' }]);
  });

  test('more than 8 columns', () => {
    const [p] = problems('0,1\n0,1,2,3,4,5,6,7,8\n');
    expect(p.where).toBe('line 2');
    expect(p.message).toMatch(/at most 8 vertices.*9 columns/);
  });

  test('a blank cell before the last id', () => {
    expect(problems('0,,2\n')).toEqual([{ where: 'line 1, column 2', message: 'blank cell before the last vertex id of the row' }]);
  });

  test('an empty file, a blank one, and one with only a header', () => {
    expect(problems('')).toEqual([{ where: 'line 1', message: 'the file is empty' }]);
    expect(problems(' \n\n,,\n')).toEqual([{ where: 'line 1', message: 'the file is empty' }]);
    expect(problems('a,b,c\n')).toEqual([{ where: 'line 2', message: 'the file has a header row but no simplices' }]);
  });

  test('lines counted across blank lines and line breaks inside quotes', () => {
    expect(problems('0,1\n\n"1\n2",3\n4,y\n')).toContainEqual({ where: 'line 5, column 2', message: '"y" is not a vertex id' });
  });

  test('an unterminated quote', () => {
    const p = problems('0,1\n"2,3\n');
    expect(p[0].where).toBe('line 2');
    expect(p[0].message).toMatch(/quote/i);
  });

  test('at most 50 problems', () => {
    expect(problems('x\n'.repeat(200).replace(/^/, '0\n'))).toHaveLength(50);
  });
});

test('importSimplexCsv throws RangeError on a stalk dimension that is not a non-negative integer (misuse)', () => {
  expect(() => importSimplexCsv('0,1\n', { stalkDim: -1 })).toThrow(RangeError);
  expect(() => importSimplexCsv('0,1\n', { stalkDim: 1.5 })).toThrow(RangeError);
});
