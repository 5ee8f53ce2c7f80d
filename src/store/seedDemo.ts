import { demoModels } from '../../shared/demo';
import { stamp } from './clock';
import type { GluefieldDb, ProjectRow } from './db';
import { prepareNewModel, type ModelSummary } from './models';
import type { ModelRow, ModelTextRow } from './rows';
import { writeTx } from './transact';

export const DEMO_PROJECT_NAME = 'Demo: ridge line, footbridge and weather ring';

/** Set once the demo has been seeded, so deleting the demo project does not bring it back. */
export const DEMO_SEEDED_KEY = 'demoSeeded';

/** The engine's summary of a model text (typically `cohomology`'s cells and cochainDims). */
export type Summarize = (text: string) => ModelSummary | Promise<ModelSummary>;

/**
 * On a first start (no projects, demo never seeded) create one demo project
 * holding every scenario of `shared/demo`, and return it; otherwise do
 * nothing and return undefined. The check and all writes share one
 * transaction, so two tabs starting at once seed it only once.
 */
export async function seedDemoIfEmpty(db: GluefieldDb, summarize: Summarize): Promise<ProjectRow | undefined> {
  if (!(await isPristine(db))) return undefined;
  const projectId = crypto.randomUUID();
  const prepared: { model: ModelRow; text: ModelTextRow }[] = [];
  // Prepared last-first: models list newest first, so the first scenario ends up on top.
  for (const { key, model } of demoModels().reverse()) {
    const text = JSON.stringify(model, null, 2);
    const summary = await summarize(text);
    prepared.push(await prepareNewModel({ ...summary, projectId, name: model.name ?? key, text, source: 'demo' }));
  }
  const now = stamp();
  const project: ProjectRow = { id: projectId, name: DEMO_PROJECT_NAME, createdAt: now, updatedAt: now };
  return writeTx(db, [db.projects, db.models, db.modelTexts, db.settings], async () => {
    if (!(await isPristine(db))) return undefined;
    await db.projects.add(project);
    await db.models.bulkAdd(prepared.map((p) => p.model));
    await db.modelTexts.bulkAdd(prepared.map((p) => p.text));
    await db.settings.put({ key: DEMO_SEEDED_KEY, value: true });
    return project;
  });
}

async function isPristine(db: GluefieldDb): Promise<boolean> {
  const [projects, seeded] = await Promise.all([db.projects.count(), db.settings.get(DEMO_SEEDED_KEY)]);
  return projects === 0 && !seeded?.value;
}
