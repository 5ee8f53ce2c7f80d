import type { GluefieldDb } from './db';
import { writeTx } from './transact';
import { StoreError } from './StoreError';

/** The stored value under `key`, or `fallback` when none is stored. */
export async function getSetting<T>(db: GluefieldDb, key: string, fallback: T): Promise<T> {
  const row = await db.settings.get(key);
  return row === undefined ? fallback : (row.value as T);
}

/** Store a structured-cloneable value under `key`, replacing any previous one. */
export async function setSetting(db: GluefieldDb, key: string, value: unknown): Promise<void> {
  if (typeof key !== 'string' || !key) throw new StoreError('invalid', 'a setting key must be a non-empty string');
  await writeTx(db, [db.settings], () => db.settings.put({ key, value }));
}
