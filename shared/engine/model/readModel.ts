import type { FieldSpec } from '../fields/FieldSpec';
import { makeField } from '../fields/makeField';
import { checkSheafCondition } from './checkSheafCondition';
import { MODEL_FORMAT, MODEL_VERSION, type VertexInfo } from './ModelFile';
import { ModelError, ProblemList, type Problem } from './Problem';
import { isObject, readFieldSpec } from './readField';
import { readMaps } from './readMaps';
import { readSimplices, readScannedSimplices, denseIndexer } from './readSimplices';
import { splitModelText, type ScannedSimplices } from './scanSimplices';
import { readStalks } from './readStalks';
import type { Sheaf } from './Sheaf';

export interface ReadOptions {
  /** Overrides the file's field (the command line's `--field`). */
  field?: FieldSpec;
}

export type ReadResult = { sheaf: Sheaf<unknown>; problems: [] } | { sheaf: undefined; problems: Problem[] };

/**
 * Validate a parsed model file and build its sheaf. Never throws on bad
 * input: every problem comes back located (a JSON path, a cell or a pair).
 */
export function readModel(json: unknown, options: ReadOptions = {}): ReadResult {
  return readParsed(json, undefined, options);
}

/**
 * Validate a model file given as text. The simplex list, nearly all of a
 * large file, is scanned straight into typed arrays when it is in the plain
 * form; the parsed remainder is small and dies with this call. Throws the
 * SyntaxError JSON.parse gives for text that is not JSON.
 */
export function readModelText(text: string, options: ReadOptions = {}): ReadResult {
  const split = splitModelText(text);
  if (!split) return readParsed(JSON.parse(text), undefined, options);
  let rest: unknown;
  try {
    rest = JSON.parse(split.rest);
  } catch {
    // Report the error against the file as written, not the shortened text.
    return readParsed(JSON.parse(text), undefined, options);
  }
  return readParsed(rest, split.simplices, options);
}

/**
 * Validate a model file whose simplex list is given apart, already in typed
 * arrays (an importer that read a mesh straight into them); `json.simplices`
 * is ignored. Same checks and messages as {@link readModel}.
 */
export function readModelWithSimplices(json: unknown, simplices: ScannedSimplices, options: ReadOptions = {}): ReadResult {
  return readParsed(json, simplices, options);
}

/** As {@link readModelText}, throwing a {@link ModelError} on the first problem. */
export function readModelTextOrThrow(text: string, options: ReadOptions = {}): Sheaf<unknown> {
  const r = readModelText(text, options);
  if (!r.sheaf) throw new ModelError(r.problems);
  return r.sheaf;
}

function readParsed(json: unknown, scanned: ScannedSimplices | undefined, options: ReadOptions): ReadResult {
  const problems = new ProblemList();
  const fail = (): ReadResult => ({ sheaf: undefined, problems: problems.items });
  if (!isObject(json)) {
    problems.add('', 'the model must be a JSON object');
    return fail();
  }
  if (json.format !== MODEL_FORMAT) {
    problems.add('format', `expected "${MODEL_FORMAT}", got ${JSON.stringify(json.format)}`);
    return fail();
  }
  if (json.version !== MODEL_VERSION) {
    problems.add('version', `expected ${MODEL_VERSION}, got ${JSON.stringify(json.version)}`);
    return fail();
  }
  if (json.name !== undefined && typeof json.name !== 'string') problems.add('name', 'must be a string');
  const vertices = readVertices(json.vertices, problems);
  const fileField = readFieldSpec(json.field, problems);
  const fieldSpec = options.field ?? fileField;
  const complex = scanned ? readScannedSimplices(scanned, problems) : readSimplices(json.simplices, problems);
  if (!complex || !fieldSpec || problems.any) return fail();
  const field = makeField(fieldSpec);
  const dense = denseIndexer(complex.vertexIds);
  const stalkDims = readStalks(json.stalks, complex, dense, problems);
  if (!stalkDims) return fail();
  const maps = readMaps(json.maps, complex, dense, stalkDims, field, problems);
  if (!maps) return fail();
  checkSheafCondition(complex, stalkDims, maps.restriction, maps.maps, maps.explicit, field, problems);
  if (problems.any) return fail();
  return {
    sheaf: {
      name: json.name as string | undefined,
      fieldSpec,
      field,
      complex,
      stalkDims,
      restriction: maps.restriction,
      maps: maps.maps,
      vertices,
    },
    problems: [],
  };
}

/** As {@link readModel}, throwing a {@link ModelError} on the first problem. */
export function readModelOrThrow(json: unknown, options: ReadOptions = {}): Sheaf<unknown> {
  const r = readModel(json, options);
  if (!r.sheaf) throw new ModelError(r.problems);
  return r.sheaf;
}

function readVertices(raw: unknown, problems: ProblemList): VertexInfo[] | undefined {
  if (raw === undefined) return undefined;
  if (!Array.isArray(raw)) {
    problems.add('vertices', 'must be a list of {"id", "x", "y", "label"}');
    return undefined;
  }
  raw.forEach((v, i) => {
    const where = `vertices[${i}]`;
    if (!isObject(v)) return problems.add(where, 'must be an object');
    if (typeof v.id !== 'number' || !Number.isSafeInteger(v.id) || v.id < 0) problems.add(`${where}.id`, 'must be a non-negative integer');
    for (const axis of ['x', 'y', 'z'] as const) {
      if (v[axis] !== undefined && (typeof v[axis] !== 'number' || !Number.isFinite(v[axis]))) {
        problems.add(`${where}.${axis}`, 'must be a finite number');
      }
    }
    if (v.label !== undefined && typeof v.label !== 'string') problems.add(`${where}.label`, 'must be a string');
  });
  return raw as VertexInfo[];
}
