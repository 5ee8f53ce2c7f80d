/** Choosing an importer from a file's name, else its first bytes (shared/import/detectFormat.ts). */
import { describe, expect, test } from 'vitest';
import { detectFormat } from '../../shared/import';

describe('detectFormat by extension', () => {
  test.each([
    ['ridge.sheaf.json', 'model'],
    ['ridge.JSON', 'model'],
    ['edges.csv', 'csv'],
    ['edges.tsv', 'csv'],
    ['edges.txt', 'csv'],
    ['bunny.OBJ', 'obj'],
    ['dir/bunny.off', 'off'],
  ] as const)('%s is %s', (name, format) => {
    expect(detectFormat(name, '')).toBe(format);
  });

  test('the extension wins over the content', () => {
    expect(detectFormat('mesh.obj', 'OFF\n3 1 0\n')).toBe('obj');
  });
});

describe('detectFormat by content when the extension says nothing', () => {
  test.each([
    ['a JSON object', '\n  {"format": "gluefield.sheaf"', 'model'],
    ['an OFF header after a comment', '# made by hand\nOFF\n4 4 6\n', 'off'],
    ['a COFF header', 'COFF\n', 'off'],
    ['OBJ statements', '# Blender\nmtllib a.mtl\no Cube\nv 1 1 1\nv 1 -1 1\n', 'obj'],
    ['rows of integers', '0,1,2\n1,2,3\n', 'csv'],
    ['a header and semicolon rows', 'a;b;c\n0;1;2\n', 'csv'],
    ['tab-separated rows with blank trailing cells', '0\t1\t\n2\t\t\n', 'csv'],
  ] as const)('%s', (_, text, format) => {
    expect(detectFormat('upload', text)).toBe(format);
  });

  test('reads bytes as UTF-8', () => {
    expect(detectFormat('upload', new TextEncoder().encode('\uFEFFOFF\n3 1 0\n'))).toBe('off');
  });

  test('ignores a last line the sample may have cut short', () => {
    expect(detectFormat('upload', '0,1\n1,2\n2,x')).toBe('csv');
  });

  test('is undefined for anything else', () => {
    expect(detectFormat('upload', '')).toBeUndefined();
    expect(detectFormat('notes.md', '# Notes\n\nSome text.\n')).toBeUndefined();
    expect(detectFormat('mesh.ply', 'ply\nformat ascii 1.0\n')).toBeUndefined();
    expect(detectFormat('upload', '3 1 0\n0 0 0\n')).toBeUndefined();
  });
});
