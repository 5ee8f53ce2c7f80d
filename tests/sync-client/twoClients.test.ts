import 'fake-indexeddb/auto';
import Dexie from 'dexie';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { ProjectView } from '../../shared/api/types';
import { loadConfig } from '../../server/config';
import { createServer, type GluefieldServer } from '../../server/createServer';
import { createComputeService } from '../../src/compute/computeService';
import { listModels, loadModelText, openDb, renameProject, saveModelVersion, setSetting, type GluefieldDb } from '../../src/store';
import { createApi, getSession, SERVER_KEY, signIn, type Api } from '../../src/sync/api';
import { linkProject, openRemoteProject, settleConflict, syncProject } from '../../src/sync/engine';
import { pendingCount, recordChange, recordProjectRenamed } from '../../src/sync/recordChange';
import { ringText, summarize } from '../store/helpers';

let server: GluefieldServer;
let base: string;
let dir: string;

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'gluefield-sync-client-'));
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

describe('schema 3 → 4', () => {
  test('adds an empty outbox and sync links; existing rows stay', async () => {
    const name = `gluefield-test-${crypto.randomUUID()}`;
    const v3 = new Dexie(name);
    v3.version(3).stores({ projects: 'id, name, updatedAt', models: 'id, projectId, updatedAt', modelTexts: 'id, modelId, [modelId+version]', runs: 'id, modelId, projectId, createdAt', settings: 'key', readings: 'id, modelId, projectId, updatedAt' });
    await v3.table('projects').add({ id: 'p1', name: 'Survey', createdAt: 1, updatedAt: 1 });
    v3.close();
    const db = openDb(name);
    await db.open();
    // Opened at the latest schema (5 adds kit results after 4's sync tables).
    expect(db.verno).toBe(5);
    expect(await db.projects.count()).toBe(1);
    expect(await db.kitResults.count()).toBe(0);
    expect(await db.outbox.count()).toBe(0);
    expect(await db.syncLinks.count()).toBe(0);
    db.close();
  });
});

describe('outbox', () => {
  test('unlinked projects record nothing; edits before a push coalesce; a sent change is not reused', async () => {
    const db = openDb(`gluefield-test-${crypto.randomUUID()}`);
    await db.projects.add({ id: 'p', name: 'P', createdAt: 1, updatedAt: 1 });
    expect(await recordChange(db, 'p', 'm1', 'model')).toBe(false);
    await db.syncLinks.put({ projectId: 'p', remoteId: 'r', role: 'owner', revision: 0, serverRevision: 0, docs: {}, conflicts: [], lastSyncAt: null, lastError: null });
    await recordChange(db, 'p', 'm1', 'model');
    await recordChange(db, 'p', 'm1', 'model');
    expect(await pendingCount(db, 'p')).toBe(1);
    const [row] = await db.outbox.toArray();
    await db.outbox.put({ ...row, sentAt: 5 });
    await recordChange(db, 'p', 'm1', 'model');
    const rows = await db.outbox.toArray();
    expect(rows).toHaveLength(2);
    expect(new Set(rows.map((r) => r.changeId)).size).toBe(2);
  });
});

