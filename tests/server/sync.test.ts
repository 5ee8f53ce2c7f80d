import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ChangeInput, PullResponse, PushResponse } from '../../shared/sync';
import { DocumentSchema } from '../../server/db/entities';
import { bearer, makeCrew, startTestServer, type Crew, type TestServer } from './helpers';

let t: TestServer;
let crew: Crew;
beforeAll(async () => {
  t = await startTestServer();
  crew = await makeCrew(t);
});
afterAll(() => t.stop());

let n = 0;
const id = (prefix: string) => `${prefix}-${++n}`;

const readingsText = JSON.stringify({ format: 'gluefield.readings', version: 1, values: [{ cell: [0], value: [1.5] }, { cell: [1], value: ['9/4'], weight: 2 }] });
const readings = { modelId: 'model-1', name: 'week 3', count: 2, bytes: readingsText.length, text: readingsText };
const readingsWith = (patch: Record<string, unknown>) => ({ changes: [{ changeId: `rx-${++n}`, docId: 'rd', kind: 'readings', baseVersion: 0, body: { ...readings, ...patch } }] });

async function push(token: string, changes: ChangeInput[], projectId = crew.projectId): Promise<PushResponse> {
  const res = await request(t.app).post(`/api/projects/${projectId}/changes`).set(bearer(token)).send({ changes });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body;
}

async function pull(token: string, since: number, extra = ''): Promise<PullResponse> {
  const res = await request(t.app).get(`/api/projects/${crew.projectId}/changes?since=${since}${extra}`).set(bearer(token)).expect(200);
  return res.body;
}

describe('push and pull', () => {
  it('accepts new documents, bumping the revision once per change, and pull returns them since a revision', async () => {
    const start = (await pull(crew.viewer.accessToken, 0)).revision;
    const a = id('doc');
    const b = id('doc');
    const res = await push(crew.editor.accessToken, [
      { changeId: id('c'), docId: a, kind: 'model', baseVersion: 0, body: { name: 'Ring' } },
      { changeId: id('c'), docId: b, kind: 'readings', baseVersion: 0, body: readings },
    ]);
    expect(res.revision).toBe(start + 2);
    expect(res.conflicts).toEqual([]);
    expect(res.accepted.map((x) => [x.docId, x.version, x.revision])).toEqual([[a, 1, start + 1], [b, 1, start + 2]]);

    const since = await pull(crew.viewer.accessToken, start);
    expect(since.revision).toBe(start + 2);
    expect(since.more).toBe(false);
    expect(since.changes.map((d) => [d.docId, d.version, d.body])).toEqual([[a, 1, { name: 'Ring' }], [b, 1, readings]]);
    expect(since.changes[0]).toMatchObject({ kind: 'model', deleted: false, createdBy: crew.editor.user.id, updatedBy: crew.editor.user.id });
    expect((await pull(crew.viewer.accessToken, start + 1)).changes.map((d) => d.docId)).toEqual([b]);
    expect((await pull(crew.viewer.accessToken, start + 2)).changes).toEqual([]);
  });

  it('a later edit moves the document to the newest revision; pull shows each document once, as it is now', async () => {
    const doc = id('doc');
    const first = await push(crew.editor.accessToken, [{ changeId: id('c'), docId: doc, kind: 'note', baseVersion: 0, body: 'v1' }]);
    const second = await push(crew.owner.accessToken, [{ changeId: id('c'), docId: doc, kind: 'note', baseVersion: 1, body: 'v2' }]);
    expect(second.accepted[0]).toMatchObject({ version: 2, revision: first.revision + 1 });
    const since = await pull(crew.viewer.accessToken, first.revision - 1);
    expect(since.changes.filter((d) => d.docId === doc)).toEqual([expect.objectContaining({ version: 2, body: 'v2', updatedBy: crew.owner.user.id })]);
  });

  it('deletes keep a tombstone that pull returns', async () => {
    const doc = id('doc');
    await push(crew.editor.accessToken, [{ changeId: id('c'), docId: doc, kind: 'model', baseVersion: 0, body: { name: 'x' } }]);
    const del = await push(crew.editor.accessToken, [{ changeId: id('c'), docId: doc, kind: 'model', baseVersion: 1, deleted: true }]);
    const since = await pull(crew.viewer.accessToken, del.revision - 1);
    expect(since.changes).toEqual([expect.objectContaining({ docId: doc, version: 2, deleted: true, body: null })]);
  });

  it('pages a long pull with limit and more', async () => {
    const start = (await pull(crew.viewer.accessToken, 0)).revision;
    await push(crew.editor.accessToken, Array.from({ length: 7 }, () => ({ changeId: id('c'), docId: id('doc'), kind: 'note' as const, baseVersion: 0, body: n })));
    const seen: string[] = [];
    let since = start;
    for (let page = 0; page < 10; page++) {
      const res = await pull(crew.viewer.accessToken, since, '&limit=3');
      seen.push(...res.changes.map((d) => d.docId));
      since = res.revision;
      if (!res.more) break;
    }
    expect(seen.length).toBe(7);
    expect(new Set(seen).size).toBe(7);
    expect(since).toBe(start + 7);
  });

  it('a client ahead of the server (restored backup) gets everything again', async () => {
    const all = await pull(crew.viewer.accessToken, 0, '&limit=1000');
    const ahead = await pull(crew.viewer.accessToken, all.revision + 100, '&limit=1000');
    expect(ahead.changes.length).toBe(all.changes.length);
  });
});

