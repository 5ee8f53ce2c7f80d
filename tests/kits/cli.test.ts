/**
 * The command-line contract of the kits (issue 5): `level-net`, `frame`,
 * `mesh` and `readings` print one JSON object and exit 0; bad input exits 2
 * with exactly one `error:` line and nothing on standard output. One case
 * per kit spawns the real `npm run --silent gluefield -- …`; the rest call
 * runCli in-process with the same file reader.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { runCli } from '../../cli/runCli';

const REPO = fileURLToPath(new URL('../..', import.meta.url));
const DEMO = join(REPO, 'shared/kits/demo');

interface Run {
  status: number | null;
  stdout: string;
  stderr: string;
}

function spawnCli(...args: string[]): Run {
  const r = spawnSync('npm', ['run', '--silent', 'gluefield', '--', ...args], { cwd: REPO, encoding: 'utf8', timeout: 60_000 });
  if (r.error) throw r.error;
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

function cli(...args: string[]): Run {
  let stdout = '';
  let stderr = '';
  const status = runCli(args, {
    readFile: (path) => readFileSync(path, 'utf8'),
    stdout: (t) => void (stdout += t),
    stderr: (t) => void (stderr += t),
  });
  return { status, stdout, stderr };
}

function expectBadInput(run: Run, ...fragments: (string | RegExp)[]): void {
  expect(run.status).toBe(2);
  expect(run.stdout).toBe('');
  const lines = run.stderr.trimEnd().split('\n');
  expect(lines).toHaveLength(1);
  expect(lines[0]).toMatch(/^error: /);
  for (const f of fragments) expect(lines[0]).toMatch(f);
}

function expectJson(run: Run): Record<string, unknown> {
  expect(run.stderr).toBe('');
  expect(run.status).toBe(0);
  expect(run.stdout.trimEnd().split('\n')).toHaveLength(1);
  return JSON.parse(run.stdout);
}

let dir: string;
const file = (name: string, text: string) => {
  const path = join(dir, name);
  writeFileSync(path, text);
  return path;
};
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'gluefield-kits-'));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const STATIONS = 'id,height\nA,100.000\nB,\nC,\n';
const LINES = 'from,to,rise,length_km\nA,B,2.010,1\nB,C,1.005,2\nC,A,-3.000,1\n';

describe('level-net STATIONS.csv LINES.csv', () => {
  test('the real command prints heights, residuals, loops, sigma0 and dof (spawned)', () => {
    const out = expectJson(spawnCli('level-net', file('s.csv', STATIONS), file('l.csv', LINES)));
    expect(out).toMatchObject({ heights: { A: 100, B: 102.00625, C: 103.00375 }, dof: 1 });
    expect(out.sigma0 as number).toBeCloseTo(0.0075, 9);
    const residuals = out.residuals as { from: string; to: string; residual: number }[];
    // The first keys are the original contract; the test's fields were added after them.
    for (const r of residuals) expect(Object.keys(r)).toEqual(['from', 'to', 'residual', 'redundancy', 'sd_mm', 'w']);
    expect(residuals.map((r) => (r as unknown as { redundancy: number }).redundancy)).toEqual([0.25, 0.5, 0.25]);
    expect(out.test).toMatchObject({ critical: 3.29, sigma0_source: 'a-posteriori', redundancy_sum: 1 });
    const loops = out.loops as Record<string, unknown>[];
    expect(loops).toHaveLength(1);
    expect(Object.keys(loops[0]).sort()).toEqual(['allowable_mm', 'length_km', 'misclosure_mm', 'ok', 'stations']);
    expect(loops[0]).toMatchObject({ length_km: 4, allowable_mm: 16, ok: true });
  });
  test('the standard is chosen with --standard or --c-mm and recorded in the output', () => {
    const s = file('s.csv', STATIONS);
    const l = file('l.csv', LINES);
    expect(expectJson(cli('level-net', s, l)).standard).toMatchObject({ key: 'second-II', c_mm: 8 });
    const first = expectJson(cli('level-net', s, l, '--standard', 'first-II'));
    expect(first.standard).toMatchObject({ key: 'first-II', c_mm: 4 });
    expect((first.loops as { ok: boolean }[])[0].ok).toBe(false);
    expect(expectJson(cli('level-net', s, l, '--c-mm', '10')).standard).toMatchObject({ key: 'custom', c_mm: 10 });
    expectBadInput(cli('level-net', s, l, '--standard', 'fourth'), '--standard', 'fourth');
    expectBadInput(cli('level-net', s, l, '--c-mm', '-3'), '--c-mm');
    expectBadInput(cli('level-net', s, l, '--c-mm', '3', '--standard', 'third'), 'not both');
  });
  test('--sigma0-mm and --critical set the standardised residual test (hand computation: w = −7.5 with σ0 = 1 mm)', () => {
    const s = file('s.csv', STATIONS);
    const l = file('l.csv', LINES);
    const out = expectJson(cli('level-net', s, l, '--sigma0-mm', '1', '--critical', '8'));
    expect(out.test).toMatchObject({ critical: 8, sigma0_mm: 1, sigma0_source: 'a-priori' });
    expect((out.residuals as { w: number }[]).map((r) => r.w)).toEqual([-7.5, -7.5, -7.5]);
    expect(out.flagged).toEqual([]);
    const flagged = expectJson(cli('level-net', s, l, '--sigma0-mm', '1')).flagged as { from: string; w: number; line: number }[];
    expect(flagged.map((f) => [f.from, f.w, f.line])).toEqual([['A', -7.5, 2], ['B', -7.5, 3], ['C', -7.5, 4]]);
    expectBadInput(cli('level-net', s, l, '--critical', '0'), '--critical');
    expectBadInput(cli('level-net', s, l, '--sigma0-mm', 'two'), '--sigma0-mm', 'two');
  });
  test.each([
    ['a station without a path to a benchmark', 'id,height\nA,100\nB,\nC,\n', 'from,to,rise,length_km\nA,B,1,1\n', /station "C" has no path of lines to a benchmark/],
    ['an unknown station', STATIONS, 'from,to,rise,length_km\nA,Q,1,1\nB,C,1,1\nA,C,1,1\n', /unknown station "Q"/],
    ['a non-numeric rise', STATIONS, 'from,to,rise,length_km\nA,B,up,1\nB,C,1,1\n', /rise "up" is not a number/],
    ['a non-numeric length', STATIONS, 'from,to,rise,length_km\nA,B,1,one\nB,C,1,1\n', /length_km "one" is not a number/],
    ['a non-positive length', STATIONS, 'from,to,rise,length_km\nA,B,1,0\nB,C,1,1\n', /length_km 0 must be positive/],
    ['a non-numeric benchmark height', 'id,height\nA,high\nB,\n', 'from,to,rise,length_km\nA,B,1,1\n', /height of station "A"/],
  ])('%s: exit 2 with one error line naming the file and line', (_, stations, lines, message) => {
    const s = file('stations.csv', stations);
    const l = file('lines.csv', lines);
    expectBadInput(cli('level-net', s, l), message, /\.csv line \d+/);
  });
  test('a missing file or a missing argument: exit 2', () => {
    expectBadInput(cli('level-net', join(dir, 'nope.csv'), join(dir, 'nope2.csv')), 'nope.csv');
    expectBadInput(cli('level-net', file('s.csv', STATIONS)), 'STATIONS.csv and LINES.csv');
  });
});

describe('frame JOINTS.csv BARS.csv', () => {
  test('the real command prints dims, mechanisms, rigidMotions, selfStresses, selfStressStates, mechanismModes (spawned)', () => {
    // The square with both diagonals (check-values.md): (3, 1), no internal mechanism.
    const out = expectJson(spawnCli('frame', file('j.csv', 'id,x,y\nA,0,0\nB,1,0\nC,1,1\nD,0,1\n'), file('b.csv', 'id,from,to\nab,A,B\nbc,B,C\ncd,C,D\nda,D,A\nac,A,C\nbd,B,D\n')));
    expect(out).toMatchObject({ dims: [3, 1], mechanisms: 0, rigidMotions: 3, selfStresses: 1, mechanismModes: [] });
    const [state] = out.selfStressStates as Record<string, number>[];
    expect(Object.keys(state)).toEqual(['ab', 'bc', 'cd', 'da', 'ac', 'bd']);
    expect(state.ac).toBe(1);
  });
  test('mechanism modes are joint id → displacement vectors (collinear triangle)', () => {
    const out = expectJson(cli('frame', file('j.csv', 'id,x,y\nL,0,0\nM,1,0\nR,2,0\n'), file('b.csv', 'id,from,to\n1,L,M\n2,M,R\n3,L,R\n')));
    expect(out).toMatchObject({ dims: [4, 1], mechanisms: 1, rigidMotions: 3, selfStresses: 1 });
    const [mode] = out.mechanismModes as Record<string, number[]>[];
    expect(mode).toEqual({ L: [0, -0.5], M: [0, 1], R: [0, -0.5] });
  });
  test('the demo footbridge truss is statically and kinematically determinate', () => {
    const out = expectJson(cli('frame', join(DEMO, 'footbridge-joints.csv'), join(DEMO, 'footbridge-bars.csv')));
    expect(out).toMatchObject({ dims: [0, 0], mechanisms: 0, rigidMotions: 0, selfStresses: 0 });
  });
  test.each([
    ['coincident joints', 'id,x,y\nA,0,0\nB,1,0\nC,1,0\n', 'id,from,to\n1,A,B\n', /joints "B" and "C" coincide/],
    ['a bar to a missing joint', 'id,x,y\nA,0,0\nB,1,0\n', 'id,from,to\n1,A,Z\n', /missing joint "Z"/],
    ['a zero-length bar', 'id,x,y\nA,0,0\nB,1,0\n', 'id,from,to\n1,B,B\n', /zero length/],
    ['a non-numeric coordinate', 'id,x,y\nA,0,0\nB,one,0\n', 'id,from,to\n1,A,B\n', /x of joint "B"/],
  ])('%s: exit 2 with one error line', (_, joints, bars, message) => {
    expectBadInput(cli('frame', file('joints.csv', joints), file('bars.csv', bars)), message);
  });
});

describe('mesh FILE', () => {
  test('the demo culvert ring (a torus): Betti numbers (1, 2, 1), closed and orientable (spawned)', () => {
    const out = expectJson(spawnCli('mesh', join(DEMO, 'culvert-ring.obj')));
    expect(out).toMatchObject({ field: 'prime:2', betti: [1, 2, 1], components: 1, closed: true, orientable: true });
    expect((out.cycles as unknown[]).length).toBe(3);
  });
  test('--field rational gives coefficients; --no-cycles skips the cycles; a real field or a non-mesh file is refused', () => {
    const out = expectJson(cli('mesh', join(DEMO, 'culvert-ring.obj'), '--field', 'rational', '--no-cycles'));
    expect(out).toMatchObject({ field: 'rational', betti: [1, 2, 1], cycles: [] });
    expectBadInput(cli('mesh', join(DEMO, 'culvert-ring.obj'), '--field', 'real'), '--field');
    expectBadInput(cli('mesh', join(DEMO, 'footbridge-bars.csv')), 'OBJ or OFF');
    expectBadInput(cli('mesh', file('bad.obj', 'v 0 0 0\nf 1 2 3\n')), 'bad.obj');
  });
});

describe('readings FILE READINGS.json', () => {
  test('consistency radius and nearest global section of readings on a path', () => {
    const model = file('path.sheaf.json', JSON.stringify({ format: 'gluefield.sheaf', version: 1, field: { kind: 'real' }, simplices: [[0, 1], [1, 2]] }));
    const readings = file(
      'r.json',
      JSON.stringify({ format: 'gluefield.readings', version: 1, values: [{ cell: [0], value: [1] }, { cell: [1], value: [2] }, { cell: [2], value: [3], weight: 2 }, { cell: [0, 1], value: [1.5] }] }),
    );
    const out = expectJson(cli('readings', model, readings)) as { consistency: { max: number; pairs: number }; nearestSection: { dimH0: number; section: Record<string, number[]> } };
    expect(out.consistency.pairs).toBe(2);
    expect(out.consistency.max).toBeCloseTo(0.5, 12);
    expect(out.nearestSection.dimH0).toBe(1);
    // Weighted mean of 1, 2, 3 (w 2) and 1.5: (1 + 2 + 6 + 1.5) / 5 = 2.1.
    expect(out.nearestSection.section['2'][0]).toBeCloseTo(2.1, 12);
    const bad = file('bad.json', JSON.stringify({ format: 'gluefield.readings', version: 1, values: [{ cell: [0, 2], value: [1] }] }));
    expectBadInput(cli('readings', model, bad), 'values[0].cell');
  });
});
