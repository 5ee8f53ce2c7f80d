/** A readings file, version 1, as written on disk. */
export interface ReadingsFile {
  format: 'gluefield.readings';
  version: 1;
  name?: string;
  values: { cell: number[]; value: (number | string)[]; weight?: number }[];
}

export const READINGS_FORMAT = 'gluefield.readings';
export const READINGS_VERSION = 1;

/**
 * Validated readings: a vector in the stalk of each of some cells, with a
 * weight. Entry i is cell `cell[i]` of degree `degree[i]`; its values are
 * `value[offset[i] … offset[i+1]]`. Flat typed arrays, in file order.
 */
export interface Readings {
  readonly degree: Int32Array;
  readonly cell: Int32Array;
  readonly offset: Int32Array;
  readonly value: Float64Array;
  readonly weight: Float64Array;
}

/** Number of entries. */
export function readingCount(r: Readings): number {
  return r.cell.length;
}