describe('two clients against the team server', () => {
  test('signed in with the demo accounts, both open the demo project, edit the same model offline, and settle the conflict', async () => {
    const ada = await client('ada@gluefield.local', 'fieldbook-ada-1');
    const ben = await client('ben@gluefield.local', 'fieldbook-ben-1');
    const { projects } = await ada.api.request<{ projects: ProjectView[] }>('GET', '/api/projects');
    const demo = projects[0];
    const pa = await openRemoteProject(ada.db, ada.api, demo);
    const pb = await openRemoteProject(ben.db, ben.api, demo);
    const ma = await listModels(ada.db, pa);
    expect(ma.length).toBeGreaterThan(0);
    expect((await listModels(ben.db, pb)).length).toBe(ma.length);
    const target = ma[0];

    // Both edit the same model (offline: nothing is pushed until they sync).
    const textA = ringText(5, 'ada');
    const textB = ringText(6, 'ben');
    await saveModelVersion(ada.db, target.id, { text: textA, ...summarize(textA) });
    await recordChange(ada.db, pa, target.id, 'model');
    await saveModelVersion(ben.db, target.id, { text: textB, ...summarize(textB) });
    await recordChange(ben.db, pb, target.id, 'model');

    expect((await syncProject(ada.db, ada.api, pa)).pushed).toBe(1);
    const rb = await syncProject(ben.db, ben.api, pb);
    expect(rb.conflicts).toBe(1);
    // Nothing overwritten: ben still has his text, and the conflict shows both sides.
    expect(await loadModelText(ben.db, target.id)).toBe(textB);
    const link = (await ben.db.syncLinks.get(pb))!;
    expect(link.conflicts[0].mineSummary.cells).toEqual([6, 6]);
    expect((link.conflicts[0].server?.body as { cells: number[] }).cells).toEqual([5, 5]);

    // Keep both: ben's content becomes a separate copy, the original takes ada's.
    await settleConflict(ben.db, ben.api, pb, target.id, 'keep-both');
    await syncProject(ben.db, ben.api, pb);
    await syncProject(ada.db, ada.api, pa);
    expect(await loadModelText(ben.db, target.id)).toBe(textA);
    const namesA = (await listModels(ada.db, pa)).map((m) => m.name).sort();
    const namesB = (await listModels(ben.db, pb)).map((m) => m.name).sort();
    expect(namesA).toEqual(namesB);
    expect(namesA.some((n) => n.endsWith('(my copy)'))).toBe(true);
    expect((await ben.db.syncLinks.get(pb))!.conflicts).toHaveLength(0);
    expect(await pendingCount(ben.db, pb)).toBe(0);
  });

  test('keep mine pushes again on the server version; take theirs replaces local; runs sync with provenance', async () => {
    const ada = await client('ada@gluefield.local', 'fieldbook-ada-1');
    await ada.db.projects.add({ id: 'local-1', name: 'Levels', createdAt: 1, updatedAt: 1 });
    const svc = createComputeService(ada.db);
    const text = ringText(4, 'ring');
    const imported = await svc.importFile('local-1', 'ring.sheaf.json', text);
    if (!imported.ok) throw new Error('import failed');
    await linkProject(ada.db, ada.api, 'local-1');
    const link = (await ada.db.syncLinks.get('local-1'))!;
    expect(await pendingCount(ada.db, 'local-1')).toBe(0);
    expect(link.docs[imported.model.id].version).toBe(1);
    await svc.run(imported.model.id, { method: 'morse', field: { kind: 'rational' }, splitBlocks: true });
    expect(await pendingCount(ada.db, 'local-1')).toBe(1);
    await syncProject(ada.db, ada.api, 'local-1');
    expect(await pendingCount(ada.db, 'local-1')).toBe(0);

    // Ben is made an editor and renames; ada renames too: a conflict on the project document.
    const ben = await client('ben@gluefield.local', 'fieldbook-ben-1');
    await ada.api.request('POST', `/api/projects/${link.remoteId}/members`, { email: 'ben@gluefield.local', role: 'editor' });
    const remote = (await ben.api.request<{ projects: ProjectView[] }>('GET', '/api/projects')).projects.find((p) => p.id === link.remoteId)!;
    const pb = await openRemoteProject(ben.db, ben.api, remote);
    expect((await ben.db.runs.where('projectId').equals(pb).count())).toBe(1);
    await renameProject(ben.db, pb, 'Levels (ben)');
    await recordProjectRenamed(ben.db, { id: pb });
    await syncProject(ben.db, ben.api, pb);
    await renameProject(ada.db, 'local-1', 'Levels (ada)');
    await recordProjectRenamed(ada.db, { id: 'local-1' });
    expect((await syncProject(ada.db, ada.api, 'local-1')).conflicts).toBe(1);
    expect((await ada.db.projects.get('local-1'))!.name).toBe('Levels (ada)');
    await settleConflict(ada.db, ada.api, 'local-1', 'project', 'keep-mine');
    expect((await syncProject(ada.db, ada.api, 'local-1')).pushed).toBe(1);
    const listed = (await ada.api.request<{ projects: ProjectView[] }>('GET', '/api/projects')).projects.find((p) => p.id === link.remoteId);
    expect(listed?.name).toBe('Levels (ada)');
    await syncProject(ben.db, ben.api, pb);
    expect((await ben.db.projects.get(pb))!.name).toBe('Levels (ada)');

    // And the other way: ben renames again, ada too; ada takes theirs.
    await renameProject(ben.db, pb, 'Levels final');
    await recordProjectRenamed(ben.db, { id: pb });
    await syncProject(ben.db, ben.api, pb);
    await renameProject(ada.db, 'local-1', 'Levels whatever');
    await recordProjectRenamed(ada.db, { id: 'local-1' });
    await syncProject(ada.db, ada.api, 'local-1');
    await settleConflict(ada.db, ada.api, 'local-1', 'project', 'take-theirs');
    expect((await ada.db.projects.get('local-1'))!.name).toBe('Levels final');
    await syncProject(ada.db, ada.api, 'local-1');
    expect((await ada.db.syncLinks.get('local-1'))!.conflicts).toHaveLength(0);
  });

  test('a large model travels as a gzip upload; an expired access token is refreshed with the rotating refresh token', async () => {
    const ada = await client('ada@gluefield.local', 'fieldbook-ada-1');
    await ada.db.projects.add({ id: 'big', name: 'Big', createdAt: 1, updatedAt: 1 });
    const svc = createComputeService(ada.db);
    const text = ringText(3000, 'big ring');
    expect(text.length).toBeGreaterThan(16 * 1024);
    const imported = await svc.importFile('big', 'big.sheaf.json', text);
    if (!imported.ok) throw new Error('import failed');
    const before = (await getSession(ada.db))!;
    await ada.db.settings.put({ key: 'team.session', value: { ...before, accessToken: 'expired.token.here' } });
    const link = await linkProject(ada.db, ada.api, 'big');
    const after = (await getSession(ada.db))!;
    expect(after.refreshToken).not.toBe(before.refreshToken);
    const pulled = await ada.api.request<{ changes: { docId: string; uploadId: string | null }[] }>('GET', `/api/projects/${link.remoteId}/changes?since=0`);
    expect(pulled.changes.find((c) => c.docId === imported.model.id)?.uploadId).toBeTruthy();
    const ben = await client('admin@gluefield.local', 'fieldbook-admin-1');
    const remote = (await ben.api.request<{ projects: ProjectView[] }>('GET', '/api/projects?scope=all')).projects.find((p) => p.id === link.remoteId)!;
    const pb = await openRemoteProject(ben.db, ben.api, remote);
    expect(await loadModelText(ben.db, imported.model.id)).toBe(text);
    expect(pb).toBe(remote.id);
  });
});
