/**
 * Reading the text of a model file (shared/import/modelFileText.ts): JSON
 * syntax errors located by line and column, the format tag checked, and
 * everything else passed to the engine's readModel untouched.
 */
import { describe, expect, test } from 'vitest';
import { readModel } from '../../shared/engine';
import { importModelText } from '../../shared/import';

describe('importModelText', () => {
  test('returns the parsed object of a tagged model file', () => {
    const json = { format: 'gluefield.sheaf', version: 1, name: 'edge', simplices: [[0, 1]] };
    expect(importModelText(`\uFEFF${JSON.stringify(json, null, 2)}`)).toEqual({ model: json });
  });

  test('leaves the rest of validation to readModel', () => {
    const r = importModelText('{"format": "gluefield.sheaf", "version": 7, "simplices": []}');
    if (!('model' in r)) throw new Error('expected a model');
    expect(readModel(r.model).problems[0].where).toBe('version');
  });

  test('locates a syntax error by line and column', () => {
    const r = importModelText('{\n  "format": "gluefield.sheaf",\n  "version": 1,\n}');
    expect(r).toEqual({ problems: [{ where: expect.stringMatching(/^line 4, column 1$/), message: expect.stringMatching(/^not valid JSON: /) }] });
  });

  test('locates a truncated file at its end', () => {
    const r = importModelText('{\n  "format": "gluefield.sheaf",\n  "simplices": [');
    expect('problems' in r && r.problems[0].where).toBe('line 3, column 17');
  });

  test('reports an empty file', () => {
    expect(importModelText('  \n')).toEqual({ problems: [{ where: 'line 1', message: 'the file is empty' }] });
  });

  test('names the format field when the tag is wrong or missing', () => {
    expect(importModelText('{"format": "other"}')).toEqual({
      problems: [{ where: 'format', message: 'expected "gluefield.sheaf", got "other"' }],
    });
    expect(importModelText('{"simplices": []}')).toEqual({
      problems: [{ where: 'format', message: 'expected "gluefield.sheaf", got no "format" field' }],
    });
  });

  test('rejects JSON that is not an object', () => {
    expect(importModelText('[1, 2]')).toEqual({ problems: [{ where: '', message: 'the model file must hold a JSON object' }] });
  });
});
