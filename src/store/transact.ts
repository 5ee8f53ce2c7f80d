import type { Table } from 'dexie';
import type { GluefieldDb } from './db';
import { StoreError } from './StoreError';

/**
 * Run `body` in one read-write transaction over `tables`: every write in it
 * lands, or none does. A full disk becomes StoreError `quota`. `body` must
 * await only Dexie calls (no packing, hashing or timers), or IndexedDB
 * commits early; do that work before calling.
 */
export async function writeTx<T>(db: GluefieldDb, tables: Table[], body: () => Promise<T>): Promise<T> {
  try {
    return await db.transaction('rw', tables, body);
  } catch (e) {
    if (isQuotaError(e)) throw new StoreError('quota', 'the browser has no room left for Gluefield data', { cause: e });
    throw e;
  }
}

function isQuotaError(e: unknown): boolean {
  for (let x = e as { name?: string; inner?: unknown } | undefined; x; x = x.inner as typeof x) {
    if (x.name === 'QuotaExceededError') return true;
  }
  return false;
}
