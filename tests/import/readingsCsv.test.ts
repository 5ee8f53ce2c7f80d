/**
 * The readings CSV (shared/import/readingsCsv.ts, readReadingsText.ts):
 * `cell,value,weight`, cells as vertex ids joined by dashes or spaces,
 * values as coordinates joined by semicolons or spaces. Every bad row is
 * reported by line, field and the cell as written; nothing is read from a
 * file with any problem.
 */
import { describe, expect, test } from 'vitest';
import { readModelOrThrow, type Problem } from '../../shared/engine';
import { readReadingsCsv, readReadingsText } from '../../shared/import';

/** A filled triangle 0-1-2 with a tail 2-3; stalk R² on vertex 3 and on the tail, R elsewhere. */
const sheaf = readModelOrThrow({
  format: 'gluefield.sheaf',
  version: 1,
  field: { kind: 'real' },
  simplices: [[0, 1, 2], [2, 3]],
  stalks: { default: 1, cells: [{ cell: [3], dim: 2 }, { cell: [2, 3], dim: 2 }] },
  maps: { default: 'identity', entries: [{ face: [2], coface: [2, 3], matrix: [[1], [0]] }] },
});

function good(text: string, name = 'field.csv') {
  const r = readReadingsText(name, text, sheaf);
  if (!r.readings) throw new Error(`expected readings, got ${JSON.stringify(r.problems)}`);
  return r;
}

function bad(text: string, name = 'field.csv'): Problem[] {
  const r = readReadingsText(name, text, sheaf);
  expect(r.readings).toBeUndefined();
  return r.problems;
}

describe('a readings CSV is read', () => {
  test('with a header, dashes or spaces in cells, semicolons or spaces in values, and weight 1 where blank', () => {
    const r = good('cell,value,weight\n0,1.5\n3,2;-0.25,4\n2-3,1 0,\n0 1 2,"1/2",0.5\n');
    expect(r.file.values).toEqual([
      { cell: [0], value: ['1.5'] },
      { cell: [3], value: ['2', '-0.25'], weight: 4 },
      { cell: [2, 3], value: ['1', '0'] },
      { cell: [0, 1, 2], value: ['1/2'], weight: 0.5 },
    ]);
    expect(Array.from(r.readings.value)).toEqual([1.5, 2, -0.25, 1, 0, 0.5]);
    expect(Array.from(r.readings.weight)).toEqual([1, 4, 1, 0.5]);
    expect(Array.from(r.readings.degree)).toEqual([0, 0, 1, 2]);
    expect(r.file.format).toBe('gluefield.readings');
    expect(r.file.name).toBe('field');
  });

  test('without a header (columns cell, value, weight in that order), with CRLF line ends and blank lines', () => {
    const r = good('1,3\r\n\r\n2-1,3.5,2\r\n');
    expect(r.file.values).toEqual([{ cell: [1], value: ['3'] }, { cell: [2, 1], value: ['3.5'], weight: 2 }]);
  });

  test('with the header in another order and extra columns ignored; tab-separated when there is no comma', () => {
    expect(good('note,weight,value,cell\nnorth gate,2,7,1\n').file.values).toEqual([{ cell: [1], value: ['7'], weight: 2 }]);
    expect(good('cell\tvalue\n0\t1\n').file.values).toEqual([{ cell: [0], value: ['1'] }]);
  });

  test('as JSON when the name ends in .json, with its own paths in messages', () => {
    expect(good('{"format":"gluefield.readings","version":1,"values":[{"cell":[0],"value":[1]}]}', 'r.json').file.values).toEqual([{ cell: [0], value: [1] }]);
    expect(bad('{"format":"gluefield.readings","version":1,"values":[{"cell":[7],"value":[1]}]}', 'r.json')).toEqual([{ where: 'values[0].cell', message: 'vertex 7 is not in the complex' }]);
    expect(bad('{"format":', 'r.json')[0]).toMatchObject({ where: 'r.json', message: expect.stringContaining('not valid JSON') });
  });
});

