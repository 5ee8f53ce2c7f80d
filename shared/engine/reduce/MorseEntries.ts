import type { Mat } from '../based/Mat';

/**
 * The Morse coboundary of one degree as a list of blocks between critical
 * cells: `rows[i]` and `cols[i]` are global cell numbers of the round's
 * input (a critical (k+1)-cell and a critical k-cell).
 */
export interface MorseEntries<E> {
  rows: number[];
  cols: number[];
  mats: Mat<E>[];
}
