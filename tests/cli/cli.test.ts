/**
 * The command-line contract of shared/docs/model-format.md ("The command
 * line"), checked exactly: outside tools depend on it. A few cases spawn the
 * real `npm run --silent gluefield -- ...` (about a second each); the many
 * other cases call `runCli` in-process with the same file reader.
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { runCli } from '../../cli/runCli';

const REPO = fileURLToPath(new URL('../..', import.meta.url));

interface Run {
  status: number | null;
  stdout: string;
  stderr: string;
}

/** The real command, as outside tools run it. */
function spawnCli(...args: string[]): Run {
  const r = spawnSync('npm', ['run', '--silent', 'gluefield', '--', ...args], {
    cwd: REPO,
    encoding: 'utf8',
    timeout: 60_000,
  });
  if (r.error) throw r.error;
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** The same command line in-process. */
function cli(...args: string[]): Run {
  let stdout = '';
  let stderr = '';
  const status = runCli(args, {
    readFile: (path) => readFileSync(path, 'utf8'),
    stdout: (t) => {
      stdout += t;
    },
    stderr: (t) => {
      stderr += t;
    },
  });
  return { status, stdout, stderr };
}

// ---------------------------------------------------------------- models

type Json = Record<string, unknown>;

function model(simplices: number[][], extra: Json = {}): Json {
  return { format: 'gluefield.sheaf', version: 1, simplices, ...extra };
}

/** The boundary of an n-gon: a circle with vertices 0 … n-1. */
function cycle(n: number): number[][] {
  return Array.from({ length: n }, (_, i) => [i, (i + 1) % n]);
}

/**
 * The Klein bottle: an n×n grid of squares, each cut into two triangles,
 * glued periodically in j and with a flip j ↦ -j across i = n.
 * n = 5: 25 vertices, 75 edges, 50 triangles.
 */
function kleinBottle(n = 5): number[][] {
  const v = (i: number, j: number) => {
    let ii = i;
    let jj = j % n;
    if (ii === n) {
      ii = 0;
      jj = (n - jj) % n;
    }
    return ii * n + jj;
  };
  const out: number[][] = [];
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      out.push([v(i, j), v(i + 1, j), v(i + 1, j + 1)], [v(i, j), v(i, j + 1), v(i + 1, j + 1)]);
    }
  }
  return out;
}

let dir = '';
const files: Record<string, string> = {};

function put(name: string, content: unknown): string {
  const path = join(dir, name);
  writeFileSync(path, typeof content === 'string' ? content : JSON.stringify(content));
  files[name] = path;
  return path;
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'gluefield-cli-'));
  put('circle.sheaf.json', model(cycle(4)));
  put('klein.sheaf.json', model(kleinBottle(5)));
  put('klein-gf2.sheaf.json', model(kleinBottle(5), { field: { kind: 'prime', p: 2 } }));
  put('monodromy.sheaf.json', model(cycle(3), { maps: { entries: [{ face: [0], coface: [0, 1], scalar: 2 }] } }));
  put('not-a-face.sheaf.json', model([[0, 1], [2, 3]], { maps: { entries: [{ face: [3], coface: [0, 1], scalar: 1 }] } }));
  put(
    'bad-shape.sheaf.json',
    model(cycle(3), { stalks: { default: 2 }, maps: { entries: [{ face: [1], coface: [1, 2], matrix: [[1, 0]] }] } }),
  );
  put('wrong-format.sheaf.json', model(cycle(3), { format: 'gluefield.model' }));
  put('wrong-version.sheaf.json', model(cycle(3), { version: 2 }));
  put('non-prime.sheaf.json', model(cycle(3), { field: { kind: 'prime', p: 12 } }));
  put('broken-condition.sheaf.json', model([[0, 1, 2]], { maps: { entries: [{ face: [0], coface: [0, 1], scalar: 2 }] } }));
  put('identity-mismatch.sheaf.json', model(cycle(3), { stalks: { default: 1, cells: [{ cell: [1, 2], dim: 2 }] } }));
  put('zero-denominator.sheaf.json', model(cycle(3), { maps: { entries: [{ face: [0], coface: [0, 1], scalar: '1/0' }] } }));
  put('unreadable-entry.sheaf.json', model(cycle(3), { maps: { entries: [{ face: [0], coface: [0, 1], matrix: [['abc']] }] } }));
  put('bad-vertex.sheaf.json', model([[0, 1], [1, -4]]));
  put('unknown-cell.sheaf.json', model(cycle(3), { stalks: { cells: [{ cell: [0, 9], dim: 2 }] } }));
  put('twice.sheaf.json', model(cycle(3), { maps: { entries: [{ face: [0], coface: [0, 1], scalar: 2 }, { face: [0], coface: [1, 0], scalar: 2 }] } }));
  put('not-json.sheaf.json', '{"format": "gluefield.sheaf", "version": 1, "simplices": [[0,1]');
  put('empty.sheaf.json', '');
  put('array.sheaf.json', [[0, 1]]);
  // A filled triangle in the real field whose three edge→triangle maps are the
  // scalar 1e-12: invertible and exactly commuting, so isomorphic to the
  // constant sheaf on a disc, H = [1,0,0].
  put(
    'tiny-maps.sheaf.json',
    model([[0, 1, 2]], {
      field: { kind: 'real' },
      maps: {
        entries: [
          { face: [0, 1], coface: [0, 1, 2], scalar: 1e-12 },
          { face: [0, 2], coface: [0, 1, 2], scalar: 1e-12 },
          { face: [1, 2], coface: [0, 1, 2], scalar: 1e-12 },
        ],
      },
    }),
  );
  mkdirSync(join(dir, 'a-directory'));
});

