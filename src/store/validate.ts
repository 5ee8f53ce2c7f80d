import { isPrime, type FieldSpec } from '../../shared/engine';
import type { ModelSource } from './rows';
import { StoreError } from './StoreError';

const MAX_NAME = 200;
const SOURCES: readonly ModelSource[] = ['model', 'csv', 'obj', 'off', 'demo', 'editor'];

function invalid(message: string): never {
  throw new StoreError('invalid', message);
}

/** A display name, trimmed; throws StoreError `invalid` if empty or too long. */
export function checkName(name: unknown, what: string): string {
  if (typeof name !== 'string') invalid(`${what} name must be a string`);
  const trimmed = name.trim();
  if (!trimmed) invalid(`${what} name must not be empty`);
  if (trimmed.length > MAX_NAME) invalid(`${what} name is longer than ${MAX_NAME} characters`);
  return trimmed;
}

export function checkId(id: unknown, what: string): string {
  if (typeof id !== 'string' || !id) invalid(`${what} id must be a non-empty string`);
  return id;
}

export function checkText(text: unknown): string {
  if (typeof text !== 'string' || !text.trim()) invalid('the model text must be a non-empty string');
  return text;
}

export function checkSource(source: unknown): ModelSource {
  if (!SOURCES.includes(source as ModelSource)) invalid(`source must be one of ${SOURCES.join(', ')}`);
  return source as ModelSource;
}

export function checkField(field: unknown): FieldSpec {
  const f = field as { kind?: unknown; p?: unknown; tolerance?: unknown } | null;
  if (typeof f !== 'object' || f === null) invalid('field must be {kind: "rational" | "prime" | "real"}');
  if (f.kind === 'rational') return { kind: 'rational' };
  if (f.kind === 'prime') {
    if (typeof f.p !== 'number' || !Number.isInteger(f.p) || f.p >= 2 ** 31 || !isPrime(f.p)) invalid('field.p must be a prime below 2^31');
    return { kind: 'prime', p: f.p };
  }
  if (f.kind === 'real') {
    if (f.tolerance === undefined) return { kind: 'real' };
    if (typeof f.tolerance !== 'number' || !(f.tolerance > 0) || !Number.isFinite(f.tolerance)) invalid('field.tolerance must be a positive number');
    return { kind: 'real', tolerance: f.tolerance };
  }
  return invalid(`field kind ${JSON.stringify(f.kind)} is not rational, prime or real`);
}

/** A field label as the engine writes it: "rational", "real" or "prime:P" with P a prime below 2^31. */
export function checkFieldLabel(label: unknown): string {
  if (label === 'rational' || label === 'real') return label;
  const m = typeof label === 'string' ? /^prime:(\d{1,10})$/.exec(label) : null;
  const p = m ? Number(m[1]) : NaN;
  if (!m || p >= 2 ** 31 || !isPrime(p)) invalid(`field ${JSON.stringify(label)} is not "rational", "real" or "prime:P" with P a prime below 2^31`);
  return label as string;
}

/** Per-degree counts: equal-length lists of non-negative integers. */
export function checkCounts(cells: unknown, cochainDims: unknown): { cells: number[]; cochainDims: number[] } {
  const isCounts = (v: unknown): v is number[] => Array.isArray(v) && v.every((x) => Number.isSafeInteger(x) && x >= 0);
  if (!isCounts(cells)) invalid('cells must be a list of non-negative integers');
  if (!isCounts(cochainDims)) invalid('cochainDims must be a list of non-negative integers');
  if (cells.length !== cochainDims.length) invalid('cells and cochainDims must have one entry per degree each');
  return { cells: [...cells], cochainDims: [...cochainDims] };
}
