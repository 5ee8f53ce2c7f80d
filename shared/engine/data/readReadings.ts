import { parseExactValue } from '../fields/exactValue';
import { ProblemList, ModelError, type Problem } from '../model/Problem';
import { isObject } from '../model/readField';
import { denseIndexer } from '../model/readSimplices';
import type { Sheaf } from '../model/Sheaf';
import { READINGS_FORMAT, READINGS_VERSION, type Readings } from './Readings';

export type ReadReadingsResult = { readings: Readings; problems: [] } | { readings: undefined; problems: Problem[] };

/**
 * Validate a parsed readings file against a sheaf: every entry names a
 * cell of the complex (by vertex ids, any order) at most once, gives one
 * number per stalk coordinate and a positive weight (default 1). Never
 * throws on bad input; problems are located as `values[i].cell` and so on.
 */
export function readReadings(json: unknown, sheaf: Sheaf<unknown>): ReadReadingsResult {
  const problems = new ProblemList();
  const fail = (): ReadReadingsResult => ({ readings: undefined, problems: problems.items });
  if (!isObject(json)) {
    problems.add('', 'the readings must be a JSON object');
    return fail();
  }
  if (json.format !== READINGS_FORMAT) {
    problems.add('format', `expected "${READINGS_FORMAT}", got ${JSON.stringify(json.format)}`);
    return fail();
  }
  if (json.version !== READINGS_VERSION) {
    problems.add('version', `expected ${READINGS_VERSION}, got ${JSON.stringify(json.version)}`);
    return fail();
  }
  if (!Array.isArray(json.values)) {
    problems.add('values', 'must be a list of {"cell", "value", "weight"}');
    return fail();
  }
  const cx = sheaf.complex;
  const dense = denseIndexer(cx.vertexIds);
  const seen = cx.simplices.map(() => new Map<number, number>());
  const degree: number[] = [];
  const cell: number[] = [];
  const offset: number[] = [0];
  const value: number[] = [];
  const weight: number[] = [];
  json.values.forEach((entry: unknown, i: number) => {
    if (problems.full) return;
    const where = `values[${i}]`;
    if (!isObject(entry)) return problems.add(where, 'must be an object {"cell", "value", "weight"}');
    const found = findCell(entry.cell, dense, sheaf, `${where}.cell`, problems);
    if (!found) return;
    const [k, c] = found;
    const earlier = seen[k].get(c);
    if (earlier !== undefined) return problems.add(`${where}.cell`, `${JSON.stringify(entry.cell)} already has a reading (values[${earlier}])`);
    const d = sheaf.stalkDims[k][c];
    if (!Array.isArray(entry.value)) return problems.add(`${where}.value`, `must be a list of ${d} number${d === 1 ? '' : 's'}`);
    if (entry.value.length !== d) {
      return problems.add(`${where}.value`, `has ${entry.value.length} entr${entry.value.length === 1 ? 'y' : 'ies'}, but the stalk over ${JSON.stringify(entry.cell)} has dimension ${d}`);
    }
    const nums: number[] = [];
    for (let j = 0; j < d; j++) {
      const parsed = parseExactValue(entry.value[j]);
      if (typeof parsed === 'string') return problems.add(`${where}.value[${j}]`, parsed);
      if (!Number.isFinite(parsed.float)) return problems.add(`${where}.value[${j}]`, 'is too large for a double');
      nums.push(parsed.float);
    }
    let w = 1;
    if (entry.weight !== undefined) {
      if (typeof entry.weight !== 'number' || !Number.isFinite(entry.weight) || entry.weight <= 0) {
        return problems.add(`${where}.weight`, `${JSON.stringify(entry.weight)} must be a positive number`);
      }
      w = entry.weight;
    }
    seen[k].set(c, i);
    degree.push(k);
    cell.push(c);
    value.push(...nums);
    offset.push(value.length);
    weight.push(w);
  });
  if (problems.any) return fail();
  return {
    readings: {
      degree: Int32Array.from(degree),
      cell: Int32Array.from(cell),
      offset: Int32Array.from(offset),
      value: Float64Array.from(value),
      weight: Float64Array.from(weight),
    },
    problems: [],
  };
}

/** As {@link readReadings}, throwing a {@link ModelError} with every problem. */
export function readReadingsOrThrow(json: unknown, sheaf: Sheaf<unknown>): Readings {
  const r = readReadings(json, sheaf);
  if (!r.readings) throw new ModelError(r.problems);
  return r.readings;
}

function findCell(raw: unknown, dense: (id: number) => number, sheaf: Sheaf<unknown>, where: string, problems: ProblemList): [number, number] | undefined {
  if (!Array.isArray(raw) || raw.length === 0) {
    problems.add(where, 'must be a non-empty list of vertex ids');
    return undefined;
  }
  const verts: number[] = [];
  for (const id of raw) {
    if (typeof id !== 'number' || !Number.isSafeInteger(id) || id < 0) {
      problems.add(where, `${JSON.stringify(id)} is not a non-negative integer vertex id`);
      return undefined;
    }
    const v = dense(id);
    if (v < 0) {
      problems.add(where, `vertex ${id} is not in the complex`);
      return undefined;
    }
    verts.push(v);
  }
  verts.sort((a, b) => a - b);
  for (let i = 1; i < verts.length; i++) {
    if (verts[i] === verts[i - 1]) {
      problems.add(where, `${JSON.stringify(raw)} repeats a vertex`);
      return undefined;
    }
  }
  const k = verts.length - 1;
  const table = sheaf.complex.simplices[k];
  const c = table ? table.find(Int32Array.from(verts), 0) : -1;
  if (c < 0) {
    problems.add(where, `${JSON.stringify(raw)} is not a cell of the complex`);
    return undefined;
  }
  return [k, c];
}