afterAll(() => {
  if (dir) rmSync(dir, { recursive: true, force: true });
});

// ---------------------------------------------------------------- contract checks

interface Report {
  dims: number[];
  cells: number[];
  cochainDims: number[];
  euler: number;
  field: string;
  method: string;
  morse?: { criticalCells: number[]; criticalCochainDims: number[]; rounds: number };
  ms: { build: number; reduce: number; solve: number; total: number };
}

const alternating = (xs: number[]) => xs.reduce((s, x, k) => s + (k % 2 === 0 ? x : -x), 0);
const isCount = (x: unknown) => typeof x === 'number' && Number.isInteger(x) && x >= 0;

/** Success: exit 0, nothing on stderr, exactly one JSON object on stdout obeying the contract. */
function expectReport(run: Run, method: 'morse' | 'direct'): Report {
  expect(run.stderr).toBe('');
  expect(run.status).toBe(0);
  expect(run.stdout.endsWith('\n')).toBe(true);
  expect(run.stdout.trimEnd().split('\n')).toHaveLength(1);
  const r = JSON.parse(run.stdout) as Report;
  expect(typeof r).toBe('object');
  expect(Array.isArray(r)).toBe(false);
  for (const key of ['dims', 'cells', 'cochainDims', 'euler', 'field', 'method', 'ms']) expect(r).toHaveProperty(key);
  const top = r.dims.length;
  expect(top).toBeGreaterThan(0);
  for (const key of ['dims', 'cells', 'cochainDims'] as const) {
    expect(Array.isArray(r[key])).toBe(true);
    expect(r[key]).toHaveLength(top);
    for (const x of r[key]) expect(isCount(x)).toBe(true);
  }
  expect(Number.isInteger(r.euler)).toBe(true);
  expect(r.euler).toBe(alternating(r.cochainDims));
  expect(r.euler).toBe(alternating(r.dims));
  expect(r.field).toMatch(/^(rational|real|prime:[0-9]+)$/);
  expect(r.method).toBe(method);
  for (const key of ['build', 'reduce', 'solve', 'total'] as const) {
    expect(typeof r.ms[key]).toBe('number');
    expect(Number.isFinite(r.ms[key])).toBe(true);
    expect(r.ms[key]).toBeGreaterThanOrEqual(0);
  }
  if (method === 'morse') {
    expect(r.morse).toBeDefined();
    const m = r.morse!;
    expect(m.criticalCells).toHaveLength(top);
    expect(m.criticalCochainDims).toHaveLength(top);
    for (const x of [...m.criticalCells, ...m.criticalCochainDims]) expect(isCount(x)).toBe(true);
    expect(isCount(m.rounds)).toBe(true);
    for (let k = 0; k < top; k++) {
      // The Morse complex is smaller than the original and still carries the cohomology.
      expect(m.criticalCells[k]).toBeLessThanOrEqual(r.cells[k]);
      expect(m.criticalCochainDims[k]).toBeLessThanOrEqual(r.cochainDims[k]);
      expect(m.criticalCochainDims[k]).toBeGreaterThanOrEqual(r.dims[k]);
    }
  } else {
    expect(r).not.toHaveProperty('morse');
  }
  return r;
}