describe('a bad readings CSV is refused with the row, the field and the cell named', () => {
  test.each<[string, string, Problem]>([
    ['an empty file', '  \n', { where: 'line 1', message: 'the file is empty (expected rows of cell,value,weight)' }],
    ['a header without rows', 'cell,value,weight\n', { where: 'line 2', message: 'the file has no readings (expected rows of cell,value,weight)' }],
    ['a header without a value column', 'cell,reading\n0,1\n', { where: 'line 1', message: 'the header names cell,reading; it needs the column "value" (cell,value,weight)' }],
    ['unterminated quotes', 'cell,value\n0,"1\n', { where: 'line 2', message: 'Quoted field unterminated' }],
    ['a row with a fourth column', '0,1,1\n1,1,1,9\n', { where: 'line 2', message: 'has 4 columns; a reading has three (cell,value,weight)' }],
    ['an empty cell', 'cell,value\n,1\n', { where: 'line 2, cell', message: 'is empty (give the vertex ids of a cell, such as 0-1)' }],
    ['a vertex id that is not an integer', 'cell,value\n0-b,1\n', { where: 'line 2, cell', message: '"0-b": "b" is not a vertex id (a non-negative integer)' }],
    ['an empty value', 'cell,value\n1,\n', { where: 'line 2, value, cell 1', message: 'is empty (give the stalk coordinates, separated by spaces or semicolons)' }],
    ['a zero weight', 'cell,value,weight\n1,2,0\n', { where: 'line 2, weight, cell 1', message: '"0" is not a positive number' }],
    ['a weight that is not a number', 'cell,value,weight\n1,2,heavy\n', { where: 'line 2, weight, cell 1', message: '"heavy" is not a positive number' }],
    ['a cell not in the complex', 'cell,value\n0-3,1\n', { where: 'line 2, cell 0-3', message: '[0,3] is not a cell of the complex' }],
    ['a vertex not in the complex', 'cell,value\n9,1\n', { where: 'line 2, cell 9', message: 'vertex 9 is not in the complex' }],
    ['a repeated vertex', 'cell,value\n1-1,1\n', { where: 'line 2, cell 1-1', message: '[1,1] repeats a vertex' }],
    ['a second reading of one cell, in another vertex order', 'cell,value\n0-1,1\n1 0,2\n', { where: 'line 3, cell 1 0', message: '[1,0] already has a reading (line 2)' }],
    ['too few coordinates for the stalk', 'cell,value\n3,1\n', { where: 'line 2, value, cell 3', message: 'has 1 entry, but the stalk over [3] has dimension 2' }],
    ['a coordinate that is not a number', 'cell,value\n2-3,1;x\n', { where: 'line 2, value (coordinate 2), cell 2-3', message: '"x" is not a number, a fraction p/q or a decimal' }],
  ])('%s', (_, text, problem) => {
    expect(bad(text)[0]).toEqual(problem);
  });

  test('every bad row at once, in line order, shape problems and cell problems together', () => {
    const problems = bad('cell,value,weight\n0,1\n0-3,1\n1,,\n0,2\n2,1,-1\n');
    expect(problems.map((p) => p.where)).toEqual(['line 3, cell 0-3', 'line 4, value, cell 1', 'line 5, cell 0', 'line 6, weight, cell 2']);
  });

  test('the file-shape reader keeps the good rows and says which lines they came from', () => {
    const r = readReadingsCsv('cell,value\n0,1\n\nx,2\n1,3\n');
    expect(r.file?.values.map((v) => v.cell)).toEqual([[0], [1]]);
    expect(r.lines).toEqual([2, 5]);
    expect(r.problems).toEqual([{ where: 'line 4, cell', message: '"x" is not a vertex id (a non-negative integer)' }]);
  });
});
