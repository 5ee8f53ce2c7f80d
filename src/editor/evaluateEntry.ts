import { all, create } from 'mathjs';

// Fraction mode keeps "1/3 + 1/6" exact; number mode allows sqrt, sin, pi … for the real field.
const exact = create(all, { number: 'Fraction' });
const approx = create(all, { number: 'number' });

/**
 * Read a matrix entry typed by a person: a number, a fraction, a decimal, or
 * a mathematical expression. Returns the model-file form (an exact string in
 * the rational and prime fields, a number in the real field) or a message.
 */
export function evaluateEntry(text: string, exactField: boolean): { value: string | number } | { error: string } {
  const t = text.trim();
  if (t === '') return { error: 'empty entry' };
  if (/^[+-]?\d+$/.test(t)) return { value: exactField ? t : Number(t) };
  try {
    if (exactField) {
      const v = exact.evaluate(t);
      if (!exact.isFraction(v)) return { error: `"${t}" is not an exact number; use the real field for expressions such as square roots` };
      return { value: exact.format(v, { fraction: 'ratio' }) };
    }
    const v = approx.evaluate(t);
    if (typeof v !== 'number' || !Number.isFinite(v)) return { error: `"${t}" does not evaluate to a finite number` };
    return { value: v };
  } catch (err) {
    return { error: `"${t}": ${(err as Error).message}` };
  }
}