/** Bad input: exit 2, nothing on stdout, exactly one `error:` line naming the problem, no stack trace. */
function expectBadInput(run: Run, ...fragments: (string | RegExp)[]): string {
  expect(run.stdout).toBe('');
  expectOneErrorLine(run, ...fragments);
  return run.stderr;
}

function expectOneErrorLine(run: Run, ...fragments: (string | RegExp)[]): void {
  expect(run.status).toBe(2);
  expect(run.stderr).not.toMatch(/^\s+at /m);
  expect(run.stderr.endsWith('\n')).toBe(true);
  const lines = run.stderr.slice(0, -1).split('\n');
  expect(lines, `stderr must be exactly one line, got:\n${run.stderr}`).toHaveLength(1);
  expect(lines[0].startsWith('error:')).toBe(true);
  for (const f of fragments) {
    if (typeof f === 'string') expect(lines[0]).toContain(f);
    else expect(lines[0]).toMatch(f);
  }
}

// ---------------------------------------------------------------- the real command (spawned)

describe('spawned: npm run --silent gluefield', () => {
  test('cohomology FILE (default method morse) on a circle', () => {
    const r = expectReport(spawnCli('cohomology', files['circle.sheaf.json']), 'morse');
    expect(r.dims).toEqual([1, 1]);
    expect(r.cells).toEqual([4, 4]);
    expect(r.cochainDims).toEqual([4, 4]);
    expect(r.euler).toBe(0);
    expect(r.field).toBe('rational');
  });

  test('--method direct on the Klein bottle: [1,1,0] over Q and no morse key', () => {
    const r = expectReport(spawnCli('cohomology', files['klein.sheaf.json'], '--method', 'direct'), 'direct');
    expect(r.dims).toEqual([1, 1, 0]);
    expect(r.cells).toEqual([25, 75, 50]);
    expect(r.field).toBe('rational');
  });

  test('--field prime:2 changes the Klein bottle answer to [1,2,1] (Hatcher §3.1)', () => {
    const r = expectReport(spawnCli('cohomology', files['klein.sheaf.json'], '--field', 'prime:2'), 'morse');
    expect(r.dims).toEqual([1, 2, 1]);
    expect(r.field).toBe('prime:2');
  });

  test('bad input (a face that is not a face): exit 2, one error line naming the pair', () => {
    expectBadInput(spawnCli('cohomology', files['not-a-face.sheaf.json']), 'maps.entries[0]', '[3]', '[0,1]');
  });

  test('missing file', () => {
    const missing = join(dir, 'no-such.sheaf.json');
    expectBadInput(spawnCli('cohomology', missing), missing);
  });

  test('unreadable JSON', () => {
    expectBadInput(spawnCli('cohomology', files['not-json.sheaf.json']), 'not valid JSON');
  });

  test('unknown option', () => {
    expectBadInput(spawnCli('cohomology', files['circle.sheaf.json'], '--fast'), '--fast');
  });

  test('--field prime:12', () => {
    expectBadInput(spawnCli('cohomology', files['circle.sheaf.json'], '--field', 'prime:12'), '12', 'prime');
  });

  test('no command', () => {
    expectBadInput(spawnCli(), 'command');
  });

  test('check FILE prints a JSON summary and exits 0', () => {
    const run = spawnCli('check', files['klein.sheaf.json']);
    expect(run.status).toBe(0);
    expect(run.stderr).toBe('');
    expect(run.stdout.trimEnd().split('\n')).toHaveLength(1);
    const s = JSON.parse(run.stdout);
    expect(s.valid).toBe(true);
    expect(s.cells).toEqual([25, 75, 50]);
    expect(s.cochainDims).toEqual([25, 75, 50]);
    expect(s.field).toBe('rational');
  });

  test('check on an invalid file exits 2 with the problems list', () => {
    const run = spawnCli('check', files['broken-condition.sheaf.json']);
    expect(run.status).toBe(2);
    const s = JSON.parse(run.stdout);
    expect(s.valid).toBe(false);
    expect(s.problems.length).toBeGreaterThan(0);
    expect(s.problems[0].where).toBe('maps');
    expect(s.problems[0].message).toContain('[0,1,2]');
    expectOneErrorLine(run, 'sheaf condition', '[0,1,2]');
  });

  test('sections FILE --degree 0 on a circle: the constant section', () => {
    const run = spawnCli('sections', files['circle.sheaf.json'], '--degree', '0');
    expect(run.status).toBe(0);
    expect(run.stderr).toBe('');
    const s = JSON.parse(run.stdout);
    expect(s.dim).toBe(1);
    expect(s.cells).toEqual([[0], [1], [2], [3]]);
    expect(s.basis).toHaveLength(1);
    const values = s.basis[0] as unknown[][];
    expect(values).toHaveLength(4);
    for (const v of values) expect(v).toHaveLength(1);
    expect(values[0][0]).not.toBe(0);
    for (const v of values) expect(v[0]).toEqual(values[0][0]);
  });

  test('sections FILE --degree 5 on a circle exits 2', () => {
    expectBadInput(spawnCli('sections', files['circle.sheaf.json'], '--degree', '5'), '--degree', '5');
  });
});

