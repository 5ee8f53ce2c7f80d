import type { SimplicialComplex } from '../complex/SimplicialComplex';
import { simplexIds } from '../complex/SimplicialComplex';
import type { Field } from '../fields/Field';
import { parseExactValue } from '../fields/exactValue';
import { denseMat, isZeroMat, scalarMat, type Mat } from '../based/Mat';
import type { ProblemList } from './Problem';
import { isObject } from './readField';
import { resolveCell } from './readSimplices';

/** Marks an incidence whose map comes from `maps.default`, resolved at the end. */
const DEFAULT = -2;

export interface ReadMaps<E> {
  restriction: Int32Array[];
  maps: Mat<E>[];
  /** Per dimension, 1 where the map was given explicitly (the sheaf condition is checked around these). */
  explicit: Uint8Array[];
}

/**
 * Resolve every restriction map: explicit entries, then the default.
 * Block ids of zero maps are -1 so that later stages never see empty blocks.
 */
export function readMaps<E>(
  raw: unknown,
  complex: SimplicialComplex,
  dense: (id: number) => number,
  dims: Int32Array[],
  F: Field<E>,
  problems: ProblemList,
): ReadMaps<E> | undefined {
  if (raw !== undefined && !isObject(raw)) {
    problems.add('maps', 'must be an object with "default" and optional "entries"');
    return undefined;
  }
  const def = raw?.default === undefined ? 'identity' : raw.default;
  if (def !== 'identity' && def !== 'zero') {
    problems.add('maps.default', `${JSON.stringify(def)} is not "identity" or "zero"`);
    return undefined;
  }
  const maps: Mat<E>[] = [];
  const identities = new Map<number, number>();
  const identity = (d: number) => {
    let id = identities.get(d);
    if (id === undefined) {
      id = maps.length;
      maps.push(scalarMat(d, F.one));
      identities.set(d, id);
    }
    return id;
  };
  const entries = raw?.entries;
  if (entries !== undefined && !Array.isArray(entries)) {
    problems.add('maps.entries', 'must be a list of {"face", "coface", "matrix" | "scalar"}');
    return undefined;
  }
  const uniform = uniformDim(dims);
  // No entries and one stalk dimension (a constant sheaf): every map is the default block, written once.
  const onlyDefault = uniform >= 0 && (entries === undefined || entries.length === 0);
  const initial = !onlyDefault ? DEFAULT : def === 'zero' || uniform === 0 ? -1 : identity(uniform);
  const restriction: Int32Array[] = [new Int32Array(0)];
  const explicit: Uint8Array[] = [new Uint8Array(0)];
  for (let k = 1; k <= complex.dimension; k++) {
    restriction.push(new Int32Array(complex.faces[k].length).fill(initial));
    explicit.push(new Uint8Array(complex.faces[k].length));
  }
  if (onlyDefault) return { restriction, maps, explicit };

  (entries ?? []).forEach((item: unknown, i: number) => {
    if (problems.full) return;
    // Messages are built only when something is wrong: a large file has one entry per incidence.
    const where = `maps.entries[${i}]`;
    if (!isObject(item)) {
      problems.add(where, 'must be an object {"face", "coface", "matrix" | "scalar"}');
      return;
    }
    const face = resolveCell(complex, dense, item.face, problems, () => `${where}.face`);
    const coface = resolveCell(complex, dense, item.coface, problems, () => `${where}.coface`);
    if (!face || !coface) return;
    const pairText = () => `pair [${(item.face as number[]).join(',')}] ◁ [${(item.coface as number[]).join(',')}]`;
    const k = coface.k;
    const pos = k === face.k + 1 ? oppositePosition(face.dense, coface.dense) : -1;
    if (pos < 0) {
      problems.add(where, `face [${(item.face as number[]).join(',')}] is not a codimension-one face of coface [${(item.coface as number[]).join(',')}]`);
      return;
    }
    const e = coface.index * (k + 1) + pos;
    if (explicit[k][e]) {
      problems.add(where, `${pairText()} is given twice`);
      return;
    }
    explicit[k][e] = 1;
    const rows = dims[k][coface.index];
    const cols = dims[face.k][face.index];
    const hasMatrix = item.matrix !== undefined;
    const hasScalar = item.scalar !== undefined;
    if (hasMatrix === hasScalar) {
      problems.add(where, `${pairText()}: give exactly one of "matrix" or "scalar"`);
      return;
    }
    let mat: Mat<E> | undefined;
    if (hasScalar) {
      if (rows !== cols) {
        problems.add(where, `${pairText()}: a scalar map needs stalks of equal dimension, got ${cols} on the face and ${rows} on the coface`);
        return;
      }
      const v = readEntry(item.scalar, F, problems, () => `${where}.scalar`, pairText);
      if (v === undefined) return;
      mat = scalarMat(rows, v);
    } else {
      mat = readMatrix(item.matrix, rows, cols, F, problems, () => `${where}.matrix`, pairText);
      if (!mat) return;
    }
    if (isZeroMat(F, mat)) {
      restriction[k][e] = -1;
    } else {
      restriction[k][e] = maps.length;
      maps.push(mat);
    }
  });
  if (problems.any) return undefined;

  for (let k = 1; k <= complex.dimension; k++) {
    const r = restriction[k];
    const faces = complex.faces[k];
    const up = dims[k];
    const down = dims[k - 1];
    if (uniform >= 0) {
      // Every stalk has the same dimension: the default is one block for all.
      const id = def === 'zero' || uniform === 0 ? -1 : identity(uniform);
      for (let e = 0; e < r.length; e++) if (r[e] === DEFAULT) r[e] = id;
      continue;
    }
    for (let e = 0; e < r.length; e++) {
      if (r[e] !== DEFAULT) continue;
      const s = (e / (k + 1)) | 0;
      const rows = up[s];
      const cols = down[faces[e]];
      if (def === 'zero' || rows === 0 || cols === 0) {
        if (def === 'identity' && rows !== cols) {
          reportIdentityMismatch(complex, k, s, faces[e], rows, cols, problems);
          if (problems.full) return undefined;
        }
        r[e] = -1;
      } else if (rows !== cols) {
        reportIdentityMismatch(complex, k, s, faces[e], rows, cols, problems);
        if (problems.full) return undefined;
      } else {
        r[e] = identity(rows);
      }
    }
  }
  return problems.any ? undefined : { restriction, maps, explicit };
}