describe('conflicts', () => {
  it('a stale base is a conflict that returns the server copy and changes nothing', async () => {
    const doc = id('doc');
    await push(crew.editor.accessToken, [{ changeId: id('c'), docId: doc, kind: 'model', baseVersion: 0, body: { name: 'base' } }]);
    const theirs = await push(crew.owner.accessToken, [{ changeId: id('c'), docId: doc, kind: 'model', baseVersion: 1, body: { name: 'theirs' } }]);
    const mine = await push(crew.editor.accessToken, [{ changeId: id('c'), docId: doc, kind: 'model', baseVersion: 1, body: { name: 'mine' } }]);
    expect(mine.accepted).toEqual([]);
    expect(mine.revision).toBe(theirs.revision);
    expect(mine.conflicts).toEqual([expect.objectContaining({ docId: doc, reason: 'stale', server: expect.objectContaining({ version: 2, body: { name: 'theirs' }, updatedBy: crew.owner.user.id }) })]);
    const now = await pull(crew.viewer.accessToken, theirs.revision - 1);
    expect(now.changes.find((d) => d.docId === doc)!.body).toEqual({ name: 'theirs' });
  });

  it('keep-mine after a conflict: re-sent on the server version, it applies', async () => {
    const doc = id('doc');
    await push(crew.editor.accessToken, [{ changeId: id('c'), docId: doc, kind: 'model', baseVersion: 0, body: 1 }]);
    await push(crew.owner.accessToken, [{ changeId: id('c'), docId: doc, kind: 'model', baseVersion: 1, body: 2 }]);
    const conflict = await push(crew.editor.accessToken, [{ changeId: id('c'), docId: doc, kind: 'model', baseVersion: 1, body: 3 }]);
    const resolved = await push(crew.editor.accessToken, [{ changeId: id('c'), docId: doc, kind: 'model', baseVersion: conflict.conflicts[0].server!.version, body: 3 }]);
    expect(resolved.accepted[0].version).toBe(3);
  });

  it('two people making the same edit is no conflict, and makes no new version', async () => {
    const doc = id('doc');
    await push(crew.editor.accessToken, [{ changeId: id('c'), docId: doc, kind: 'note', baseVersion: 0, body: { a: 1, b: 2 } }]);
    const one = await push(crew.owner.accessToken, [{ changeId: id('c'), docId: doc, kind: 'note', baseVersion: 1, body: { a: 1, b: 3 } }]);
    const same = await push(crew.editor.accessToken, [{ changeId: id('c'), docId: doc, kind: 'note', baseVersion: 1, body: { b: 3, a: 1 } }]);
    expect(same.conflicts).toEqual([]);
    expect(same.accepted[0]).toMatchObject({ version: 2, revision: one.revision });
    expect(same.revision).toBe(one.revision);
  });

  it('is logged in the audit trail', async () => {
    const audit = await request(t.app).get(`/api/projects/${crew.projectId}/audit`).set(bearer(crew.viewer.accessToken)).expect(200);
    expect(audit.body.entries.some((e: { action: string; actorName: string }) => e.action === 'change.conflict' && e.actorName === 'The editor')).toBe(true);
  });
});

