import 'fake-indexeddb/auto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { ProjectView } from '../../shared/api/types';
import { loadConfig } from '../../server/config';
import { createServer, type GluefieldServer } from '../../server/createServer';
import {
  deleteModel, deleteReadings, listModels, listReadings, loadModelText, loadReadingsText, openDb, renameModel, saveModelVersion, saveNewModel,
  saveReadings, saveRun, setSetting, updateReadings, type GluefieldDb,
} from '../../src/store';
import { createApi, SERVER_KEY, signIn, type Api } from '../../src/sync/api';
import { linkProject, openRemoteProject, settleConflict, syncProject } from '../../src/sync/engine';
import { pendingCount, recordModelDeleted, recordModelSaved, recordReadingsDeleted, recordReadingsSaved, recordRunSaved } from '../../src/sync/recordChange';
import { newModel, ringText, summarize } from '../store/helpers';

let server: GluefieldServer;
let base: string;
let dir: string;

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'gluefield-sync-docs-'));
  const config = loadConfig({ GLUEFIELD_DB: join(dir, 'db.sqlite'), SMTP_PORT: '0', SMTP_SINK: '1', BCRYPT_ROUNDS: '4', RATE_LIMIT_LOGIN: '1000' });
  server = await createServer(config);
  const { port } = await server.listen(0, '127.0.0.1');
  base = `http://127.0.0.1:${port}`;
});
afterAll(async () => {
  await server?.close();
  rmSync(dir, { recursive: true, force: true });
});

async function client(email: string, password: string): Promise<{ db: GluefieldDb; api: Api }> {
  const db = openDb(`gluefield-test-${crypto.randomUUID()}`);
  await setSetting(db, SERVER_KEY, base);
  const api = createApi(db);
  await signIn(db, api, email, password);
  return { db, api };
}

const readingsText = (values: number[]) =>
  JSON.stringify({ format: 'gluefield.readings', version: 1, values: values.map((v, i) => ({ cell: [i], value: [v] })) });

/** Ada owns a new linked project with one ring model; Ben is an editor with the project on his machine. */
async function sharedProject() {
  const ada = await client('ada@gluefield.local', 'fieldbook-ada-1');
  const ben = await client('ben@gluefield.local', 'fieldbook-ben-1');
  const local = crypto.randomUUID();
  await ada.db.projects.add({ id: local, name: `Shared ${local.slice(0, 6)}`, createdAt: 1, updatedAt: 1 });
  const model = await saveNewModel(ada.db, newModel(local, ringText(4, 'ring'), 'Ring'));
  const link = await linkProject(ada.db, ada.api, local);
  await ada.api.request('POST', `/api/projects/${link.remoteId}/members`, { email: 'ben@gluefield.local', role: 'editor' });
  const remote = (await ben.api.request<{ projects: ProjectView[] }>('GET', '/api/projects')).projects.find((p) => p.id === link.remoteId)!;
  const pb = await openRemoteProject(ben.db, ben.api, remote);
  return { ada, ben, pa: local, pb, model, remoteId: link.remoteId };
}