// ---------------------------------------------------------------- in-process: success

describe('runCli: cohomology', () => {
  test.each(['morse', 'direct'] as const)('circle, --method %s', (method) => {
    const r = expectReport(cli('cohomology', files['circle.sheaf.json'], '--method', method), method);
    expect(r.dims).toEqual([1, 1]);
  });

  test('the default method is morse', () => {
    expect(expectReport(cli('cohomology', files['circle.sheaf.json']), 'morse').method).toBe('morse');
  });

  test.each([
    ['rational', undefined, [1, 1, 0], 'rational'],
    ['prime:2', 'prime:2', [1, 2, 1], 'prime:2'],
    ['prime:3', 'prime:3', [1, 1, 0], 'prime:3'],
    ['real', 'real', [1, 1, 0], 'real'],
  ])('Klein bottle over %s, both methods agree', (_label, field, dims, label) => {
    for (const method of ['morse', 'direct'] as const) {
      const args = ['cohomology', files['klein.sheaf.json'], '--method', method];
      if (field) args.push('--field', field);
      const r = expectReport(cli(...args), method);
      expect(r.dims).toEqual(dims);
      expect(r.cells).toEqual([25, 75, 50]);
      expect(r.cochainDims).toEqual([25, 75, 50]);
      expect(r.euler).toBe(0);
      expect(r.field).toBe(label);
    }
  });

  // Contract: "Both must give the same dimensions on every valid input."
  test('real field: morse and direct agree on a valid disc whose maps are the scalar 1e-12', () => {
    const direct = expectReport(cli('cohomology', files['tiny-maps.sheaf.json'], '--method', 'direct'), 'direct');
    const morse = expectReport(cli('cohomology', files['tiny-maps.sheaf.json'], '--method', 'morse'), 'morse');
    expect(direct.field).toBe('real');
    expect(direct.dims).toEqual([1, 0, 0]);
    expect(morse.dims).toEqual(direct.dims);
  });

  test("the file's field is used, and --field overrides it", () => {
    const fromFile = expectReport(cli('cohomology', files['klein-gf2.sheaf.json']), 'morse');
    expect(fromFile.field).toBe('prime:2');
    expect(fromFile.dims).toEqual([1, 2, 1]);
    const overridden = expectReport(cli('cohomology', files['klein-gf2.sheaf.json'], '--field', 'rational'), 'morse');
    expect(overridden.field).toBe('rational');
    expect(overridden.dims).toEqual([1, 1, 0]);
  });

  test('options may come before the file', () => {
    const r = expectReport(cli('cohomology', '--method', 'direct', '--field', 'prime:2', files['klein.sheaf.json']), 'direct');
    expect(r.dims).toEqual([1, 2, 1]);
  });

  test('a non-trivial monodromy (scalar 2 on one edge), over Q and over GF(3)', () => {
    for (const field of ['rational', 'prime:3']) {
      for (const method of ['morse', 'direct'] as const) {
        expect(expectReport(cli('cohomology', files['monodromy.sheaf.json'], '--field', field, '--method', method), method).dims).toEqual([0, 0]);
      }
    }
  });
});

// ---------------------------------------------------------------- in-process: bad input