describe('replaying a change id', () => {
  it('returns the same outcome and applies nothing twice', async () => {
    const doc = id('doc');
    const change: ChangeInput = { changeId: id('c'), docId: doc, kind: 'model', baseVersion: 0, body: { name: 'once' } };
    const first = await push(crew.editor.accessToken, [change]);
    const again = await push(crew.editor.accessToken, [change]);
    const againInBatch = await push(crew.editor.accessToken, [change, change]);
    expect(again.accepted).toEqual(first.accepted);
    expect(againInBatch.accepted).toEqual([first.accepted[0], first.accepted[0]]);
    expect(again.revision).toBe(first.revision);
    const rows = await t.server.dataSource.getRepository(DocumentSchema).find({ select: { version: true }, where: { docId: doc } });
    expect(rows).toEqual([{ version: 1 }]);
  });

  it('a replayed conflict is still a conflict, with the current server copy', async () => {
    const doc = id('doc');
    await push(crew.editor.accessToken, [{ changeId: id('c'), docId: doc, kind: 'note', baseVersion: 0, body: 'a' }]);
    await push(crew.owner.accessToken, [{ changeId: id('c'), docId: doc, kind: 'note', baseVersion: 1, body: 'b' }]);
    const late: ChangeInput = { changeId: id('c'), docId: doc, kind: 'note', baseVersion: 1, body: 'c' };
    const first = await push(crew.editor.accessToken, [late]);
    const again = await push(crew.editor.accessToken, [late]);
    expect(again.conflicts).toEqual(first.conflicts);
  });
});

