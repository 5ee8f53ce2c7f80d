/**
 * One sync round for a linked project: push the outbox (changeId +
 * baseVersion), fold the answer, then pull everything since the last
 * revision. The decisions are in ./merge (pure); this file is the edges.
 */
import type { ProjectView } from '../../shared/api/types';
import { resolveConflict } from '../../shared/sync/resolveConflict';
import type { ChangeInput, DocKind, PullResponse, PushResponse, Resolution, SyncedDoc } from '../../shared/sync/types';
import type { GluefieldDb } from '../store';
import type { Api } from './api';
import { adoptDoc, copyLocal, localContent } from './docs';
import { baseVersionFor, decidePulled, foldPush } from './merge';
import { PROJECT_DOC_ID, recordChange } from './recordChange';
import type { DocSummary, OutboxRow, SyncLinkRow } from './rows';

/** Kinds that belong to a model and are adopted only once the model is here. */
const DEPENDENT = new Set<DocKind>(['run', 'readings']);

const newLink = (projectId: string, remote: ProjectView): SyncLinkRow => ({
  projectId, remoteId: remote.id, role: remote.role, revision: 0, serverRevision: remote.revision, docs: {}, conflicts: [], lastSyncAt: null, lastError: null,
});

/** Link a local project to the team server: create it there and queue everything it holds. */
export async function linkProject(db: GluefieldDb, api: Api, projectId: string): Promise<SyncLinkRow> {
  const p = await db.projects.get(projectId);
  if (!p) throw new Error(`no project ${projectId}`);
  const remote = await api.request<ProjectView>('POST', '/api/projects', { name: p.name });
  const link = newLink(projectId, remote);
  await db.syncLinks.put(link);
  await recordChange(db, projectId, PROJECT_DOC_ID, 'project');
  for (const m of await db.models.where('projectId').equals(projectId).toArray()) await recordChange(db, projectId, m.id, 'model');
  for (const r of await db.runs.where('projectId').equals(projectId).toArray()) await recordChange(db, projectId, r.id, 'run');
  for (const r of await db.readings.where('projectId').equals(projectId).toArray()) await recordChange(db, projectId, r.id, 'readings');
  await syncProject(db, api, projectId);
  return (await db.syncLinks.get(projectId))!;
}

/** Bring a team project to this machine (its id is the server's). */
export async function openRemoteProject(db: GluefieldDb, api: Api, remote: ProjectView): Promise<string> {
  const existing = await db.syncLinks.filter((l) => l.remoteId === remote.id).first();
  if (existing) return existing.projectId;
  const now = Date.now();
  await db.transaction('rw', [db.projects, db.syncLinks], async () => {
    if (!(await db.projects.get(remote.id))) await db.projects.add({ id: remote.id, name: remote.name, createdAt: now, updatedAt: now });
    await db.syncLinks.put(newLink(remote.id, remote));
  });
  await syncProject(db, api, remote.id);
  return remote.id;
}

/** Stop syncing a project; the local copy stays. */
export async function unlinkProject(db: GluefieldDb, projectId: string): Promise<void> {
  await db.transaction('rw', [db.syncLinks, db.outbox], async () => {
    await db.outbox.where('projectId').equals(projectId).delete();
    await db.syncLinks.delete(projectId);
  });
}

export interface SyncReport {
  pushed: number;
  conflicts: number;
  pulled: number;
}

async function saveLink(db: GluefieldDb, projectId: string, patch: Partial<SyncLinkRow>): Promise<SyncLinkRow> {
  const cur = await db.syncLinks.get(projectId);
  if (!cur) throw new Error('the project is no longer linked');
  const next = { ...cur, ...patch };
  await db.syncLinks.put(next);
  return next;
}

