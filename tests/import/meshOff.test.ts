/**
 * The OFF importer (shared/import/meshOff.ts): header, counts, vertex and
 * face lines with the extra values some writers add, and a located problem
 * for each defect. Format reference: Geomview manual, "OFF Files".
 */
import { describe, expect, test } from 'vitest';
import type { ModelFile, Problem } from '../../shared/engine';
import { importOff } from '../../shared/import';
import { TETRAHEDRON_OFF, torusOff } from './fixtures/meshText';

function model(text: string, options?: Parameters<typeof importOff>[1]): ModelFile {
  const r = importOff(text, options);
  if (!('model' in r)) throw new Error(`expected a model, got ${JSON.stringify(r.problems)}`);
  return r.model;
}

function problems(text: string): Problem[] {
  const r = importOff(text);
  if (!('problems' in r)) throw new Error('expected problems');
  return r.problems;
}

const SQUARE = 'OFF\n4 1 4\n0 0 0\n1 0 0\n1 1 0\n0 1 0\n';

describe('importOff reads', () => {
  test('a tetrahedron surface, ignoring comments and a colour after a face', () => {
    const m = model(TETRAHEDRON_OFF);
    expect(m.simplices).toEqual([[0, 2, 1], [0, 1, 3], [0, 3, 2], [1, 2, 3]]);
    expect(m.vertices).toEqual([
      { id: 0, x: 0, y: 0, z: 0 },
      { id: 1, x: 1, y: 0, z: 0 },
      { id: 2, x: 0, y: 1, z: 0 },
      { id: 3, x: 0, y: 0, z: 1 },
    ]);
    expect([m.stalks, m.maps, m.field]).toEqual([{ default: 1 }, { default: 'identity' }, { kind: 'rational' }]);
  });

  test('a quad as two triangles fanned from its first corner', () => {
    expect(model(`${SQUARE}4 0 1 2 3\n`).simplices).toEqual([[0, 1, 2], [0, 2, 3]]);
  });

  test('counts on the header line, no header at all, CRLF and blank lines', () => {
    const body = '3 1 3\r\n\r\n0 0 0\r\n1 0 0\r\n0 1 0\r\n3 0 1 2\r\n';
    expect(model(`OFF ${body}`).simplices).toEqual([[0, 1, 2]]);
    expect(model(body).simplices).toEqual([[0, 1, 2]]);
  });

  test('COFF vertex colours and a two-count line', () => {
    expect(model('COFF\n3 1\n0 0 0 255 0 0 255\n1 0 0 0 255 0 255\n0 1 0 0 0 255 255\n3 0 1 2 0.5 0.5 0.5\n').simplices).toEqual([
      [0, 1, 2],
    ]);
  });

  test('vertices no face uses as isolated points, and the options', () => {
    const m = model(`${SQUARE}3 0 1 2\n`, { name: 'sq', stalkDim: 0 });
    expect(m.simplices).toEqual([[0, 1, 2], [3]]);
    expect([m.name, m.stalks]).toEqual(['sq', { default: 0 }]);
  });

  test('a 6×6 torus of quads: 36 vertices and 72 triangles', () => {
    const m = model(torusOff(6));
    expect(m.vertices).toHaveLength(36);
    expect(m.simplices).toHaveLength(72);
  });
});

describe('importOff reports, located by line', () => {
  test('an index out of range', () => {
    expect(problems(`${SQUARE}3 0 1 4\n`)).toEqual([
      { where: 'line 7', message: 'vertex index 4 is out of range: the file has 4 vertices, numbered from 0' },
    ]);
    expect(problems(`${SQUARE}3 0 -1 2\n`)[0].message).toMatch(/index -1 is out of range/);
  });

  test('a face with fewer than 3 vertices', () => {
    expect(problems(`${SQUARE}2 0 1\n`)).toEqual([{ where: 'line 7', message: 'a face needs at least 3 vertices, got 2' }]);
  });

  test('a degenerate face, including one with more corners than the file has vertices', () => {
    expect(problems(`${SQUARE}3 0 1 0\n`)).toEqual([{ where: 'line 7', message: 'degenerate face: vertex 0 appears twice' }]);
    expect(problems(`${SQUARE}1000000000 0 1 2\n`)).toEqual([
      { where: 'line 7', message: "a face of 1000000000 vertices cannot be made of the file's 4 vertices without repeats" },
    ]);
  });

  test('malformed numbers: a coordinate, an index, a corner count, a count', () => {
    expect(problems('OFF\n3 1 0\n0 0 0\n1 zero 0\n0 1 0\n3 0 1 2\n')).toEqual([{ where: 'line 4', message: '"zero" is not a number' }]);
    expect(problems(`${SQUARE}3 0 1 2.0\n`)).toEqual([{ where: 'line 7', message: '"2.0" is not a vertex index' }]);
    expect(problems(`${SQUARE}three 0 1 2\n`)).toEqual([{ where: 'line 7', message: '"three" is not a vertex count' }]);
    expect(problems('OFF\n4 x 0\n')).toEqual([{ where: 'line 2', message: '"x" is not a count' }]);
  });

  test('a vertex line with two coordinates, and a face line shorter than its count', () => {
    expect(problems('OFF\n1 0 0\n0 0\n')).toEqual([{ where: 'line 3', message: 'a vertex line needs three coordinates "x y z"' }]);
    expect(problems(`${SQUARE}4 0 1 2\n`)).toEqual([{ where: 'line 7', message: 'the face lists 4 vertices but the line has only 3' }]);
  });

  test('a file that ends early, or goes on after the last face', () => {
    expect(problems('OFF\n4 1 0\n0 0 0\n1 0 0\n')).toEqual([{ where: 'line 4', message: 'the file ends after 2 of 4 vertices' }]);
    expect(problems(SQUARE)).toEqual([{ where: 'line 6', message: 'the file ends after 0 of 1 faces' }]);
    expect(problems(`${SQUARE}3 0 1 2\n3 1 2 3\n`)).toEqual([{ where: 'line 8', message: 'unexpected content after the last of 1 faces' }]);
  });

  test('an empty file, a wrong header, a missing counts line, binary OFF', () => {
    expect(problems('')).toEqual([{ where: 'line 1', message: 'the file is empty' }]);
    expect(problems('# only a comment\n')).toEqual([{ where: 'line 1', message: 'the file is empty' }]);
    expect(problems('PLY\n3 1 0\n')).toEqual([{ where: 'line 1', message: 'expected the header "OFF", got "PLY"' }]);
    expect(problems('OFF\n')[0].message).toMatch(/ends before the counts line/);
    expect(problems('OFF BINARY\n')[0].message).toMatch(/binary OFF is not supported/);
    expect(problems('OFF\n5\n')[0]).toEqual({ where: 'line 2', message: 'the counts line needs the numbers of vertices and faces' });
  });

  test('at most 50 problems', () => {
    expect(problems(`OFF\n4 80 0\n0 0 0\n1 0 0\n1 1 0\n0 1 0\n${'3 0 0 1\n'.repeat(80)}`)).toHaveLength(50);
  });
});
