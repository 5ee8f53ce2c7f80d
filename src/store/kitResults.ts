import { ENGINE_VERSION } from '../../shared/engine';
import { stamp } from './clock';
import type { GluefieldDb, KitKind, KitResultRow } from './db';
import { prepareText, unpackText } from './pack';
import { touchProject } from './projects';
import { StoreError } from './StoreError';
import { writeTx } from './transact';
import { checkId, checkName } from './validate';

export const KIT_KINDS: readonly KitKind[] = ['levelling', 'frame', 'mesh'];

export interface NewKitResult {
  projectId: string;
  kit: KitKind;
  name: string;
  summary: string;
  settings: Record<string, unknown>;
  /** The files the kit read, as text. */
  inputs: { name: string; text: string }[];
  /** The kit's report (JSON-serialisable). */
  report: unknown;
}

/** A saved kit result with its report unpacked; input texts are unpacked only on request ({@link loadKitInput}), as a mesh can be tens of megabytes. */
export interface OpenedKitResult extends Omit<KitResultRow, 'packedReport' | 'inputs'> {
  report: unknown;
  inputs: { name: string; bytes: number; hash: string }[];
}

/**
 * Keep a kit's input files and report in a project, stamped with the
 * engine version and the time. Packing happens before the transaction
 * (see writeTx). Throws StoreError `invalid` on malformed input and
 * `not-found` when the project is gone.
 */
export async function saveKitResult(db: GluefieldDb, input: NewKitResult): Promise<KitResultRow> {
  checkId(input.projectId, 'project');
  if (!KIT_KINDS.includes(input.kit)) throw new StoreError('invalid', `kit must be one of ${KIT_KINDS.join(', ')}`);
  const name = checkName(input.name, 'kit result');
  if (typeof input.summary !== 'string') throw new StoreError('invalid', 'summary must be a string');
  if (typeof input.settings !== 'object' || input.settings === null) throw new StoreError('invalid', 'settings must be an object');
  if (!Array.isArray(input.inputs) || input.inputs.length === 0) throw new StoreError('invalid', 'a kit result needs the input files it was computed from');
  input.inputs.forEach((f, i) => {
    checkName(f?.name, `input file ${i + 1}`);
    if (typeof f.text !== 'string') throw new StoreError('invalid', `input file ${i + 1} (${f.name}) has no text`);
  });
  const reportText = JSON.stringify(input.report);
  if (reportText === undefined) throw new StoreError('invalid', 'the report must be JSON-serialisable');
  const [report, ...files] = await Promise.all([prepareText(reportText), ...input.inputs.map((f) => prepareText(f.text))]);
  return writeTx(db, [db.projects, db.kitResults], async () => {
    const project = await db.projects.get(input.projectId);
    if (!project) throw new StoreError('not-found', `no project ${input.projectId}`);
    const row: KitResultRow = {
      id: crypto.randomUUID(),
      projectId: input.projectId,
      kit: input.kit,
      name,
      summary: input.summary,
      settings: structuredClone(input.settings),
      inputs: input.inputs.map((f, i) => ({ name: f.name.trim(), packed: files[i].packed, bytes: files[i].bytes, hash: files[i].hash })),
      packedReport: report.packed,
      engineVersion: ENGINE_VERSION,
      createdAt: stamp(),
    };
    await db.kitResults.add(row);
    await touchProject(db, input.projectId, row.createdAt);
    return row;
  });
}

/** A project's saved kit results, newest first, without unpacking them. */
export async function listKitResults(db: GluefieldDb, projectId: string): Promise<Omit<KitResultRow, 'packedReport'>[]> {
  const rows = await db.kitResults.where('projectId').equals(projectId).toArray();
  return rows.sort((a, b) => b.createdAt - a.createdAt).map(({ packedReport: _packed, ...rest }) => rest);
}

/** One saved kit result with its report unpacked. Throws StoreError `not-found`. */
export async function loadKitResult(db: GluefieldDb, id: string): Promise<OpenedKitResult> {
  checkId(id, 'kit result');
  const row = await db.kitResults.get(id);
  if (!row) throw new StoreError('not-found', `no kit result ${id}`);
  const { packedReport, inputs, ...rest } = row;
  return { ...rest, report: JSON.parse(await unpackText(packedReport)), inputs: inputs.map((f) => ({ name: f.name, bytes: f.bytes, hash: f.hash })) };
}

/** The text of input file `index` of a saved kit result. Throws StoreError `not-found`. */
export async function loadKitInput(db: GluefieldDb, id: string, index: number): Promise<string> {
  checkId(id, 'kit result');
  const row = await db.kitResults.get(id);
  const file = row?.inputs[index];
  if (!file) throw new StoreError('not-found', `no input ${index} of kit result ${id}`);
  return unpackText(file.packed);
}

/** Unknown ids are a no-op. */
export async function deleteKitResult(db: GluefieldDb, id: string): Promise<void> {
  checkId(id, 'kit result');
  await writeTx(db, [db.kitResults], () => db.kitResults.delete(id));
}
