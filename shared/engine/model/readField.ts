import { isPrime } from '../fields/primeField';
import { DEFAULT_TOLERANCE } from '../fields/realField';
import type { FieldSpec } from '../fields/FieldSpec';
import type { ProblemList } from './Problem';

const PRIME_LIMIT = 2 ** 31;

/** Validate a `field` object of the model file (absent means rational). */
export function readFieldSpec(raw: unknown, problems: ProblemList, where = 'field'): FieldSpec | undefined {
  if (raw === undefined) return { kind: 'rational' };
  if (!isObject(raw)) {
    problems.add(where, 'must be an object such as {"kind":"rational"}');
    return undefined;
  }
  switch (raw.kind) {
    case 'rational':
      return { kind: 'rational' };
    case 'prime': {
      const p = raw.p;
      if (!checkPrime(p, problems, `${where}.p`)) return undefined;
      return { kind: 'prime', p: p as number };
    }
    case 'real': {
      const t = raw.tolerance === undefined ? DEFAULT_TOLERANCE : raw.tolerance;
      if (typeof t !== 'number' || !(t > 0 && t < 1)) {
        problems.add(`${where}.tolerance`, `${JSON.stringify(t)} must be a number between 0 and 1 (exclusive)`);
        return undefined;
      }
      return { kind: 'real', tolerance: t };
    }
    default:
      problems.add(`${where}.kind`, `${JSON.stringify(raw.kind)} is not one of "rational", "prime", "real"`);
      return undefined;
  }
}

export function checkPrime(p: unknown, problems: ProblemList, where: string): boolean {
  if (typeof p !== 'number' || !Number.isInteger(p)) {
    problems.add(where, `${JSON.stringify(p)} is not an integer`);
    return false;
  }
  if (p >= PRIME_LIMIT) {
    problems.add(where, `${p} is not below 2^31`);
    return false;
  }
  if (!isPrime(p)) {
    problems.add(where, `${p} is not a prime`);
    return false;
  }
  return true;
}

/** Read a command-line field option: `rational`, `real` or `prime:P`. */
export function parseFieldOption(text: string, problems: ProblemList, tolerance?: number): FieldSpec | undefined {
  if (text === 'rational') return { kind: 'rational' };
  if (text === 'real') return { kind: 'real', tolerance: tolerance ?? DEFAULT_TOLERANCE };
  const m = /^prime:(.+)$/.exec(text);
  if (m) {
    const p = /^\d+$/.test(m[1]) ? Number(m[1]) : NaN;
    if (!checkPrime(Number.isNaN(p) ? m[1] : p, problems, '--field')) return undefined;
    return { kind: 'prime', p };
  }
  problems.add('--field', `"${text}" is not one of rational, real, prime:P`);
  return undefined;
}

export function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}
