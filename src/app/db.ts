import { openDb, type GluefieldDb } from '../store';

let db: GluefieldDb | undefined;

/** The page's connection to the local store (the worker opens its own). */
export function appDb(): GluefieldDb {
  return (db ??= openDb());
}
