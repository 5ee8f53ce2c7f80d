import 'fake-indexeddb/auto';
import { describe, expect, test } from 'vitest';
import { getSetting, setSetting } from '../../src/store';
import { freshDb } from './helpers';

describe('settings', () => {
  test('getSetting returns the fallback until a value is set, then the value', async () => {
    const db = freshDb();
    expect(await getSetting(db, 'tolerance', 1e-9)).toBe(1e-9);
    await setSetting(db, 'tolerance', 1e-6);
    expect(await getSetting(db, 'tolerance', 1e-9)).toBe(1e-6);
    await setSetting(db, 'tolerance', 1e-3);
    expect(await getSetting(db, 'tolerance', 1e-9)).toBe(1e-3);
  });

  test('structured values round-trip, and a stored false is not replaced by the fallback', async () => {
    const db = freshDb();
    await setSetting(db, 'solve', { method: 'direct', splitBlocks: false });
    await setSetting(db, 'flag', false);
    expect(await getSetting(db, 'solve', {})).toEqual({ method: 'direct', splitBlocks: false });
    expect(await getSetting(db, 'flag', true)).toBe(false);
  });

  test('an empty key is StoreError invalid', async () => {
    await expect(setSetting(freshDb(), '', 1)).rejects.toMatchObject({ code: 'invalid' });
  });
});
