/**
 * Between local rows and synced documents: build a change's body from the
 * local store, and write a server copy into it. Storage edge; no decisions.
 */
import { readModel } from '../../shared/engine';
import type { ChangeInput, DocKind, SyncedDoc } from '../../shared/sync/types';
import { deleteModel, deleteReadings, deleteRun, loadModelText, packText, renameModel, saveModelVersion, unpackText, type GluefieldDb, type ModelSource, type ReadingsRow, type RunRow } from '../store';
import { prepareNewModel, textId } from '../store/models';
import type { Api } from './api';
import { INLINE_TEXT_LIMIT } from './merge';
import { PROJECT_DOC_ID } from './recordChange';
import type { DocSummary, SyncLinkRow } from './rows';

/** A model document's body. `text` inline for small models, else the change carries an `uploadId` of the gzip text. */
export interface ModelBody {
  name: string;
  field: string;
  cells: number[];
  cochainDims: number[];
  bytes: number;
  hash: string;
  source: ModelSource;
  text?: string;
  /** The demo seed sends the parsed model instead of its text. */
  model?: unknown;
}

/** A readings document's body. `text` inline for small files, else the change carries an `uploadId` of the gzip text. */
export interface ReadingsBody {
  modelId: string;
  name: string;
  count: number;
  bytes: number;
  text?: string;
}

/** The current local content of a document as a change (without id and base), or null when it is gone locally. */
export async function localContent(db: GluefieldDb, api: Api | null, link: SyncLinkRow, docId: string, kind: DocKind): Promise<{ content: Omit<ChangeInput, 'changeId' | 'baseVersion'>; summary: DocSummary } | null> {
  const known = link.docs[docId]?.version ?? null;
  if (kind === 'project') {
    const p = await db.projects.get(link.projectId);
    if (!p) return null;
    return { content: { docId, kind, body: { name: p.name } }, summary: { name: p.name, version: known, bytes: null, cells: null, who: 'you', when: new Date(p.updatedAt).toISOString() } };
  }
  if (kind === 'model') {
    const m = await db.models.get(docId);
    if (!m) return null;
    const summary: DocSummary = { name: m.name, version: known, bytes: m.bytes, cells: m.cells, who: 'you', when: new Date(m.updatedAt).toISOString() };
    const body: ModelBody = { name: m.name, field: m.field, cells: m.cells, cochainDims: m.cochainDims, bytes: m.bytes, hash: m.hash, source: m.source };
    if (m.bytes > INLINE_TEXT_LIMIT && api) {
      const row = await db.modelTexts.get(textId(m.id, m.version));
      if (!row) return null;
      const up = await api.upload(`/api/projects/${link.remoteId}/uploads`, row.packed, `${m.id}.sheaf.json.gz`);
      return { content: { docId, kind, body, uploadId: up.id }, summary };
    }
    body.text = await loadModelText(db, m.id);
    return { content: { docId, kind, body }, summary };
  }
  if (kind === 'run') {
    const r = await db.runs.get(docId);
    if (!r) return null;
    const body = {
      modelId: r.modelId, modelVersion: r.modelVersion, modelHash: r.modelHash, engineVersion: r.engineVersion,
      settings: r.settings, status: r.status, report: r.report ? JSON.parse(JSON.stringify(r.report)) : null, error: r.error ?? null, ms: r.ms, createdAt: r.createdAt,
      provenance: { engineVersion: r.engineVersion, method: r.settings.method, field: r.report?.field ?? JSON.stringify(r.settings.field).slice(0, 50), modelHash: r.modelHash, ranAt: r.createdAt },
    };
    return { content: { docId, kind, body }, summary: { name: `run of ${r.modelId.slice(0, 8)} (${r.status})`, version: known, bytes: null, cells: r.report?.cells ?? null, who: 'you', when: new Date(r.createdAt).toISOString() } };
  }
  if (kind === 'readings') {
    const r = await db.readings.get(docId);
    if (!r) return null;
    const summary: DocSummary = { name: r.name, version: known, bytes: r.bytes, cells: null, who: 'you', when: new Date(r.updatedAt).toISOString() };
    const body: ReadingsBody = { modelId: r.modelId, name: r.name, count: r.count, bytes: r.bytes };
    if (r.bytes > INLINE_TEXT_LIMIT && api) {
      const up = await api.upload(`/api/projects/${link.remoteId}/uploads`, r.packed, `${r.id}.readings.json.gz`);
      return { content: { docId, kind, body, uploadId: up.id }, summary };
    }
    body.text = await unpackText(r.packed);
    return { content: { docId, kind, body }, summary };
  }
  return null;
}

/** What the conflict screen shows of a server copy. */
export function serverSummary(doc: SyncedDoc | null, whoById: (id: string) => string = (id) => id): DocSummary | null {
  if (!doc) return null;
  const b = (doc.body ?? {}) as Partial<ModelBody> & { status?: string };
  if (doc.deleted) return { name: doc.docId, version: doc.version, bytes: null, cells: null, who: whoById(doc.updatedBy), when: doc.updatedAt, deleted: true };
  return {
    name: b.name ?? (doc.kind === 'run' ? `run (${b.status ?? '?'})` : doc.docId),
    version: doc.version,
    bytes: b.bytes ?? null,
    cells: b.cells ?? null,
    who: whoById(doc.updatedBy),
    when: doc.updatedAt,
  };
}

async function modelText(api: Api | null, doc: SyncedDoc): Promise<string | null> {
  const b = (doc.body ?? {}) as Partial<ModelBody> & Partial<ReadingsBody>;
  if (typeof b.text === 'string') return b.text;
  if (b.model !== undefined) return JSON.stringify(b.model);
  if (doc.uploadId && api) return unpackText(await api.download(`/api/uploads/${doc.uploadId}`));
  return null;
}

