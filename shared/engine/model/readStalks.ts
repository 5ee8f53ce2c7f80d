import type { SimplicialComplex } from '../complex/SimplicialComplex';
import type { ProblemList } from './Problem';
import { isObject } from './readField';
import { resolveCell } from './readSimplices';

/** Stalk dimension of every cell: `stalks.default` unless `stalks.cells` overrides it. */
export function readStalks(
  raw: unknown,
  complex: SimplicialComplex,
  dense: (id: number) => number,
  problems: ProblemList,
): Int32Array[] | undefined {
  if (raw !== undefined && !isObject(raw)) {
    problems.add('stalks', 'must be an object with "default" and optional "cells"');
    return undefined;
  }
  const def = raw?.default === undefined ? 1 : raw.default;
  if (!isDim(def)) {
    problems.add('stalks.default', `${JSON.stringify(def)} is not a non-negative integer`);
    return undefined;
  }
  const dims: Int32Array[] = [];
  for (let k = 0; k <= complex.dimension; k++) dims.push(new Int32Array(complex.simplices[k].size).fill(def));
  const cells = raw?.cells;
  if (cells === undefined) return dims;
  if (!Array.isArray(cells)) {
    problems.add('stalks.cells', 'must be a list of {"cell": [...], "dim": n}');
    return undefined;
  }
  // One mark per cell rather than a set of names: a large file overrides many cells.
  const seen = dims.map((d) => new Uint8Array(d.length));
  cells.forEach((c, i) => {
    const where = `stalks.cells[${i}]`;
    if (!isObject(c)) {
      problems.add(where, 'must be an object {"cell": [...], "dim": n}');
      return;
    }
    if (!isDim(c.dim)) {
      problems.add(`${where}.dim`, `${JSON.stringify(c.dim)} is not a non-negative integer`);
      return;
    }
    const ref = resolveCell(complex, dense, c.cell, problems, () => `${where}.cell`);
    if (!ref) return;
    if (seen[ref.k][ref.index]) {
      problems.add(where, `cell [${(c.cell as number[]).join(',')}] is listed twice`);
      return;
    }
    seen[ref.k][ref.index] = 1;
    dims[ref.k][ref.index] = c.dim;
  });
  return dims;
}

function isDim(v: unknown): v is number {
  return typeof v === 'number' && Number.isInteger(v) && v >= 0 && v <= 1_000_000;
}