describe('validation', () => {
  it.each([
    ['no changes', { changes: [] }],
    ['a missing body', { changes: [{ changeId: 'x1', docId: 'd', kind: 'model', baseVersion: 0 }] }],
    ['an unknown kind', { changes: [{ changeId: 'x2', docId: 'd', kind: 'spreadsheet', baseVersion: 0, body: 1 }] }],
    ['a negative base', { changes: [{ changeId: 'x3', docId: 'd', kind: 'model', baseVersion: -1, body: 1 }] }],
    ['an id with spaces', { changes: [{ changeId: 'x 4', docId: 'd', kind: 'model', baseVersion: 0, body: 1 }] }],
    ['a run without provenance', { changes: [{ changeId: 'x5', docId: 'r', kind: 'run', baseVersion: 0, body: { dims: [1, 0] } }] }],
    ['an upload from nowhere', { changes: [{ changeId: 'x6', docId: 'd', kind: 'model', baseVersion: 0, uploadId: '8a0c3a8e-2f52-4f0e-9d0e-2d8f6f1f0b11' }] }],
    ['readings with neither text nor upload', readingsWith({ text: undefined })],
  ])('answers 400 to %s, applying nothing', async (_what, body) => {
    const before = (await pull(crew.viewer.accessToken, 0)).revision;
    const res = await request(t.app).post(`/api/projects/${crew.projectId}/changes`).set(bearer(crew.editor.accessToken)).send(body).expect(400);
    expect(typeof res.body.error).toBe('string');
    expect((await pull(crew.viewer.accessToken, 0)).revision).toBe(before);
  });

  it.each([
    ['no model', { modelId: undefined }, 'changes.0.body.modelId'],
    ['an empty name', { name: '  ' }, 'changes.0.body.name: must not be empty'],
    ['a fractional count', { count: 1.5 }, 'changes.0.body.count'],
    ['text that is not JSON', { text: '{values' }, 'changes.0.body.text: is not JSON'],
    ['another file format', { text: JSON.stringify({ format: 'gluefield.sheaf', version: 1, values: [] }), count: 0 }, 'changes.0.body.text.format: must be "gluefield.readings"'],
    ['a reading without a cell', { text: JSON.stringify({ format: 'gluefield.readings', version: 1, values: [{ value: [1] }] }), count: 1 }, 'changes.0.body.text.values.0.cell'],
    ['a reading with no numbers', { text: JSON.stringify({ format: 'gluefield.readings', version: 1, values: [{ cell: [0], value: [] }] }), count: 1 }, 'changes.0.body.text.values.0.value: must hold at least one number'],
    ['a count that disagrees with the file', { count: 3 }, 'changes.0.body.count: says 3 readings, but the text holds 2'],
  ])('readings with %s answer 400 naming the field', async (_what, patch, message) => {
    const before = (await pull(crew.viewer.accessToken, 0)).revision;
    const res = await request(t.app).post(`/api/projects/${crew.projectId}/changes`).set(bearer(crew.editor.accessToken)).send(readingsWith(patch)).expect(400);
    expect(res.body.error).toContain(message);
    expect((await pull(crew.viewer.accessToken, 0)).revision).toBe(before);
  });

  it('a readings tombstone needs no body', async () => {
    const docId = id('rd');
    const made = await push(crew.editor.accessToken, [{ changeId: id('c'), docId, kind: 'readings', baseVersion: 0, body: readings }]);
    expect(made.accepted).toHaveLength(1);
    const gone = await push(crew.editor.accessToken, [{ changeId: id('c'), docId, kind: 'readings', baseVersion: 1, deleted: true }]);
    expect(gone.accepted[0]).toMatchObject({ docId, version: 2 });
  });

  it('answers 400 to a bad since', async () => {
    await request(t.app).get(`/api/projects/${crew.projectId}/changes?since=-1`).set(bearer(crew.viewer.accessToken)).expect(400);
    await request(t.app).get(`/api/projects/${crew.projectId}/changes?since=abc`).set(bearer(crew.viewer.accessToken)).expect(400);
  });

  it('runs sync with their provenance, and the audit trail says who ran them', async () => {
    const provenance = { engineVersion: '0.1.0', method: 'morse', field: 'rational', modelHash: 'ab'.repeat(32), ranAt: '2026-05-01T10:00:00.000Z' };
    const res = await push(crew.editor.accessToken, [{ changeId: id('c'), docId: id('run'), kind: 'run', baseVersion: 0, body: { provenance, dims: [1, 0] } }]);
    const doc = (await pull(crew.viewer.accessToken, res.revision - 1)).changes[0];
    expect(doc.body).toEqual({ provenance, dims: [1, 0] });
    expect(doc.createdBy).toBe(crew.editor.user.id);
    const audit = await request(t.app).get(`/api/projects/${crew.projectId}/audit?limit=5`).set(bearer(crew.viewer.accessToken)).expect(200);
    expect(audit.body.entries[0]).toMatchObject({ action: 'run.record', actorId: crew.editor.user.id, target: doc.docId });
  });
});

describe('a restart', () => {
  it('keeps every accepted change', async () => {
    const before = await pull(crew.viewer.accessToken, 0, '&limit=1000');
    await t.restart();
    const after = await pull(crew.viewer.accessToken, 0, '&limit=1000');
    expect(after).toEqual(before);
    // Tokens, accounts and memberships survive too, and the revision goes on from where it was.
    const res = await push(crew.editor.accessToken, [{ changeId: id('c'), docId: id('doc'), kind: 'note', baseVersion: 0, body: 'after restart' }]);
    expect(res.accepted[0].revision).toBe(before.revision + 1);
  });
});

