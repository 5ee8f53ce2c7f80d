import 'fake-indexeddb/auto';
import { readModel } from '../../shared/engine';
import { openDb, type GluefieldDb, type ModelSummary, type NewModel } from '../../src/store';

/** A database of its own for each test, so tests never see each other's rows. */
export function freshDb(): GluefieldDb {
  return openDb(`gluefield-test-${crypto.randomUUID()}`);
}

/** A small valid model text: a ring of `n` stations, constant sheaf R. */
export function ringText(n = 3, name = 'ring'): string {
  const simplices = Array.from({ length: n }, (_, i) => [i, (i + 1) % n]);
  return JSON.stringify({ format: 'gluefield.sheaf', version: 1, name, simplices });
}

/** The engine's summary of a model text, as the app computes it before saving. */
export function summarize(text: string): ModelSummary {
  const read = readModel(JSON.parse(text));
  if (!read.sheaf) throw new Error(read.problems[0].message);
  const d = read.sheaf.stalkDims;
  return { field: read.sheaf.field.label, cells: d.map((a) => a.length), cochainDims: d.map((a) => a.reduce((x, y) => x + y, 0)) };
}

export function newModel(projectId: string, text = ringText(), name = 'Ring'): NewModel {
  return { projectId, name, text, source: 'model', ...summarize(text) };
}
