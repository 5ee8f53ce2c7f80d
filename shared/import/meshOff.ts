import { ProblemList } from '../engine/model/Problem';
import type { ImportOptions, ImportResult } from './ImportResult';
import { LineTokens } from './LineTokens';
import { MeshBuilder } from './MeshBuilder';
import { meshImport, progressStep, type MeshReadOptions, type MeshReadResult } from './MeshData';
import { parseFloatToken, parseIntToken } from './numberToken';

// Geomview's header keywords whose vertex lines start with x y z; the extra
// values they add (normals, colours, texture coordinates) are skipped.
const HEADER = /^(ST)?C?N?OFF$/;

/**
 * Read an OFF mesh (Geomview's Object File Format, text form) as the
 * constant sheaf on its triangulated surface: an optional `OFF` header, a
 * counts line `nv nf ne`, nv vertex lines `x y z …`, then nf face lines
 * `n i1 … in …` with 0-based indices (anything after the n indices, such as
 * a colour, is ignored). `#` starts a comment. Polygons are
 * fan-triangulated; vertices no face uses stay as isolated points.
 *
 * Never throws on bad input: problems come back located by line.
 */
export function importOff(text: string, options: ImportOptions = {}): ImportResult {
  return meshImport(readOff(text), options);
}

/** As {@link importOff}, giving the mesh in typed arrays (see {@link MeshData}) instead of a model file. */
export function readOff(text: string, options: MeshReadOptions = {}): MeshReadResult {
  const progress = options.progress;
  const problems = new ProblemList();
  const mesh = new MeshBuilder();
  const tokens = new LineTokens(text);
  const where = (): string => `line ${tokens.line}`;
  const fail = (message: string): MeshReadResult => {
    problems.add(where(), message);
    return { problems: problems.items };
  };

  const xyz = new Float64Array(3);
  const counts = readCounts(tokens);
  if (typeof counts === 'string') return fail(counts);
  const [nv, nf] = counts;

  const step = progressStep(text.length);
  let mark = step;
  const report = () => {
    if (progress && tokens.offset >= mark) {
      progress(Math.min(1, tokens.offset / text.length));
      mark = tokens.offset + step;
    }
  };
  for (let v = 0; v < nv && !problems.full; v++) {
    report();
    if (!nextContentLine(tokens)) return fail(`the file ends after ${v} of ${nv} vertices`);
    xyz.fill(NaN);
    for (let i = 0; i < 3; i++) {
      if (i > 0 && !tokens.next()) {
        problems.add(where(), 'a vertex line needs three coordinates "x y z"');
        break;
      }
      xyz[i] = parseFloatToken(text, tokens.start, tokens.end);
      if (Number.isNaN(xyz[i])) {
        problems.add(where(), `"${tokens.token()}" is not a number`);
        break;
      }
    }
    mesh.addVertex(xyz[0], xyz[1], xyz[2]);
  }

  let corners = new Int32Array(16);
  for (let f = 0; f < nf && !problems.full; f++) {
    report();
    if (!nextContentLine(tokens)) return fail(`the file ends after ${f} of ${nf} faces`);
    const n = parseIntToken(text, tokens.start, tokens.end);
    if (!(n >= 0)) {
      problems.add(where(), `"${tokens.token()}" is not a vertex count`);
      continue;
    }
    if (n > nv) {
      // Also keeps a huge count from allocating before the line is read.
      problems.add(where(), `a face of ${n} vertices cannot be made of the file's ${nv} vertices without repeats`);
      continue;
    }
    if (n > corners.length) corners = new Int32Array(Math.max(n, 2 * corners.length));
    let k = 0;
    let bad = false;
    for (; k < n && !bad && tokens.next(); k++) {
      const id = parseIntToken(text, tokens.start, tokens.end);
      if (Number.isNaN(id)) {
        problems.add(where(), `"${tokens.token()}" is not a vertex index`);
        bad = true;
      } else if (id < 0 || id >= nv) {
        problems.add(where(), `vertex index ${id} is out of range: the file has ${nv} vertices, numbered from 0`);
        bad = true;
      }
      corners[k] = id;
    }
    if (bad) continue;
    if (k < n) {
      problems.add(where(), `the face lists ${n} vertices but the line has only ${k}`);
      continue;
    }
    if (n < 3) {
      problems.add(where(), `a face needs at least 3 vertices, got ${n}`);
      continue;
    }
    const repeated = mesh.addPolygon(corners, n);
    if (repeated >= 0) problems.add(where(), `degenerate face: vertex ${repeated} appears twice`);
  }

  if (!problems.full && nextContentLine(tokens)) {
    problems.add(where(), `unexpected content after the last of ${nf} faces`);
  }
  if (problems.any) return { problems: problems.items };
  return { mesh: mesh.toData() };
}

/** Move to the next line that has a token, leaving that token current. */
function nextContentLine(tokens: LineTokens): boolean {
  while (tokens.nextLine()) if (tokens.next()) return true;
  return false;
}

/** The vertex and face counts after the optional header, or what is wrong with them. */
function readCounts(tokens: LineTokens): [number, number] | string {
  if (!nextContentLine(tokens)) return 'the file is empty';
  const text = tokens.text;
  if (!isDigitStart(text.charCodeAt(tokens.start))) {
    const header = tokens.token();
    if (!HEADER.test(header)) return `expected the header "OFF", got "${header}"`;
    if (tokens.next()) {
      if (tokens.is('BINARY')) return 'binary OFF is not supported; save the mesh as text OFF';
    } else if (!nextContentLine(tokens)) {
      return 'the file ends before the counts line "vertices faces edges"';
    }
  }
  const values: number[] = [];
  do {
    const value = parseIntToken(text, tokens.start, tokens.end);
    if (!(value >= 0)) return `"${tokens.token()}" is not a count`;
    values.push(value);
  } while (values.length < 3 && tokens.next());
  if (values.length < 2) return 'the counts line needs the numbers of vertices and faces';
  return [values[0], values[1]];
}

function isDigitStart(c: number): boolean {
  return (c >= 48 && c <= 57) || c === 43 || c === 45;
}