describe('runCli: bad input in the file', () => {
  test.each([
    ['a face that is not a face', 'not-a-face.sheaf.json', ['maps.entries[0]', '[3]', '[0,1]']],
    ['a matrix of the wrong shape', 'bad-shape.sheaf.json', ['maps.entries[0].matrix', '[1] ◁ [1,2]']],
    ['the wrong format tag', 'wrong-format.sheaf.json', ['format', 'gluefield.sheaf']],
    ['the wrong version', 'wrong-version.sheaf.json', ['version']],
    ['a non-prime P', 'non-prime.sheaf.json', ['field.p', '12']],
    ['a broken sheaf condition', 'broken-condition.sheaf.json', ['sheaf condition', '[0] ◁ [0,1] ◁ [0,1,2]', '[0,2]']],
    ['an identity default between stalks of different dimension', 'identity-mismatch.sheaf.json', ['maps.default', '[1,2] (dimension 2)']],
    ['a zero denominator', 'zero-denominator.sheaf.json', ['maps.entries[0].scalar', '1/0']],
    ['an unreadable entry', 'unreadable-entry.sheaf.json', ['maps.entries[0].matrix[0][0]', 'abc']],
    ['a negative vertex id', 'bad-vertex.sheaf.json', ['simplices[1]', '-4']],
    ['a stalk on a cell not in the complex', 'unknown-cell.sheaf.json', ['stalks.cells[0]', '[0,9]']],
    ['a pair given twice', 'twice.sheaf.json', ['maps.entries[1]', 'twice']],
    ['a JSON list instead of an object', 'array.sheaf.json', ['object']],
  ])('%s', (_label, name, fragments) => {
    for (const command of ['cohomology', 'sections'] as const) {
      const args = command === 'sections' ? [command, files[name], '--degree', '0'] : [command, files[name]];
      expectBadInput(cli(...args), ...fragments);
    }
    for (const method of ['morse', 'direct']) expectBadInput(cli('cohomology', files[name], '--method', method), ...fragments);
  });

  test('--field does not excuse a bad field in the file', () => {
    expectBadInput(cli('cohomology', files['non-prime.sheaf.json'], '--field', 'rational'), 'field.p');
  });
});

describe('runCli: bad input on the command line', () => {
  test('missing file', () => {
    const missing = join(dir, 'missing.sheaf.json');
    expectBadInput(cli('cohomology', missing), missing, 'no such file');
  });

  test('a directory instead of a file', () => {
    expectBadInput(cli('cohomology', join(dir, 'a-directory')), 'a-directory');
  });

  test('unreadable JSON, and an empty file', () => {
    expectBadInput(cli('cohomology', files['not-json.sheaf.json']), 'not-json.sheaf.json', 'not valid JSON');
    expectBadInput(cli('cohomology', files['empty.sheaf.json']), 'empty.sheaf.json', 'not valid JSON');
  });

  test.each(['--fast', '--verbose', '-x'])('unknown option %s', (opt) => {
    // `-x` is not an option either; as a second positional argument it is rejected as unexpected.
    expectBadInput(cli('cohomology', files['circle.sheaf.json'], opt), opt);
  });

  test.each(['prime:12', 'prime:1', 'prime:2147483648', 'prime:two', 'prime:', 'complex', 'Rational'])('--field %s', (field) => {
    expectBadInput(cli('cohomology', files['circle.sheaf.json'], '--field', field), '--field');
  });

  test('--field prime:12 names 12 and says it is not prime', () => {
    expectBadInput(cli('cohomology', files['circle.sheaf.json'], '--field', 'prime:12'), '12', 'prime');
  });

  test('--method fast', () => {
    expectBadInput(cli('cohomology', files['circle.sheaf.json'], '--method', 'fast'), '--method', 'fast');
  });

  test.each(['--method', '--field', '--degree'])('%s without a value', (opt) => {
    expectBadInput(cli('cohomology', files['circle.sheaf.json'], opt), opt);
  });

  test('no command', () => {
    expectBadInput(cli(), 'command');
  });

  test('a command without FILE', () => {
    expectBadInput(cli('cohomology'), 'FILE');
    expectBadInput(cli('check'), 'FILE');
  });

  test('an unknown command', () => {
    expectBadInput(cli('homology', files['circle.sheaf.json']), 'homology');
  });

  test('an extra positional argument', () => {
    expectBadInput(cli('cohomology', files['circle.sheaf.json'], files['klein.sheaf.json']), 'unexpected');
  });
});

