/** A tolerance for loop misclosures: allowable = c · √K millimetres, K the loop length in kilometres. */
export interface LevellingStandard {
  key: string;
  name: string;
  /** c in millimetres per √km. */
  cMm: number;
  source: string;
}

const FGCC =
  'U.S. Federal Geodetic Control Committee, standards for geodetic control networks (1984), values from memory; defer to local survey regulations';

/** The orders and classes of check-values.md ("Levelling networks"). */
export const LEVELLING_STANDARDS: readonly LevellingStandard[] = [
  { key: 'first-II', name: 'first order, class II', cMm: 4, source: FGCC },
  { key: 'second-I', name: 'second order, class I', cMm: 6, source: FGCC },
  { key: 'second-II', name: 'second order, class II', cMm: 8, source: FGCC },
  { key: 'third', name: 'third order', cMm: 12, source: FGCC },
];

export const DEFAULT_STANDARD_KEY = 'second-II';

/** A listed standard by key, or undefined. */
export function levellingStandard(key: string = DEFAULT_STANDARD_KEY): LevellingStandard | undefined {
  return LEVELLING_STANDARDS.find((s) => s.key === key);
}

/** A project's own tolerance. Throws RangeError unless c is a positive finite number. */
export function customStandard(cMm: number, name = `project tolerance ${cMm} mm √K`): LevellingStandard {
  if (!(cMm > 0) || !Number.isFinite(cMm)) throw new RangeError(`c = ${cMm} mm must be a positive number`);
  return { key: 'custom', name, cMm, source: 'set by the user; defer to local survey regulations' };
}

/** c · √K in millimetres. */
export function allowableMm(standard: LevellingStandard, lengthKm: number): number {
  return standard.cMm * Math.sqrt(lengthKm);
}