describe('readings as synced documents', () => {
  test('readings made before linking travel with the project; new, edited and deleted readings reach the other machine', async () => {
    const ada = await client('ada@gluefield.local', 'fieldbook-ada-1');
    await ada.db.projects.add({ id: 'levels', name: 'Levels', createdAt: 1, updatedAt: 1 });
    const model = await saveNewModel(ada.db, newModel('levels', ringText(3, 'ring'), 'Ring'));
    const week1 = await saveReadings(ada.db, { modelId: model.id, name: 'week 1', text: readingsText([1, 2, 3]), count: 3 });
    const link = await linkProject(ada.db, ada.api, 'levels');
    expect(link.docs[week1.id]).toEqual({ kind: 'readings', version: 1 });
    expect(await pendingCount(ada.db, 'levels')).toBe(0);

    const admin = await client('admin@gluefield.local', 'fieldbook-admin-1');
    const remote = (await admin.api.request<{ projects: ProjectView[] }>('GET', '/api/projects?scope=all')).projects.find((p) => p.id === link.remoteId)!;
    const pb = await openRemoteProject(admin.db, admin.api, remote);
    const there = await listReadings(admin.db, model.id);
    expect(there.map((r) => [r.id, r.name, r.count, r.projectId])).toEqual([[week1.id, 'week 1', 3, pb]]);
    expect(await loadReadingsText(admin.db, week1.id)).toBe(readingsText([1, 2, 3]));

    // A second file, and an edit of the first, on ada's side.
    const week2 = await saveReadings(ada.db, { modelId: model.id, name: 'week 2', text: readingsText([4, 5]), count: 2 });
    await recordReadingsSaved(ada.db, week2);
    await recordReadingsSaved(ada.db, await updateReadings(ada.db, week1.id, { name: 'week 1 (checked)', text: readingsText([1, 2, 3.5]), count: 3 }));
    expect((await syncProject(ada.db, ada.api, 'levels')).pushed).toBe(2);
    await syncProject(admin.db, admin.api, pb);
    expect((await listReadings(admin.db, model.id)).map((r) => r.name).sort()).toEqual(['week 1 (checked)', 'week 2']);
    expect(await loadReadingsText(admin.db, week1.id)).toBe(readingsText([1, 2, 3.5]));

    // A deletion is a tombstone the other machine applies.
    await deleteReadings(ada.db, week2.id);
    await recordReadingsDeleted(ada.db, week2);
    expect((await syncProject(ada.db, ada.api, 'levels')).pushed).toBe(1);
    const pulled = await admin.api.request<{ changes: { docId: string; deleted: boolean }[] }>('GET', `/api/projects/${link.remoteId}/changes?since=0`);
    expect(pulled.changes.find((c) => c.docId === week2.id)?.deleted).toBe(true);
    await syncProject(admin.db, admin.api, pb);
    expect((await listReadings(admin.db, model.id)).map((r) => r.name)).toEqual(['week 1 (checked)']);
  });

  test('a large readings file travels as a gzip upload', async () => {
    const { ada, ben, pa, pb, model, remoteId } = await sharedProject();
    const values = Array.from({ length: 3000 }, (_, i) => i / 7);
    const text = JSON.stringify({ format: 'gluefield.readings', version: 1, values: values.map((v) => ({ cell: [0], value: [v] })) });
    expect(text.length).toBeGreaterThan(16 * 1024);
    const big = await saveReadings(ada.db, { modelId: model.id, name: 'logger dump', text, count: values.length });
    await recordReadingsSaved(ada.db, big);
    await syncProject(ada.db, ada.api, pa);
    const pulled = await ben.api.request<{ changes: { docId: string; uploadId: string | null; body: { text?: string } }[] }>('GET', `/api/projects/${remoteId}/changes?since=0`);
    const doc = pulled.changes.find((c) => c.docId === big.id)!;
    expect(doc.uploadId).toBeTruthy();
    expect(doc.body.text).toBeUndefined();
    await syncProject(ben.db, ben.api, pb);
    expect(await loadReadingsText(ben.db, big.id)).toBe(text);
  });

  test('readings (and runs) pulled before a later version of their model are kept once the model arrives', async () => {
    const { ada, pa, model, remoteId } = await sharedProject();
    const r = await saveReadings(ada.db, { modelId: model.id, name: 'week 1', text: readingsText([1]), count: 1 });
    await recordReadingsSaved(ada.db, r);
    const run = await saveRun(ada.db, { modelId: model.id, projectId: pa, modelVersion: 1, modelHash: model.hash, engineVersion: 'test', settings: { method: 'morse', field: { kind: 'rational' }, splitBlocks: true }, status: 'failed', error: 'x', ms: 1 });
    await recordRunSaved(ada.db, run);
    await syncProject(ada.db, ada.api, pa);
    // The model changes after its readings and run: its revision is now above theirs.
    const text = ringText(5, 'ring');
    await recordModelSaved(ada.db, await saveModelVersion(ada.db, model.id, { text, ...summarize(text) }));
    await syncProject(ada.db, ada.api, pa);

    const fresh = await client('ben@gluefield.local', 'fieldbook-ben-1');
    const remote = (await fresh.api.request<{ projects: ProjectView[] }>('GET', '/api/projects')).projects.find((p) => p.id === remoteId)!;
    const pf = await openRemoteProject(fresh.db, fresh.api, remote);
    expect(await loadModelText(fresh.db, model.id)).toBe(text);
    expect((await listReadings(fresh.db, model.id)).map((x) => x.id)).toEqual([r.id]);
    expect(await fresh.db.runs.where('projectId').equals(pf).count()).toBe(1);
  });
});