function summarise(text: string) {
  const read = readModel(JSON.parse(text));
  if (!read.sheaf) throw new Error(read.problems[0]?.message ?? 'invalid model');
  const d = read.sheaf.stalkDims;
  return { field: read.sheaf.field.label, cells: d.map((a) => a.length), cochainDims: d.map((a) => a.reduce((x, y) => x + y, 0)) };
}

/**
 * Write a server copy into the local store under `localId` (default: its
 * own id). Models get a new local text version, so older ones stay in the
 * model's history. Answers false when a run or readings document names a
 * model this machine does not hold (yet: a pull may bring it later).
 */
export async function adoptDoc(db: GluefieldDb, api: Api | null, link: SyncLinkRow, doc: SyncedDoc, localId: string = doc.docId): Promise<boolean> {
  if (doc.kind === 'project') {
    const name = (doc.body as { name?: string } | null)?.name;
    const p = await db.projects.get(link.projectId);
    if (p && name && p.name !== name) await db.projects.put({ ...p, name, updatedAt: Date.now() });
    return true;
  }
  if (doc.kind === 'model') {
    if (doc.deleted) {
      await deleteModel(db, localId);
      return true;
    }
    const text = await modelText(api, doc);
    if (text === null) return true;
    const b = (doc.body ?? {}) as Partial<ModelBody>;
    const s = b.cells && b.cochainDims && b.field ? { field: b.field, cells: b.cells, cochainDims: b.cochainDims } : summarise(text);
    const source: ModelSource = b.source ?? 'model';
    const existing = await db.models.get(localId);
    if (existing) {
      if (existing.hash !== b.hash || b.hash === undefined) await saveModelVersion(db, localId, { text, ...s, source });
      if (b.name && b.name !== existing.name) await renameModel(db, localId, b.name);
      return true;
    }
    const prepared = await prepareNewModel({ projectId: link.projectId, name: b.name ?? doc.docId, text, source, ...s });
    const model = { ...prepared.model, id: localId };
    const row = { ...prepared.text, id: textId(localId, 1), modelId: localId };
    await db.transaction('rw', [db.models, db.modelTexts], async () => {
      await db.models.add(model);
      await db.modelTexts.add(row);
    });
    return true;
  }
  if (doc.kind === 'run') {
    if (doc.deleted) {
      await deleteRun(db, localId);
      return true;
    }
    const b = doc.body as Partial<RunRow> & { report?: RunRow['report'] | null; error?: string | null };
    if (!b?.modelId) return true;
    if (!(await db.models.get(b.modelId))) return false;
    const row: RunRow = {
      id: localId, projectId: link.projectId, modelId: b.modelId, modelVersion: b.modelVersion ?? 0, modelHash: b.modelHash ?? '',
      engineVersion: b.engineVersion ?? '', settings: b.settings as RunRow['settings'], status: b.status ?? 'done', ms: b.ms ?? 0,
      createdAt: typeof b.createdAt === 'number' ? b.createdAt : Date.parse(doc.updatedAt),
      ...(b.report ? { report: b.report } : {}), ...(b.error ? { error: b.error } : {}),
    };
    // Bases and critical cells never travel: keep the ones this machine computed.
    const existing = await db.runs.get(localId);
    await db.runs.put(existing ? { ...existing, ...row } : row);
    return true;
  }
  if (doc.kind === 'readings') {
    if (doc.deleted) {
      await deleteReadings(db, localId);
      return true;
    }
    const b = (doc.body ?? {}) as Partial<ReadingsBody>;
    if (!b.modelId) return true;
    const model = await db.models.get(b.modelId);
    if (!model) return false;
    const text = await modelText(api, doc);
    if (text === null) return true;
    const packed = await packText(text);
    const existing = await db.readings.get(localId);
    const now = Date.now();
    const row: ReadingsRow = {
      id: localId, modelId: model.id, projectId: link.projectId, name: b.name ?? doc.docId, packed, bytes: text.length,
      count: typeof b.count === 'number' ? b.count : 0, createdAt: existing?.createdAt ?? now, updatedAt: now,
    };
    await db.readings.put(row);
    return true;
  }
  return true;
}

/** Keep-both: copy the local document to a new id (a separate copy the user keeps). Returns false when there is nothing to copy. */
export async function copyLocal(db: GluefieldDb, link: SyncLinkRow, docId: string, kind: DocKind, newId: string): Promise<boolean> {
  if (kind === 'model') {
    const m = await db.models.get(docId);
    if (!m) return false;
    const text = await loadModelText(db, docId);
    const prepared = await prepareNewModel({ projectId: link.projectId, name: `${m.name} (my copy)`, text, source: m.source, field: m.field, cells: m.cells, cochainDims: m.cochainDims });
    await db.transaction('rw', [db.models, db.modelTexts], async () => {
      await db.models.add({ ...prepared.model, id: newId });
      await db.modelTexts.add({ ...prepared.text, id: textId(newId, 1), modelId: newId });
    });
    return true;
  }
  if (kind === 'run') {
    const r = await db.runs.get(docId);
    if (!r) return false;
    await db.runs.put({ ...r, id: newId });
    return true;
  }
  if (kind === 'readings') {
    const r = await db.readings.get(docId);
    if (!r) return false;
    await db.readings.put({ ...r, id: newId, name: `${r.name} (my copy)`, updatedAt: Date.now() });
    return true;
  }
  return false;
}

export { PROJECT_DOC_ID };