// ---------------------------------------------------------------- in-process: check and sections

describe('runCli: check', () => {
  test('a valid file: summary with valid, cells, cochainDims, field; exit 0', () => {
    const run = cli('check', files['circle.sheaf.json']);
    expect(run.status).toBe(0);
    expect(run.stderr).toBe('');
    expect(run.stdout.trimEnd().split('\n')).toHaveLength(1);
    const s = JSON.parse(run.stdout);
    expect(s.valid).toBe(true);
    expect(s.cells).toEqual([4, 4]);
    expect(s.cochainDims).toEqual([4, 4]);
    expect(s.field).toBe('rational');
  });

  test('--field is reflected in the summary', () => {
    const s = JSON.parse(cli('check', files['klein.sheaf.json'], '--field', 'prime:2').stdout);
    expect(s.valid).toBe(true);
    expect(s.field).toBe('prime:2');
    expect(JSON.parse(cli('check', files['klein-gf2.sheaf.json']).stdout).field).toBe('prime:2');
  });

  test.each([
    ['not-a-face.sheaf.json', 'maps.entries[0]', '[3]'],
    ['identity-mismatch.sheaf.json', 'maps.default', '[1,2]'],
    ['non-prime.sheaf.json', 'field.p', '12'],
  ])('an invalid file (%s) exits 2 with the problems list', (name, where, fragment) => {
    const run = cli('check', files[name]);
    expect(run.status).toBe(2);
    const s = JSON.parse(run.stdout);
    expect(s.valid).toBe(false);
    expect(Array.isArray(s.problems)).toBe(true);
    expect(s.problems.length).toBeGreaterThan(0);
    for (const p of s.problems) {
      expect(typeof p.where).toBe('string');
      expect(typeof p.message).toBe('string');
    }
    expect(s.problems[0].where).toBe(where);
    expect(s.problems[0].message).toContain(fragment);
    expectOneErrorLine(run, where, fragment);
  });

  test('unreadable JSON under check is a plain bad-input error', () => {
    expectBadInput(cli('check', files['not-json.sheaf.json']), 'not valid JSON');
  });
});

describe('runCli: sections', () => {
  test.each(['morse', 'direct'])('--degree 0 on a circle (--method %s): the constant section', (method) => {
    const run = cli('sections', files['circle.sheaf.json'], '--degree', '0', '--method', method);
    expect(run.status).toBe(0);
    expect(run.stderr).toBe('');
    const s = JSON.parse(run.stdout);
    expect(s.degree).toBe(0);
    expect(s.dim).toBe(1);
    expect(s.cells).toEqual([[0], [1], [2], [3]]);
    expect(s.basis).toHaveLength(1);
    const values = s.basis[0] as unknown[][];
    expect(values).toHaveLength(4);
    for (const v of values) expect(v).toHaveLength(1);
    expect(values[0][0]).not.toBe(0);
    for (const v of values) expect(v[0]).toEqual(values[0][0]);
  });

  test('--degree 1 on a circle: one class, one value per edge', () => {
    const s = JSON.parse(cli('sections', files['circle.sheaf.json'], '--degree', '1').stdout);
    expect(s.dim).toBe(1);
    expect(s.cells).toHaveLength(4);
    expect(s.basis).toHaveLength(1);
    expect(s.basis[0]).toHaveLength(4);
  });

  test('--degree 0 with a non-trivial monodromy: no sections', () => {
    const s = JSON.parse(cli('sections', files['monodromy.sheaf.json'], '--degree', '0').stdout);
    expect(s.dim).toBe(0);
    expect(s.basis).toEqual([]);
  });

  test.each(['5', '2'])('--degree %s on a circle exits 2', (degree) => {
    expectBadInput(cli('sections', files['circle.sheaf.json'], '--degree', degree), '--degree', degree);
  });

  test.each(['-1', 'one', '1.5'])('--degree %s is not a degree', (degree) => {
    expectBadInput(cli('sections', files['circle.sheaf.json'], '--degree', degree), '--degree');
  });

  test('sections without --degree', () => {
    expectBadInput(cli('sections', files['circle.sheaf.json']), '--degree');
  });
});