export async function syncProject(db: GluefieldDb, api: Api, projectId: string): Promise<SyncReport> {
  const report: SyncReport = { pushed: 0, conflicts: 0, pulled: 0 };
  let link = await db.syncLinks.get(projectId);
  if (!link) return report;
  try {
    // Push: one change per document per request (a second edit of one document waits for the first's answer).
    // Viewers read only: their local edits stay on this machine (the server would answer 403).
    for (let round = 0; round < 20 && link.role !== 'viewer'; round++) {
      const rows = await db.outbox.where('projectId').equals(projectId).sortBy('seq');
      if (rows.length === 0) break;
      const first = new Map<string, OutboxRow>();
      for (const r of rows) if (!first.has(r.docId)) first.set(r.docId, r);
      const sent: { row: OutboxRow; change: ChangeInput; summary: DocSummary }[] = [];
      const gone: number[] = [];
      for (const row of [...first.values()].slice(0, 200)) {
        const local = row.deleted ? null : await localContent(db, api, link, row.docId, row.kind);
        const baseVersion = baseVersionFor(row, link.docs);
        if (!local) {
          // Made and deleted here before any push carried it: nothing to tell. Once a push carried it
          // (its answer may have been lost), the deletion goes under the same changeId: a server that
          // took the create answers with it, and the tombstone queued after it follows on that version.
          if (baseVersion === 0 && row.sentAt === undefined) gone.push(row.seq!);
          else sent.push({ row, change: { changeId: row.changeId, docId: row.docId, kind: row.kind, baseVersion, deleted: true }, summary: { name: row.name ?? row.docId, version: baseVersion, bytes: null, cells: null, who: 'you', when: new Date(row.createdAt).toISOString(), deleted: true } });
          continue;
        }
        sent.push({ row, change: { changeId: row.changeId, baseVersion, ...local.content } as ChangeInput, summary: local.summary });
      }
      if (gone.length) await db.outbox.bulkDelete(gone);
      if (sent.length === 0) continue;
      const now = Date.now();
      await db.outbox.bulkPut(sent.map((s) => ({ ...s.row, sentAt: s.row.sentAt ?? now })));
      const answer = await api.request<PushResponse>('POST', `/api/projects/${link.remoteId}/changes`, { changes: sent.map((s) => s.change) });
      const out = foldPush(link, sent, answer, now);
      await db.outbox.bulkDelete(out.done);
      link = await saveLink(db, projectId, { docs: out.docs, conflicts: out.conflicts, serverRevision: answer.revision });
      // The team's project list shows the server project's own name: owners keep it in step with the project document.
      const renamed = sent.find((x) => x.row.kind === 'project' && answer.accepted.some((a) => a.changeId === x.change.changeId));
      const name = (renamed?.change.body as { name?: string } | undefined)?.name;
      if (name && (link.role === 'owner' || link.role === 'admin')) await api.request('PATCH', `/api/projects/${link.remoteId}`, { name }).catch(() => undefined);
      report.pushed += answer.accepted.length;
      report.conflicts += answer.conflicts.length;
    }
    // Pull everything since the last revision. Pull order is revision order, so a run or readings
    // file can arrive before a later version of its model; those wait until their model is here.
    let waiting: SyncedDoc[] = [];
    for (let round = 0; round < 1000; round++) {
      const res = await api.request<PullResponse>('GET', `/api/projects/${link.remoteId}/changes?since=${link.revision}`);
      const pendingDocs = new Set((await db.outbox.where('projectId').equals(projectId).toArray()).map((r) => r.docId));
      const docs = { ...link.docs };
      const conflicts = [...link.conflicts];
      const retry = waiting;
      waiting = [];
      for (const doc of [...res.changes.filter((d) => !DEPENDENT.has(d.kind)), ...retry, ...res.changes.filter((d) => DEPENDENT.has(d.kind))]) {
        const ci = conflicts.findIndex((c) => c.docId === doc.docId);
        const action = decidePulled(docs[doc.docId], pendingDocs.has(doc.docId), ci >= 0, doc);
        if (action.type === 'hold') {
          if (ci >= 0) conflicts[ci] = { ...conflicts[ci], server: doc };
          continue;
        }
        if (action.type === 'skip') continue;
        if (!(await adoptDoc(db, api, link, doc))) {
          waiting.push(doc);
          continue;
        }
        docs[doc.docId] = { kind: doc.kind, version: doc.version };
        report.pulled++;
      }
      // Still waiting at the end: their model was deleted. Known, so they are not asked for again.
      if (!res.more) for (const doc of waiting) docs[doc.docId] = { kind: doc.kind, version: doc.version };
      link = await saveLink(db, projectId, { docs, conflicts, revision: res.revision, serverRevision: res.revision });
      if (!res.more) break;
    }
    link = await saveLink(db, projectId, { lastSyncAt: Date.now(), lastError: null });
  } catch (e) {
    await saveLink(db, projectId, { lastError: (e as Error).message }).catch(() => undefined);
    throw e;
  }
  return report;
}

/** Sync every linked project; failures are kept on each link (lastError), not thrown. */
export async function syncAll(db: GluefieldDb, api: Api): Promise<void> {
  const remote = await api.request<{ projects: ProjectView[] }>('GET', '/api/projects').catch(() => null);
  for (const link of await db.syncLinks.toArray()) {
    const r = remote?.projects.find((p) => p.id === link.remoteId);
    if (r) await saveLink(db, link.projectId, { serverRevision: r.revision, role: r.role });
    await syncProject(db, api, link.projectId).catch(() => undefined);
  }
}

/**
 * Settle a conflict the user looked at, through `resolveConflict`:
 * keep mine queues the local content on top of the server version; take
 * theirs writes the server copy locally; keep both saves the local content
 * as a separate copy (pushed as a new document) and takes the server copy.
 */
export async function settleConflict(db: GluefieldDb, api: Api | null, projectId: string, docId: string, choice: Resolution): Promise<void> {
  const link = await db.syncLinks.get(projectId);
  const c = link?.conflicts.find((x) => x.docId === docId);
  if (!link || !c) return;
  const ids = { changeId: crypto.randomUUID(), docId: crypto.randomUUID() };
  const plan = resolveConflict(c.mine, { changeId: c.changeId, docId: c.docId, reason: c.reason, server: c.server }, choice, ids);
  let docs = { ...link.docs };
  let revision = link.revision;
  // Copy before adopting: adopting overwrites (or deletes) the local document the copy is made from.
  const copies = plan.push.filter((p) => p.docId !== docId);
  for (const p of copies) await copyLocal(db, link, docId, p.kind, p.docId);
  if (plan.adopt) {
    await adoptDoc(db, api, link, plan.adopt);
    docs[docId] = { kind: plan.adopt.kind, version: plan.adopt.version };
    // A model this machine had deleted comes back: its runs and readings were dropped here but stayed
    // on the server, so forget what is known of them and pull from the start to bring them back.
    if (c.mine.deleted && !plan.adopt.deleted && plan.adopt.kind === 'model') {
      docs = Object.fromEntries(Object.entries(docs).filter(([, d]) => !DEPENDENT.has(d.kind)));
      revision = 0;
    }
  }
  await db.transaction('rw', [db.syncLinks, db.outbox], async () => {
    await db.outbox.where('[projectId+docId]').equals([projectId, docId]).delete();
    await db.syncLinks.put({ ...link, docs, revision, conflicts: link.conflicts.filter((x) => x.docId !== docId) });
    for (const p of plan.push) {
      const tombstone = p.deleted ? { deleted: true as const, name: c.mineSummary.name } : {};
      await db.outbox.add({ projectId, docId: p.docId, kind: p.kind, changeId: p.changeId, baseVersion: p.baseVersion, createdAt: Date.now(), ...tombstone });
    }
  });
}