function reportIdentityMismatch(
  complex: SimplicialComplex,
  k: number,
  coface: number,
  face: number,
  rows: number,
  cols: number,
  problems: ProblemList,
): void {
  const f = simplexIds(complex, k - 1, face).join(',');
  const c = simplexIds(complex, k, coface).join(',');
  problems.add(
    'maps.default',
    `"identity" cannot map the stalk of [${f}] (dimension ${cols}) to that of [${c}] (dimension ${rows}); give this pair a matrix in maps.entries`,
  );
}

/** Position i with face = coface minus its i-th vertex, or -1. */
function oppositePosition(face: Int32Array, coface: Int32Array): number {
  let i = 0;
  let j = 0;
  let skipped = -1;
  while (j < coface.length) {
    if (i < face.length && face[i] === coface[j]) {
      i++;
      j++;
    } else if (skipped < 0) {
      skipped = j++;
    } else {
      return -1;
    }
  }
  return i === face.length ? (skipped < 0 ? -1 : skipped) : -1;
}

function readEntry<E>(raw: unknown, F: Field<E>, problems: ProblemList, where: () => string, pair: () => string): E | undefined {
  const small = smallEntry(raw, F);
  if (small !== undefined) return small;
  const v = parseExactValue(raw);
  if (typeof v === 'string') {
    problems.add(where(), `${pair()}: ${v}`);
    return undefined;
  }
  const e = F.fromRatio(v.n, v.d, v.float);
  if (e === undefined) {
    problems.add(where(), `${pair()}: the denominator of ${JSON.stringify(raw)} is not invertible in ${F.label}`);
    return undefined;
  }
  return e;
}

/** Integers of up to 15 digits, as numbers or strings, optionally over such a denominator. */
const SMALL_RATIO = /^\s*([+-]?\d{1,15})\s*(?:\/\s*(\d{1,15})\s*)?$/;

/**
 * The common entries (small integers and fractions) of the number fields,
 * read without big integers; undefined sends everything else, including
 * every entry that needs a message, through the exact reader. The same
 * value results: n/d in GF(p), and the float n/d in the reals.
 */
function smallEntry<E>(raw: unknown, F: Field<E>): E | undefined {
  if (F.kind === 'rational') return undefined;
  let n: number;
  let d = 1;
  if (typeof raw === 'number') {
    if (!Number.isSafeInteger(raw)) return undefined;
    n = raw;
  } else if (typeof raw === 'string') {
    const m = SMALL_RATIO.exec(raw);
    if (!m) return undefined;
    n = Number(m[1]);
    if (m[2] !== undefined) d = Number(m[2]);
  } else return undefined;
  if (d === 0) return undefined;
  if (F.kind === 'real') return (d === 1 ? n : n / d) as E;
  const den = F.fromInt(d);
  if (F.isZero(den)) return undefined;
  return F.mul(F.fromInt(n), F.inv(den));
}

function readMatrix<E>(
  raw: unknown,
  rows: number,
  cols: number,
  F: Field<E>,
  problems: ProblemList,
  where: () => string,
  pair: () => string,
): Mat<E> | undefined {
  const shape = () => `${rows}×${cols} (rows = coface stalk ${rows}, columns = face stalk ${cols})`;
  if (!Array.isArray(raw) || raw.length !== rows) {
    const got = Array.isArray(raw) ? `${raw.length} rows` : 'not a list of rows';
    problems.add(where(), `${pair()}: matrix must be ${shape()}, got ${got}`);
    return undefined;
  }
  const data = F.newVec(rows * cols);
  for (let r = 0; r < rows; r++) {
    const row = raw[r];
    if (!Array.isArray(row) || row.length !== cols) {
      const got = Array.isArray(row) ? `${row.length} entries` : 'not a list';
      problems.add(`${where()}[${r}]`, `${pair()}: row ${r} must have ${cols} entries, got ${got}`);
      return undefined;
    }
    for (let c = 0; c < cols; c++) {
      const v = readEntry(row[c], F, problems, () => `${where()}[${r}][${c}]`, pair);
      if (v === undefined) return undefined;
      data[r * cols + c] = v;
    }
  }
  return denseMat(rows, cols, data);
}

/** The common stalk dimension, or -1 when stalks differ. */
function uniformDim(dims: Int32Array[]): number {
  let d = -1;
  for (const a of dims) {
    for (let i = 0; i < a.length; i++) {
      if (d < 0) d = a[i];
      else if (a[i] !== d) return -1;
    }
  }
  return d;
}
