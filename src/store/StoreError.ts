/**
 * Why a store call refused or failed:
 * - `invalid`: the input was rejected before anything was written;
 * - `not-found`: a project, model, version or run that does not exist;
 * - `quota`: the browser's storage is full (nothing of the failed write was kept);
 * - `corrupt`: a stored text could not be unpacked.
 */
export type StoreErrorCode = 'invalid' | 'not-found' | 'quota' | 'corrupt';

/** A store call that was refused or failed; the database is unchanged by the failed call. */
export class StoreError extends Error {
  readonly code: StoreErrorCode;
  constructor(code: StoreErrorCode, message: string, options?: { cause?: unknown }) {
    super(message, options);
    this.name = 'StoreError';
    this.code = code;
  }
}
