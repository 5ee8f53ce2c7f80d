import { describe, expect, test } from 'vitest';
import type { PushResponse, SyncedDoc } from '../../shared/sync/types';
import { baseVersionFor, decidePulled, foldPush, syncStateOf, type SyncState } from '../../src/sync/merge';
import type { KnownDoc, OutboxRow, StoredConflict } from '../../src/sync/rows';

const doc = (version: number, deleted = false): SyncedDoc => ({
  docId: 'm1', kind: 'model', version, revision: version, body: { name: 'x' }, uploadId: null, deleted, createdBy: 'u', updatedBy: 'u', updatedAt: '2026-01-01T00:00:00.000Z',
});
const known = (version: number): KnownDoc => ({ kind: 'model', version });

describe('decidePulled: what a pulled document does to the local copy', () => {
  const cases: [string, KnownDoc | undefined, boolean, boolean, SyncedDoc, string][] = [
    ['new to this machine', undefined, false, false, doc(1), 'adopt'],
    ['newer than known', known(1), false, false, doc(2), 'adopt'],
    ['echo of our own push', known(2), false, false, doc(2), 'skip'],
    ['older than known', known(3), false, false, doc(2), 'skip'],
    ['newer but a local change waits', known(1), true, false, doc(2), 'hold'],
    ['newer but in conflict', known(1), false, true, doc(2), 'hold'],
    ['deleted on the server', known(1), false, false, doc(2, true), 'remove'],
    ['deleted on the server while a local change waits', known(1), true, false, doc(2, true), 'hold'],
    ['already held, pending local change', known(2), true, false, doc(2), 'skip'],
  ];
  test.each(cases)('%s', (_, k, pending, conflicted, d, want) => {
    expect(decidePulled(k, pending, conflicted, d).type).toBe(want);
  });
});

describe('syncStateOf', () => {
  const link = (revision: number, serverRevision: number, conflicts = 0) => ({ revision, serverRevision, conflicts: Array.from({ length: conflicts }) as StoredConflict[] });
  const cases: [string, ReturnType<typeof link> | undefined, number, SyncState][] = [
    ['not linked', undefined, 0, 'local'],
    ['nothing to do', link(3, 3), 0, 'in-step'],
    ['changes waiting', link(3, 3), 2, 'ahead'],
    ['server moved on', link(3, 5), 0, 'behind'],
    ['both: ahead first', link(3, 5), 1, 'ahead'],
    ['conflict beats everything', link(3, 5, 1), 1, 'at-odds'],
  ];
  test.each(cases)('%s', (_, l, pending, want) => expect(syncStateOf(l, pending)).toBe(want));
});

describe('baseVersionFor', () => {
  test.each([
    ['a create', {}, undefined, 0],
    ['known version', { m1: known(4) }, undefined, 4],
    ['a resolution chose the base', { m1: known(4) }, 6, 6],
  ] as [string, Record<string, KnownDoc>, number | undefined, number][])('%s', (_, docs, base, want) => {
    expect(baseVersionFor({ docId: 'm1', baseVersion: base }, docs)).toBe(want);
  });
});

describe('foldPush', () => {
  const row = (seq: number, docId: string): OutboxRow => ({ seq, projectId: 'p', docId, kind: 'model', changeId: `c${seq}`, createdAt: 0 });
  const sent = [1, 2].map((seq) => ({
    row: row(seq, `m${seq}`),
    change: { changeId: `c${seq}`, docId: `m${seq}`, kind: 'model' as const, baseVersion: 1, body: { n: seq } },
    summary: { name: `m${seq}`, version: 1, bytes: 1, cells: [1], who: 'you', when: null },
  }));
  test('accepted moves the known version on; a conflict is kept with both sides and nothing is lost', () => {
    const answer: PushResponse = {
      revision: 9,
      accepted: [{ changeId: 'c1', docId: 'm1', version: 2, revision: 8 }],
      conflicts: [{ changeId: 'c2', docId: 'm2', reason: 'stale', server: { ...doc(3), docId: 'm2' } }],
    };
    const out = foldPush({ docs: { m1: known(1), m2: known(1) }, conflicts: [] }, sent, answer, 5);
    expect(out.docs).toEqual({ m1: known(2), m2: known(1) });
    expect(out.done.sort()).toEqual([1, 2]);
    expect(out.conflicts).toHaveLength(1);
    expect(out.conflicts[0]).toMatchObject({ docId: 'm2', reason: 'stale', mine: { body: { n: 2 } }, server: { version: 3 } });
  });
  test('an accepted change clears an older conflict on the same document; a new conflict replaces an old one', () => {
    const old = { docId: 'm1', changeId: 'old' } as StoredConflict;
    const old2 = { docId: 'm2', changeId: 'old2' } as StoredConflict;
    const answer: PushResponse = { revision: 9, accepted: [{ changeId: 'c1', docId: 'm1', version: 2, revision: 8 }], conflicts: [{ changeId: 'c2', docId: 'm2', reason: 'stale', server: null }] };
    const out = foldPush({ docs: {}, conflicts: [old, old2] }, sent, answer, 5);
    expect(out.conflicts.map((c) => c.changeId)).toEqual(['c2']);
  });
});
