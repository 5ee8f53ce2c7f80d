import 'fake-indexeddb/auto';
import { describe, expect, test } from 'vitest';
import { createComputeService } from '../../src/compute/computeService';
import { ENGINE_VERSION } from '../../shared/engine';
import { createProject, listKitResults, listModels, listRuns, loadKitInput, loadKitResult, loadModelText, openDb } from '../../src/store';
import { constantTorus } from '../../bench/torusModel';
import { readFileSync } from 'node:fs';
import { importAny } from '../../shared/import';
import { analyseMesh, type MeshReport } from '../../shared/kits';

let n = 0;
const fresh = () => openDb(`compute-test-${n++}`);

describe('the compute service (what the engine worker runs)', () => {
  test('imports a model file, computes it and stores the run with its provenance (torus: Hatcher 2002, 1, 2, 1)', async () => {
    const db = fresh();
    const svc = createComputeService(db);
    const project = await createProject(db, 'Grid survey');
    const phases: string[] = [];
    const imported = await svc.importFile(project.id, 'torus.sheaf.json', JSON.stringify(constantTorus(6, 1, { kind: 'rational' })), (p) => phases.push(p.phase));
    expect(imported.ok).toBe(true);
    if (!imported.ok) return;
    expect(phases).toContain('check');
    const run = await svc.run(imported.model.id, { method: 'morse', field: { kind: 'rational' }, splitBlocks: true });
    expect(run.status).toBe('done');
    expect(run.report?.dims).toEqual([1, 2, 1]);
    expect(run.modelHash).toBe(imported.model.hash);
    expect(run.bases?.map((b) => [b.degree, b.dim])).toEqual([
      [0, 1],
      [1, 2],
    ]);
    // The global section of a constant sheaf on a connected space is constant.
    const h0 = run.bases![0].values[0];
    expect(new Set(h0).size).toBe(1);
    expect(run.critical?.map((c) => c.length)).toEqual([1, 2, 1]);
    expect((await listRuns(db, imported.model.id)).length).toBe(1);
  });

  test('a failed import reports located problems and leaves the saved models untouched', async () => {
    const db = fresh();
    const svc = createComputeService(db);
    const project = await createProject(db, 'Ridge');
    const good = await svc.importFile(project.id, 'ring.sheaf.json', JSON.stringify({ format: 'gluefield.sheaf', version: 1, simplices: [[0, 1], [1, 2], [0, 2]] }));
    expect(good.ok).toBe(true);
    const before = await listModels(db, project.id);
    const bad = await svc.importFile(project.id, 'bad.sheaf.json', JSON.stringify({ format: 'gluefield.sheaf', version: 1, simplices: [[0, 1]], maps: { entries: [{ face: [0], coface: [0, 1], matrix: [[1, 2]] }] } }));
    expect(bad.ok).toBe(false);
    if (bad.ok) return;
    expect(bad.problems[0].message).toContain('[0] ◁ [0,1]');
    const broken = await svc.importFile(project.id, 'broken.json', '{"format": "gluefield.sheaf", ');
    expect(broken.ok).toBe(false);
    expect(await listModels(db, project.id)).toEqual(before);
  });

  test('replacing a model with an invalid version keeps the previous version', async () => {
    const db = fresh();
    const svc = createComputeService(db);
    const project = await createProject(db, 'Frame');
    const text = JSON.stringify({ format: 'gluefield.sheaf', version: 1, simplices: [[0, 1, 2]] });
    const first = await svc.importFile(project.id, 'tri.sheaf.json', text);
    if (!first.ok) throw new Error('import failed');
    const broken = JSON.stringify({ format: 'gluefield.sheaf', version: 1, simplices: [[0, 1, 2]], maps: { entries: [{ face: [0, 1], coface: [0, 1, 2], scalar: 2 }] } });
    const outcome = await svc.replaceModel(first.model.id, 'tri.sheaf.json', broken);
    expect(outcome.ok).toBe(false);
    if (!outcome.ok) expect(outcome.problems[0].message).toMatch(/sheaf condition fails/);
    expect(await loadModelText(db, first.model.id)).toBe(text);
  });

  test('a run in another field records the field it used and flags nothing uncertain on exact data', async () => {
    const db = fresh();
    const svc = createComputeService(db);
    const project = await createProject(db, 'Klein');
    const m = await svc.importFile(project.id, 't.sheaf.json', JSON.stringify(constantTorus(5, 2, { kind: 'rational' })));
    if (!m.ok) throw new Error('import failed');
    const run = await svc.run(m.model.id, { method: 'direct', field: { kind: 'real' }, splitBlocks: false });
    expect(run.report?.field).toBe('real');
    expect(run.report?.dims).toEqual([2, 4, 2]);
    expect(run.report?.numericallyUncertain).toBe(false);
  });

  test('the ledger pages cells with their vertices and stalks, and the sketch lays out a model without positions', async () => {
    const db = fresh();
    const svc = createComputeService(db);
    const project = await createProject(db, 'Pages');
    const m = await svc.importFile(project.id, 't.sheaf.json', JSON.stringify(constantTorus(5, 1, { kind: 'rational' })));
    if (!m.ok) throw new Error('import failed');
    const page = await svc.cells(m.model.id, 1, 70, 10);
    expect(page.map((c) => c.index)).toEqual([70, 71, 72, 73, 74]);
    expect(page.every((c) => c.vertices.length === 2 && c.stalk === 1)).toBe(true);
    const sketch = await svc.sketch(m.model.id);
    expect(sketch.given).toBe(false);
    expect(sketch.positions.length).toBe(50);
    expect(sketch.edges.length).toBe(150);
    expect([...sketch.positions].every((x) => x >= 0 && x <= 1)).toBe(true);
  });

  test('keeps a kit result in a project, reading a picked Blob in the worker', async () => {
    const db = fresh();
    const svc = createComputeService(db);
    const project = await createProject(db, 'Culvert');
    const obj = 'v 0 0 0\nv 1 0 0\nv 0 1 0\nf 1 2 3\n';
    const saved = await svc.saveKitResult({ projectId: project.id, kit: 'mesh', name: 'one triangle', summary: '1 triangle', settings: { field: 'prime:2' }, inputs: [{ name: 'tri.obj', data: new Blob([obj]) }], report: { betti: [1, 0, 0] } });
    expect(saved.engineVersion).toBe(ENGINE_VERSION);
    const opened = await loadKitResult(db, saved.id);
    expect(opened.inputs).toMatchObject([{ name: 'tri.obj', bytes: obj.length }]);
    expect(await loadKitInput(db, saved.id, 0)).toBe(obj);
    expect(opened.report).toEqual({ betti: [1, 0, 0] });
    expect((await listKitResults(db, project.id)).map((r) => r.createdAt)).toEqual([saved.createdAt]);
  });

  test('a mesh report with packed cycles, as the page holds it, is saved with the cycles as lists of vertex ids', async () => {
    const db = fresh();
    const svc = createComputeService(db);
    const project = await createProject(db, 'Culvert');
    const text = readFileSync(new URL('../../shared/kits/demo/culvert-ring.obj', import.meta.url), 'utf8');
    const out = await svc.meshTopology('culvert-ring.obj', text);
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    const saved = await svc.saveKitResult({ projectId: project.id, kit: 'mesh', name: 'ring', summary: 'ring', settings: { field: 'prime:2' }, inputs: [{ name: 'culvert-ring.obj', data: text }], report: out.result.report });
    const opened = await loadKitResult(db, saved.id);
    const imported = importAny('culvert-ring.obj', text);
    if (!('model' in imported)) throw new Error('the demo mesh did not import');
    const direct = analyseMesh(imported.model);
    expect((opened.report as MeshReport).cycles).toEqual(direct.cycles);
    expect((opened.report as MeshReport).cycles.map((c) => c.degree)).toEqual([1, 1, 2]);
  });
});
