/**
 * The mesh readers report how far through the text they are, now and then
 * (every 2^16 lines), so the app's bar moves during a long read.
 */
import { describe, expect, test } from 'vitest';
import { readObj, readOff } from '../../shared/import';
import { readObjByLines } from '../../shared/import/meshObj';
import { createKitService } from '../../src/compute/kitService';
import { torusObj } from '../../bench/torusObj';

/** A torus of 2·n² triangles as OFF text. */
function torusOffText(n: number): string {
  const out = ['OFF', `${n * n} ${2 * n * n} 0`];
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) out.push(`${i} ${j} 0`);
  const id = (i: number, j: number) => (i % n) * n + (j % n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) out.push(`3 ${id(i, j)} ${id(i + 1, j)} ${id(i + 1, j + 1)}`, `3 ${id(i, j)} ${id(i + 1, j + 1)} ${id(i, j + 1)}`);
  return out.join('\n') + '\n';
}

const increasingFractions = (seen: number[]) => {
  expect(seen.length).toBeGreaterThanOrEqual(3);
  for (let i = 1; i < seen.length; i++) expect(seen[i]).toBeGreaterThan(seen[i - 1]);
  expect(seen[0]).toBeGreaterThan(0);
  expect(seen[seen.length - 1]).toBeLessThanOrEqual(1);
};

describe('read progress', () => {
  const n = 160; // 25,600 vertex lines and 51,200 face lines: several reports
  test('OBJ, by the scanner and by the line reader: increasing fractions of the text', () => {
    const text = torusObj(n);
    for (const read of [readObj, readObjByLines]) {
      const seen: number[] = [];
      const r = read(text, { progress: (f) => seen.push(f) });
      expect('mesh' in r).toBe(true);
      increasingFractions(seen);
    }
  });
  test('OFF: increasing fractions of the text', () => {
    const seen: number[] = [];
    expect('mesh' in readOff(torusOffText(n), { progress: (f) => seen.push(f) })).toBe(true);
    increasingFractions(seen);
  });
  test('the mesh kit passes them on as its parse phase, before the engine’s phases', async () => {
    const phases: { phase: string; fraction: number }[] = [];
    const out = await createKitService().meshTopology('torus.obj', torusObj(n), (p) => phases.push(p));
    expect(out.ok && out.result.report.betti).toEqual([1, 2, 1]);
    const parse = phases.filter((p) => p.phase === 'parse').map((p) => p.fraction);
    expect(parse.length).toBeGreaterThanOrEqual(4);
    const lastParse = phases.map((p) => p.phase).lastIndexOf('parse');
    expect(phases.slice(lastParse + 1).some((p) => p.phase !== 'parse')).toBe(true);
  });
});
