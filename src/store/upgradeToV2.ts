import type { Transaction } from 'dexie';
import type { ModelRow, ModelTextRow, RunRow } from './rows';

/**
 * Version 1 → 2: every run gets the `projectId` of its model (so a project's
 * runs are found and deleted by index), every model the `bytes` of its
 * current text. A run whose model is gone keeps its data with
 * `projectId: ''`; nothing is deleted by the upgrade.
 */
export async function upgradeToV2(tx: Transaction): Promise<void> {
  const models = tx.table<ModelRow, string>('models');
  const texts = tx.table<ModelTextRow, string>('modelTexts');
  const runs = tx.table<RunRow, string>('runs');
  const projectOf = new Map<string, string>();
  await models.each((m) => {
    projectOf.set(m.id, m.projectId);
  });
  await runs.toCollection().modify((run) => {
    run.projectId = projectOf.get(run.modelId) ?? '';
  });
  const missing = await models.filter((m) => typeof m.bytes !== 'number').toArray();
  for (const m of missing) {
    const text = await texts.get(`${m.id}@${m.version}`);
    await models.update(m.id, { bytes: text?.bytes ?? 0 });
  }
}
