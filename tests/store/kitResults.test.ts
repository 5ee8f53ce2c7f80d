import 'fake-indexeddb/auto';
import { describe, expect, test } from 'vitest';
import { ENGINE_VERSION } from '../../shared/engine';
import { createProject, deleteKitResult, deleteProject, getProject, hashText, listKitResults, loadKitInput, loadKitResult, openDb, saveKitResult, StoreError, type NewKitResult } from '../../src/store';

let n = 0;
const fresh = () => openDb(`kit-results-test-${n++}`);
const STATIONS = 'id,height\nA,100\nB,\n';
const LINES = 'from,to,rise,length_km\nA,B,1.5,0.8\n';

function levelling(projectId: string): NewKitResult {
  return {
    projectId,
    kit: 'levelling',
    name: 'ridge line, week 3',
    summary: '2 stations · 1 line · dof 0',
    settings: { standard: 'third', critical: 3.29 },
    inputs: [
      { name: 'stations.csv', text: STATIONS },
      { name: 'lines.csv', text: LINES },
    ],
    report: { heights: { A: 100, B: 101.5 }, dof: 0 },
  };
}

describe('kit results saved into a project', () => {
  test('input files, settings and report round-trip, with the engine version and when', async () => {
    const db = fresh();
    const p = await createProject(db, 'Ridge');
    const before = Date.now();
    const row = await saveKitResult(db, levelling(p.id));
    expect(row.engineVersion).toBe(ENGINE_VERSION);
    expect(row.createdAt).toBeGreaterThanOrEqual(before);
    const opened = await loadKitResult(db, row.id);
    expect(opened).toMatchObject({ kit: 'levelling', name: 'ridge line, week 3', projectId: p.id, settings: { standard: 'third', critical: 3.29 } });
    expect(opened.report).toEqual({ heights: { A: 100, B: 101.5 }, dof: 0 });
    expect(opened.inputs.map((f) => [f.name, f.bytes])).toEqual([
      ['stations.csv', STATIONS.length],
      ['lines.csv', LINES.length],
    ]);
    expect(opened.inputs[1].hash).toBe(await hashText(LINES));
    expect(await loadKitInput(db, row.id, 0)).toBe(STATIONS);
    expect(await loadKitInput(db, row.id, 1)).toBe(LINES);
    await expect(loadKitInput(db, row.id, 2)).rejects.toThrow(/no input 2/);
    // Saving marks the project changed, so the Desk lists it first.
    expect((await getProject(db, p.id))!.updatedAt).toBe(row.createdAt);
  });

  test('listed per project, newest first, without the packed report', async () => {
    const db = fresh();
    const p = await createProject(db, 'Ridge');
    const q = await createProject(db, 'Other');
    const first = await saveKitResult(db, levelling(p.id));
    const second = await saveKitResult(db, { ...levelling(p.id), name: 'second' });
    await saveKitResult(db, { ...levelling(q.id), name: 'elsewhere' });
    const listed = await listKitResults(db, p.id);
    expect(listed.map((r) => r.id)).toEqual([second.id, first.id]);
    expect('packedReport' in listed[0]).toBe(false);
    await deleteKitResult(db, first.id);
    expect((await listKitResults(db, p.id)).map((r) => r.name)).toEqual(['second']);
  });

  test('malformed results and unknown projects are refused before anything is written', async () => {
    const db = fresh();
    const p = await createProject(db, 'Ridge');
    const refused = async (input: NewKitResult, code: string, message: RegExp) => {
      const err = await saveKitResult(db, input).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(StoreError);
      expect((err as StoreError).code).toBe(code);
      expect((err as Error).message).toMatch(message);
    };
    await refused({ ...levelling(p.id), kit: 'sextant' as never }, 'invalid', /kit must be one of levelling, frame, mesh/);
    await refused({ ...levelling(p.id), name: '  ' }, 'invalid', /kit result name must not be empty/);
    await refused({ ...levelling(p.id), inputs: [] }, 'invalid', /needs the input files/);
    await refused({ ...levelling(p.id), inputs: [{ name: 'lines.csv', text: undefined as never }] }, 'invalid', /input file 1 \(lines\.csv\) has no text/);
    await refused(levelling('no-such-project'), 'not-found', /no project no-such-project/);
    expect(await db.kitResults.count()).toBe(0);
  });

  test('deleting the project deletes its kit results', async () => {
    const db = fresh();
    const p = await createProject(db, 'Ridge');
    const q = await createProject(db, 'Other');
    await saveKitResult(db, levelling(p.id));
    const kept = await saveKitResult(db, levelling(q.id));
    await deleteProject(db, p.id);
    expect((await db.kitResults.toArray()).map((r) => r.id)).toEqual([kept.id]);
  });
});
