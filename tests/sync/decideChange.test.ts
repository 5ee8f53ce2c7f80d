import { describe, expect, it } from 'vitest';
import { decideChange, type Decision, type DocHead } from '../../shared/sync';

const doc = (version: number, kind: DocHead['kind'] = 'model', deleted = false): DocHead => ({ kind, version, deleted });

// Optimistic concurrency by version (as in excalidraw's reconcile: the record's version decides, never arrival order).
const CASES: [string, DocHead | null, { kind: DocHead['kind']; baseVersion: number }, boolean, Decision][] = [
  ['a new document applies as version 1', null, { kind: 'model', baseVersion: 0 }, false, { type: 'apply', version: 1 }],
  ['an edit of a version the server never had is a conflict', null, { kind: 'model', baseVersion: 3 }, false, { type: 'conflict', reason: 'unknown-base' }],
  ['an edit of the current version applies as the next', doc(4), { kind: 'model', baseVersion: 4 }, false, { type: 'apply', version: 5 }],
  ['an edit of an older version is stale', doc(4), { kind: 'model', baseVersion: 3 }, false, { type: 'conflict', reason: 'stale' }],
  ['creating a document that already exists is stale', doc(1), { kind: 'model', baseVersion: 0 }, false, { type: 'conflict', reason: 'stale' }],
  ['a base ahead of the server is unknown', doc(2), { kind: 'model', baseVersion: 7 }, false, { type: 'conflict', reason: 'unknown-base' }],
  ['a stale edit identical to the server copy is no conflict', doc(4), { kind: 'model', baseVersion: 2 }, true, { type: 'same', version: 4 }],
  ['re-saving unchanged content makes no new version', doc(4), { kind: 'model', baseVersion: 4 }, true, { type: 'same', version: 4 }],
  ['another kind under the same id is a conflict', doc(1, 'run'), { kind: 'model', baseVersion: 1 }, false, { type: 'conflict', reason: 'kind-mismatch' }],
  ['another kind is a conflict even with equal content', doc(1, 'run'), { kind: 'model', baseVersion: 1 }, true, { type: 'conflict', reason: 'kind-mismatch' }],
  ['a deleted document can be restored from its current version', doc(3, 'model', true), { kind: 'model', baseVersion: 3 }, false, { type: 'apply', version: 4 }],
  ['a deleted document edited from before the deletion is stale', doc(3, 'model', true), { kind: 'model', baseVersion: 2 }, false, { type: 'conflict', reason: 'stale' }],
];

describe('decideChange', () => {
  it.each(CASES)('%s', (_name, server, change, same, expected) => {
    expect(decideChange(server, change, same)).toEqual(expected);
  });

  it('is deterministic: the same inputs give the same decision', () => {
    for (const [, server, change, same] of CASES) expect(decideChange(server, change, same)).toEqual(decideChange(server, change, same));
  });
});
