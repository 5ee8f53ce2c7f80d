import { describe, expect, it } from 'vitest';
import { resolveConflict, type ChangeInput, type ConflictedChange, type SyncedDoc } from '../../shared/sync';

const server: SyncedDoc = {
  docId: 'm1', kind: 'model', version: 5, revision: 12, body: { name: 'theirs' }, uploadId: null, deleted: false,
  createdBy: 'u1', updatedBy: 'u2', updatedAt: '2026-01-01T00:00:00.000Z',
};
const mine: ChangeInput = { changeId: 'c1', docId: 'm1', kind: 'model', baseVersion: 3, body: { name: 'mine' } };
const stale: ConflictedChange = { changeId: 'c1', docId: 'm1', reason: 'stale', server };
const ids = { changeId: 'c2', docId: 'm1-copy' };

describe('resolveConflict', () => {
  it('keep-mine re-sends my content on top of the server version', () => {
    expect(resolveConflict(mine, stale, 'keep-mine', ids)).toEqual({
      push: [{ changeId: 'c2', docId: 'm1', kind: 'model', baseVersion: 5, body: { name: 'mine' } }],
      adopt: null,
    });
  });

  it('take-theirs sends nothing and adopts the server copy', () => {
    expect(resolveConflict(mine, stale, 'take-theirs', ids)).toEqual({ push: [], adopt: server });
  });

  it('keep-both adopts theirs and sends mine as a new document', () => {
    expect(resolveConflict(mine, stale, 'keep-both', ids)).toEqual({
      push: [{ changeId: 'c2', docId: 'm1-copy', kind: 'model', baseVersion: 0, body: { name: 'mine' } }],
      adopt: server,
    });
  });

  it('keep-mine on a document the server does not have creates it', () => {
    const unknown: ConflictedChange = { changeId: 'c1', docId: 'm1', reason: 'unknown-base', server: null };
    expect(resolveConflict(mine, unknown, 'keep-mine', ids).push[0].baseVersion).toBe(0);
  });

  it('keep-mine across a kind mismatch keeps both instead of overwriting', () => {
    const clash: ConflictedChange = { ...stale, reason: 'kind-mismatch', server: { ...server, kind: 'run' } };
    expect(resolveConflict(mine, clash, 'keep-mine', ids).push[0].docId).toBe('m1-copy');
  });

  it('keep-both of my deletion against their edit keeps their edit', () => {
    expect(resolveConflict({ ...mine, body: undefined, deleted: true }, stale, 'keep-both', ids)).toEqual({ push: [], adopt: server });
  });
});