describe('concurrent pushes', () => {
  it('to one document: exactly one wins from the same base, the rest are conflicts', async () => {
    const doc = id('doc');
    await push(crew.editor.accessToken, [{ changeId: id('c'), docId: doc, kind: 'note', baseVersion: 0, body: 0 }]);
    const results = await Promise.all(
      Array.from({ length: 20 }, (_, i) => push(i % 2 ? crew.editor.accessToken : crew.owner.accessToken, [{ changeId: id('race'), docId: doc, kind: 'note', baseVersion: 1, body: i + 1 }])),
    );
    expect(results.filter((r) => r.accepted.length === 1)).toHaveLength(1);
    expect(results.filter((r) => r.conflicts.length === 1)).toHaveLength(19);
  });

  it('to many documents: every change lands once, at its own revision', async () => {
    const start = (await pull(crew.viewer.accessToken, 0)).revision;
    const results = await Promise.all(
      Array.from({ length: 20 }, () => push(crew.editor.accessToken, [
        { changeId: id('c'), docId: id('doc'), kind: 'note', baseVersion: 0, body: 'a' },
        { changeId: id('c'), docId: id('doc'), kind: 'note', baseVersion: 0, body: 'b' },
      ])),
    );
    const revisions = results.flatMap((r) => r.accepted.map((a) => a.revision)).sort((a, b) => a - b);
    expect(revisions).toEqual(Array.from({ length: 40 }, (_, i) => start + 1 + i));
  });

  it('answer each push with its own changes, in the order sent, though pushes waiting together share a transaction', async () => {
    const sent = Array.from({ length: 12 }, (_, i) => [
      { changeId: id('own'), docId: id('doc'), kind: 'note' as const, baseVersion: 0, body: `first ${i}` },
      { changeId: id('own'), docId: id('doc'), kind: 'note' as const, baseVersion: 0, body: `second ${i}` },
    ]);
    const results = await Promise.all(sent.map((changes, i) => push(i % 2 ? crew.editor.accessToken : crew.owner.accessToken, changes)));
    results.forEach((r, i) => {
      expect(r.accepted.map((a) => a.changeId)).toEqual(sent[i].map((c) => c.changeId));
      expect(r.accepted[1].revision).toBe(r.accepted[0].revision + 1);
      expect(r.revision).toBeGreaterThanOrEqual(r.accepted[1].revision);
    });
    const audit = await request(t.app).get(`/api/projects/${crew.projectId}/audit?limit=24`).set(bearer(crew.viewer.accessToken)).expect(200);
    const byDoc = new Map(sent.flatMap((changes, i) => changes.map((c) => [c.docId, i % 2 ? crew.editor.user.id : crew.owner.user.id])));
    const created = audit.body.entries.filter((e: { target: string }) => byDoc.has(e.target));
    expect(created).toHaveLength(24);
    for (const e of created) expect(e).toMatchObject({ action: 'document.create', actorId: byDoc.get(e.target) });
  });

  it('the same push sent twice at once (its answer lost, re-sent before the first was done) applies once and answers alike', async () => {
    const doc = id('doc');
    const changes: ChangeInput[] = [{ changeId: id('twice'), docId: doc, kind: 'note', baseVersion: 0, body: 'once' }];
    const [a, b] = await Promise.all([push(crew.editor.accessToken, changes), push(crew.editor.accessToken, changes)]);
    expect(b.accepted).toEqual(a.accepted);
    expect(a.accepted[0].version).toBe(1);
    const rows = await t.server.dataSource.getRepository(DocumentSchema).find({ select: { version: true, body: true }, where: { docId: doc } });
    expect(rows).toEqual([{ version: 1, body: JSON.stringify('once') }]);
  });

  it('two edits of one document in one push apply in order; a concurrent edit from the first base is stale', async () => {
    const doc = id('doc');
    const [mine, theirs] = await Promise.all([
      push(crew.editor.accessToken, [
        { changeId: id('c'), docId: doc, kind: 'note', baseVersion: 0, body: 'v1' },
        { changeId: id('c'), docId: doc, kind: 'note', baseVersion: 1, body: 'v2' },
      ]),
      push(crew.owner.accessToken, [{ changeId: id('c'), docId: doc, kind: 'note', baseVersion: 1, body: 'theirs' }]),
    ]);
    expect(mine.accepted.map((a) => a.version)).toEqual([1, 2]);
    expect(mine.accepted[1].revision).toBe(mine.accepted[0].revision + 1);
    expect(theirs.accepted).toEqual([]);
    expect(theirs.conflicts[0]).toMatchObject({ docId: doc, reason: 'stale', server: { version: 2, body: 'v2' } });
    const pulled = (await pull(crew.viewer.accessToken, mine.accepted[0].revision - 1, '&limit=1000')).changes.filter((d) => d.docId === doc);
    expect(pulled).toMatchObject([{ version: 2, revision: mine.accepted[1].revision, body: 'v2' }]);
  });
});