describe('model renames and deletions', () => {
  test('a rename and a deletion reach the other machine; the deletion takes the model\u2019s runs and readings there too', async () => {
    const { ada, ben, pa, pb, model, remoteId } = await sharedProject();
    const r = await saveReadings(ada.db, { modelId: model.id, name: 'week 1', text: readingsText([1]), count: 1 });
    await recordReadingsSaved(ada.db, r);
    await recordModelSaved(ada.db, await renameModel(ada.db, model.id, 'Ring (north)'));
    expect((await syncProject(ada.db, ada.api, pa)).pushed).toBe(2);
    await syncProject(ben.db, ben.api, pb);
    expect((await listModels(ben.db, pb)).map((m) => [m.name, m.version])).toEqual([['Ring (north)', 1]]);
    expect(await listReadings(ben.db, model.id)).toHaveLength(1);

    await deleteModel(ada.db, model.id);
    await recordModelDeleted(ada.db, model);
    expect((await syncProject(ada.db, ada.api, pa)).pushed).toBe(1);
    const pulled = await ben.api.request<{ changes: { docId: string; deleted: boolean; version: number }[] }>('GET', `/api/projects/${remoteId}/changes?since=0`);
    expect(pulled.changes.find((c) => c.docId === model.id)).toMatchObject({ deleted: true, version: 3 });
    await syncProject(ben.db, ben.api, pb);
    expect(await listModels(ben.db, pb)).toEqual([]);
    expect(await ben.db.readings.where('projectId').equals(pb).count()).toBe(0);
    expect(await pendingCount(ben.db, pb)).toBe(0);
    const audit = await ada.api.request<{ entries: { action: string; target: string }[] }>('GET', `/api/projects/${remoteId}/audit`);
    expect(audit.entries.some((e) => e.action === 'document.delete' && e.target === model.id)).toBe(true);
  });

  test('a model made and deleted before any push sends nothing', async () => {
    const { ada, pa, remoteId } = await sharedProject();
    const before = (await ada.api.request<{ revision: number }>('GET', `/api/projects/${remoteId}/changes?since=0`)).revision;
    const m = await saveNewModel(ada.db, newModel(pa, ringText(3), 'Scratch'));
    await recordModelSaved(ada.db, m);
    await deleteModel(ada.db, m.id);
    await recordModelDeleted(ada.db, m);
    expect(await pendingCount(ada.db, pa)).toBe(1);
    expect((await syncProject(ada.db, ada.api, pa)).pushed).toBe(0);
    expect(await pendingCount(ada.db, pa)).toBe(0);
    expect((await ada.api.request<{ revision: number }>('GET', `/api/projects/${remoteId}/changes?since=0`)).revision).toBe(before);
  });

  test('a model whose create was taken by the server but whose answer was lost is still deleted there', async () => {
    const { ada, pa, remoteId } = await sharedProject();
    const m = await saveNewModel(ada.db, newModel(pa, ringText(3), 'Short-lived'));
    await recordModelSaved(ada.db, m);
    // The push reaches the server, the answer never comes back: the row stays, marked sent.
    const [row] = await ada.db.outbox.where('[projectId+docId]').equals([pa, m.id]).toArray();
    await ada.api.request('POST', `/api/projects/${remoteId}/changes`, { changes: [{ changeId: row.changeId, docId: m.id, kind: 'model', baseVersion: 0, body: { name: m.name, text: ringText(3) } }] });
    await ada.db.outbox.put({ ...row, sentAt: Date.now() });
    await deleteModel(ada.db, m.id);
    await recordModelDeleted(ada.db, m);
    await syncProject(ada.db, ada.api, pa);
    const pulled = await ada.api.request<{ changes: { docId: string; deleted: boolean }[] }>('GET', `/api/projects/${remoteId}/changes?since=0`);
    expect(pulled.changes.find((c) => c.docId === m.id)?.deleted).toBe(true);
    expect(await pendingCount(ada.db, pa)).toBe(0);
  });

  test('deleting a model someone else edited is a conflict; taking theirs brings the model back with its readings', async () => {
    const { ada, ben, pa, pb, model } = await sharedProject();
    const r = await saveReadings(ada.db, { modelId: model.id, name: 'week 1', text: readingsText([1]), count: 1 });
    await recordReadingsSaved(ada.db, r);
    await syncProject(ada.db, ada.api, pa);
    await syncProject(ben.db, ben.api, pb);

    const benText = ringText(7, 'ben edit');
    await recordModelSaved(ben.db, await saveModelVersion(ben.db, model.id, { text: benText, ...summarize(benText) }));
    await syncProject(ben.db, ben.api, pb);
    await deleteModel(ada.db, model.id);
    await recordModelDeleted(ada.db, model);
    const res = await syncProject(ada.db, ada.api, pa);
    expect(res.conflicts).toBe(1);
    const c = (await ada.db.syncLinks.get(pa))!.conflicts[0];
    expect(c.mine.deleted).toBe(true);
    expect(c.mineSummary).toMatchObject({ name: 'Ring', deleted: true });
    expect(c.server).toMatchObject({ deleted: false, version: 2 });
    // Nothing is lost on the server meanwhile.
    await syncProject(ben.db, ben.api, pb);
    expect(await loadModelText(ben.db, model.id)).toBe(benText);

    await settleConflict(ada.db, ada.api, pa, model.id, 'take-theirs');
    expect(await loadModelText(ada.db, model.id)).toBe(benText);
    await syncProject(ada.db, ada.api, pa);
    expect((await listReadings(ada.db, model.id)).map((x) => x.name)).toEqual(['week 1']);
    expect((await ada.db.syncLinks.get(pa))!.conflicts).toEqual([]);
    expect(await pendingCount(ada.db, pa)).toBe(0);
  });

  test('editing a model someone else deleted is a conflict showing the deletion; keeping mine brings it back for everyone', async () => {
    const { ada, ben, pa, pb, model } = await sharedProject();
    await deleteModel(ada.db, model.id);
    await recordModelDeleted(ada.db, model);
    await syncProject(ada.db, ada.api, pa);

    const benText = ringText(6, 'ben edit');
    await recordModelSaved(ben.db, await saveModelVersion(ben.db, model.id, { text: benText, ...summarize(benText) }));
    const res = await syncProject(ben.db, ben.api, pb);
    expect(res.conflicts).toBe(1);
    expect(await loadModelText(ben.db, model.id)).toBe(benText);
    const c = (await ben.db.syncLinks.get(pb))!.conflicts[0];
    expect(c.server).toMatchObject({ deleted: true, version: 2 });

    await settleConflict(ben.db, ben.api, pb, model.id, 'keep-mine');
    expect((await syncProject(ben.db, ben.api, pb)).pushed).toBe(1);
    await syncProject(ada.db, ada.api, pa);
    expect(await loadModelText(ada.db, model.id)).toBe(benText);

    // Now Ada deletes it again and Ben renames it: Ada keeps her deletion, on top of Ben's version.
    await deleteModel(ada.db, model.id);
    await recordModelDeleted(ada.db, model);
    await recordModelSaved(ben.db, await renameModel(ben.db, model.id, 'Ring (kept)'));
    await syncProject(ben.db, ben.api, pb);
    expect((await syncProject(ada.db, ada.api, pa)).conflicts).toBe(1);
    await settleConflict(ada.db, ada.api, pa, model.id, 'keep-mine');
    const [queued] = await ada.db.outbox.where('projectId').equals(pa).toArray();
    expect(queued).toMatchObject({ deleted: true, name: 'Ring', baseVersion: 4 });
    expect((await syncProject(ada.db, ada.api, pa)).pushed).toBe(1);
    await syncProject(ben.db, ben.api, pb);
    expect(await listModels(ben.db, pb)).toEqual([]);
  });

  test('keep both keeps my content in the copy and the server\u2019s in the original', async () => {
    const { ada, ben, pa, pb, model } = await sharedProject();
    const adaText = ringText(5, 'ada');
    const benText = ringText(6, 'ben');
    await recordModelSaved(ada.db, await saveModelVersion(ada.db, model.id, { text: adaText, ...summarize(adaText) }));
    await recordModelSaved(ben.db, await saveModelVersion(ben.db, model.id, { text: benText, ...summarize(benText) }));
    await syncProject(ada.db, ada.api, pa);
    expect((await syncProject(ben.db, ben.api, pb)).conflicts).toBe(1);
    await settleConflict(ben.db, ben.api, pb, model.id, 'keep-both');
    await syncProject(ben.db, ben.api, pb);
    expect(await loadModelText(ben.db, model.id)).toBe(adaText);
    const copy = (await listModels(ben.db, pb)).find((m) => m.id !== model.id)!;
    expect(copy.name).toBe('Ring (my copy)');
    expect(await loadModelText(ben.db, copy.id)).toBe(benText);
    await syncProject(ada.db, ada.api, pa);
    expect(await loadModelText(ada.db, copy.id)).toBe(benText);
  });
});
