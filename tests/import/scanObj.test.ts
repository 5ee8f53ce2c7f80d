/**
 * The one-pass OBJ scanner against the line-by-line reader it stands in
 * front of: random meshes written with random formatting (corner forms
 * `v`, `v/vt`, `v/vt/vn`, `v//vn`, negative relative indices, polygons,
 * comments, blank lines, ignored statements, CRLF) read identically, and
 * whatever the scanner declines (forward references, bad tokens) still gets
 * the line reader's located messages.
 */
import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { readObj, readObjByLines } from '../../shared/import/meshObj';
import { scanObj } from '../../shared/import/scanObj';

const number = fc.oneof(
  fc.integer({ min: -999, max: 999 }).map(String),
  fc.double({ min: -1e3, max: 1e3, noNaN: true }).map((x) => x.toFixed(4)),
  fc.double({ min: -1e3, max: 1e3, noNaN: true }).map((x) => x.toExponential(3)),
);
const ignored = fc.constantFrom('vt 0.5 0.5', 'vn 0 0 1', 'o part', 'g group one', 's off', 'usemtl steel', 'mtllib a.mtl', 'p 1', '# a comment', '');

interface Plan {
  vertices: string[][];
  /** Each face: its corners as 0-based vertex ids, and how each corner is written. */
  faces: { ids: number[]; forms: number[]; line: boolean }[];
}

const plan: fc.Arbitrary<Plan> = fc.integer({ min: 3, max: 12 }).chain((n) =>
  fc.record({
    vertices: fc.array(fc.tuple(number, number, number).map((t) => [...t]), { minLength: n, maxLength: n }),
    faces: fc.array(
      fc.record({
        ids: fc.uniqueArray(fc.integer({ min: 0, max: n - 1 }), { minLength: 2, maxLength: 6 }),
        forms: fc.array(fc.integer({ min: 0, max: 4 }), { minLength: 6, maxLength: 6 }),
        line: fc.boolean(),
      }),
      { maxLength: 12 },
    ),
  }),
);

/** Write the plan with random formatting; `order` decides where each face goes among the vertices. */
function write(p: Plan, pick: (k: number) => number, crlf: boolean, forward: boolean): string {
  const lines: string[] = [];
  const pad = () => [' ', '  ', '\t', ''][pick(4)];
  const sep = () => [' ', '  ', '\t', ' \t'][pick(4)];
  const extra = () => [[''], ['', ' # trailing note'], ['', ' 1.0'], ['', '\t']][pick(4)].join('');
  const faces = p.faces.filter((f) => f.line || f.ids.length >= 3);
  let listed = 0;
  const writeFace = (f: Plan['faces'][number]) => {
    const corners = f.ids.map((id, i) => {
      // Relative indices only for vertices already listed; the rest 1-based.
      const ref = f.forms[i] === 4 && id < listed ? String(id - listed) : String(id + 1);
      return [ref, `${ref}/${pick(9) + 1}`, `${ref}/${pick(9) + 1}/${pick(9) + 1}`, `${ref}//${pick(9) + 1}`, ref][f.line ? 0 : f.forms[i]];
    });
    lines.push(`${pad()}${f.line ? 'l' : 'f'}${sep()}${corners.join(sep())}${extra()}`);
  };
  let next = 0;
  for (let v = 0; v < p.vertices.length; v++) {
    if (pick(3) === 0) lines.push(['', '# note', 'vt 0 1', 'g piece', '   '][pick(5)]);
    lines.push(`${pad()}v${sep()}${p.vertices[v].join(sep())}${extra()}`);
    listed = v + 1;
    // Faces whose vertices are all listed may come now (or, with `forward`, a little early).
    while (next < faces.length && (forward ? pick(4) === 0 : Math.max(...faces[next].ids) < listed && pick(3) === 0)) writeFace(faces[next++]);
  }
  while (next < faces.length) writeFace(faces[next++]);
  return lines.join(crlf ? '\r\n' : '\n') + (pick(2) ? '\n' : '');
}

const written = fc.record({ p: plan, seed: fc.array(fc.nat(), { minLength: 64, maxLength: 64 }), crlf: fc.boolean(), forward: fc.boolean(), junk: fc.array(ignored, { maxLength: 3 }) }).map(({ p, seed, crlf, forward, junk }) => {
  let i = 0;
  const pick = (k: number) => seed[i++ % seed.length] % k;
  const text = junk.join('\n') + (junk.length ? '\n' : '') + write(p, pick, crlf, forward);
  return { text, forward };
});

describe('scanObj', () => {
  test('random meshes with random formatting read as the line reader reads them', () => {
    fc.assert(
      fc.property(written, ({ text, forward }) => {
        const fast = readObj(text);
        const lines = readObjByLines(text);
        expect(fast).toEqual(lines);
        // Without forward references a valid file is the scanner's alone.
        if (!forward && 'mesh' in lines) expect(scanObj(text)).toBeDefined();
      }),
      { numRuns: 400 },
    );
  });

  test('a corrupted token anywhere: the scanner declines and the line reader names the line', () => {
    fc.assert(
      fc.property(written, fc.nat(), fc.constantFrom('x', '1.2.3', '0', '1/', '+', '1//', '1/2/3/4', 'nan', '-99'), ({ text }, at, bad) => {
        const lines = text.split('\n');
        const k = at % lines.length;
        lines[k] = lines[k].replace(/(\s)(\S+)\s*$/, `$1${bad}`);
        const broken = lines.join('\n');
        expect(readObj(broken)).toEqual(readObjByLines(broken));
      }),
      { numRuns: 300 },
    );
  });

  test('what it declines outright: a byte order mark, CR-only line ends, a file without vertices, a face before its vertices', () => {
    expect(scanObj('\ufeffv 0 0 0\n')).toBeUndefined();
    expect(scanObj('v 0 0 0\rv 1 0 0\rv 0 1 0\rf 1 2 3\r')).toBeUndefined();
    expect(scanObj('# nothing\n')).toBeUndefined();
    expect(scanObj('f 1 2 3\nv 0 0 0\nv 1 0 0\nv 0 1 0\n')).toBeUndefined();
    // The line reader still reads the last two (common practice in OBJ writers: vertices may follow faces).
    expect('mesh' in readObj('v 0 0 0\rv 1 0 0\rv 0 1 0\rf 1 2 3\r')).toBe(true);
    expect('mesh' in readObj('f 1 2 3\nv 0 0 0\nv 1 0 0\nv 0 1 0\n')).toBe(true);
  });

  test('a square as two triangles by a fan from its first corner, relative indices and texture corners', () => {
    const r = scanObj('v 0 0 0\nv 1 0 0\r\nv 1 1 0\nv 0 1 0 # top left\nf -4/1 -3/2/1 3//1 4\n');
    expect(r && Array.from(r.triangles)).toEqual([0, 1, 2, 0, 2, 3]);
    expect(r && Array.from(r.positions)).toEqual([0, 0, 0, 1, 0, 0, 1, 1, 0, 0, 1, 0]);
  });
});
