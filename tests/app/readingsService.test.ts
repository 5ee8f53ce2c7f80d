import 'fake-indexeddb/auto';
import { describe, expect, test } from 'vitest';
import { readingsCommand } from '../../cli/kitCommands';
import { createComputeService } from '../../src/compute/computeService';
import { consistencyRadius, laplacianSpectrum, nearestSection, readModelOrThrow, readReadingsOrThrow } from '../../shared/engine';
import { ridgeLineRing, weatherStationReadings, weatherStationRing, weatherStationRingConsistent } from '../../shared/demo';
import { createProject, listReadings, openDb } from '../../src/store';

let n = 0;
const fresh = () => openDb(`readings-service-test-${n++}`);

async function setUp(model: object) {
  const db = fresh();
  const svc = createComputeService(db);
  const project = await createProject(db, 'Readings');
  const imported = await svc.importFile(project.id, 'model.sheaf.json', JSON.stringify(model));
  if (!imported.ok) throw new Error(JSON.stringify(imported.problems));
  return { db, svc, modelId: imported.model.id };
}

/** Ridge line stations 0, 1, 2 read 10 m; links 0-1 and 1-2 read 10.3 and 10.1 (identity maps, stalk R). */
const RIDGE_CSV = 'cell,value,weight\n0,10\n1,10\n2,10\n0-1,10.3\n1-2,10.1\n';

describe('the readings check in the compute service (what the worker runs)', () => {
  test('equals the engine and the command line on the same model and readings (the invented weather station ring)', async () => {
    for (const model of [weatherStationRingConsistent(), weatherStationRing()]) {
      const { svc, modelId } = await setUp(model);
      const file = weatherStationReadings();
      const saved = await svc.importReadings(modelId, 'wind.json', JSON.stringify(file));
      if (!saved.ok) throw new Error(JSON.stringify(saved.problems));
      expect(saved.readings.count).toBe(12);
      expect(saved.readings.name).toBe('Wind, week 3 (invented)');
      const phases: string[] = [];
      const outcome = await svc.checkReadings(modelId, saved.readings.id, (p) => phases.push(p.phase));
      if (!outcome.ok) throw new Error(JSON.stringify(outcome.problems));
      const check = outcome.check;
      expect(phases).toEqual(['read', 'radius', 'section', 'spectrum', 'done']);

      const sheaf = readModelOrThrow(model);
      const readings = readReadingsOrThrow(file, sheaf);
      const radius = consistencyRadius(sheaf, readings, { worst: 100 });
      const fit = nearestSection(sheaf, readings);
      const spectrum = laplacianSpectrum(sheaf, 0, 4);
      expect(check.radius).toEqual({ max: radius.max, rms: radius.rms, pairs: radius.pairs });
      expect(check.worst.map((p) => ({ face: p.face.ids, coface: p.coface.ids, mismatch: p.mismatch }))).toEqual(radius.worst);
      expect(check.cells.map((c) => c.norm)).toEqual(Array.from(fit.residualNorm));
      expect(check.cells.flatMap((c) => c.fitted)).toEqual(Array.from(fit.fitted));
      expect(check.section).toEqual({ dimH0: fit.dimH0, determined: fit.determined, weightedRms: fit.weightedRms });
      expect(check.spectrum).toEqual({ values: spectrum.values, harmonicDimension: spectrum.harmonicDimension, converged: spectrum.converged, scale: spectrum.scale });

      // The command line (`gluefield readings`) reads the same files along its own path.
      const cli = readingsCommand(model, file, undefined) as { consistency: { max: number; rms: number; worst: { face: number[] }[] }; nearestSection: { weightedRms: number; readings: { residual: number }[] } };
      expect(check.radius.max).toBeCloseTo(cli.consistency.max, 12);
      expect(check.radius.rms).toBeCloseTo(cli.consistency.rms, 12);
      expect(check.worst[0].face.ids).toEqual(cli.consistency.worst[0].face);
      expect(check.section.weightedRms).toBeCloseTo(cli.nearestSection.weightedRms, 12);
      check.cells.forEach((c, i) => expect(c.norm).toBeCloseTo(cli.nearestSection.readings[i].residual, 12));

      // The miswired station WS-04 (vertex 3) is the face of the worst pair on both rings.
      expect(check.worst[0].face).toMatchObject({ degree: 0, ids: [3], labels: ['WS-04'] });
      if (check.section.dimH0 > 0) {
        // On the consistent ring it also has the largest residual against the fitted wind.
        const largest = check.cells.reduce((a, b) => (b.norm > a.norm ? b : a));
        expect(largest.cell).toMatchObject({ degree: 0, index: 3, labels: ['WS-04'] });
      } else {
        // H^0 = 0 on the misclosed ring: the only global section is zero, so each residual is the reading itself.
        for (const c of check.cells) expect(c.norm).toBeCloseTo(Math.hypot(...c.reading), 12);
      }
    }
  });

  test('a hand-checkable ring (constant sheaf R): radius 0.3, RMS √0.05, nearest section the mean 10.08 (hand computation)', async () => {
    const { svc, modelId, db } = await setUp(ridgeLineRing());
    const saved = await svc.importReadings(modelId, 'heights.csv', RIDGE_CSV);
    if (!saved.ok) throw new Error(JSON.stringify(saved.problems));
    expect(saved.readings.name).toBe('heights');
    expect((await listReadings(db, modelId)).map((r) => r.count)).toEqual([5]);
    const outcome = await svc.checkReadings(modelId, saved.readings.id);
    if (!outcome.ok) throw new Error('check failed');
    const c = outcome.check;
    // Pairs: 0<01, 1<01 mismatch 0.3; 1<12, 2<12 mismatch 0.1. RMS = √((2·0.09 + 2·0.01)/4) = √0.05.
    expect(c.radius.pairs).toBe(4);
    expect(c.radius.max).toBeCloseTo(0.3, 12);
    expect(c.radius.rms).toBeCloseTo(Math.sqrt(0.05), 12);
    expect(c.worst.slice(0, 2).map((p) => `${p.face.ids}<${p.coface.ids}`)).toEqual(['0<0,1', '1<0,1']);
    expect(c.worst[0].coface).toMatchObject({ degree: 1, index: 0, labels: ['RL-01', 'RL-02'] });
    // Connected constant sheaf: the nearest section is the mean of the five readings, (30 + 10.3 + 10.1)/5 = 10.08.
    for (const cell of c.cells) expect(cell.fitted[0]).toBeCloseTo(10.08, 12);
    expect(c.cells.map((x) => Number(x.norm.toFixed(10)))).toEqual([0.08, 0.08, 0.08, 0.22, 0.02]);
    // Graph Laplacian of a connected graph: one zero eigenvalue (common practice).
    expect(c.spectrum).toMatchObject({ harmonicDimension: 1 });
  });

  test('the Laplacian spectrum tells the rings apart: zero twice on the consistent ring, positive on the misclosed one (Hansen–Ghrist 2019)', async () => {
    const file = JSON.stringify(weatherStationReadings());
    const smallest: number[] = [];
    for (const model of [weatherStationRingConsistent(), weatherStationRing()]) {
      const { svc, modelId } = await setUp(model);
      const saved = await svc.importReadings(modelId, 'wind.json', file);
      if (!saved.ok) throw new Error('import failed');
      const outcome = await svc.checkReadings(modelId, saved.readings.id);
      if (!outcome.ok || 'skipped' in outcome.check.spectrum) throw new Error('no spectrum');
      smallest.push(outcome.check.spectrum.values[0]);
      expect(outcome.check.spectrum.harmonicDimension).toBe(model.name!.includes('consistent') ? 2 : 0);
    }
    expect(Math.abs(smallest[0])).toBeLessThan(1e-12);
    expect(smallest[1]).toBeGreaterThan(1e-5);
  });

  test('a bad readings file saves nothing and leaves the saved readings as they were', async () => {
    const { svc, modelId, db } = await setUp(ridgeLineRing());
    const first = await svc.importReadings(modelId, 'heights.csv', RIDGE_CSV);
    expect(first.ok).toBe(true);
    const before = await listReadings(db, modelId);
    const bad = await svc.importReadings(modelId, 'bad.csv', 'cell,value\n0,10\n0-5,1\n');
    expect(bad).toEqual({ ok: false, problems: [{ where: 'line 3, cell 0-5', message: '[0,5] is not a cell of the complex' }] });
    expect(await svc.importReadings(modelId, 'bad.json', '{')).toMatchObject({ ok: false });
    expect(await listReadings(db, modelId)).toEqual(before);
  });

  test('readings that no longer fit an edited model are refused by the check with located problems', async () => {
    const { svc, modelId } = await setUp(ridgeLineRing());
    const saved = await svc.importReadings(modelId, 'heights.csv', RIDGE_CSV);
    if (!saved.ok) throw new Error('import failed');
    const edited = { ...ridgeLineRing(), simplices: [[0, 1], [1, 3]] };
    const replaced = await svc.replaceModel(modelId, 'model.sheaf.json', JSON.stringify(edited));
    expect(replaced.ok).toBe(true);
    const outcome = await svc.checkReadings(modelId, saved.readings.id);
    expect(outcome.ok).toBe(false);
    if (outcome.ok) return;
    expect(outcome.problems.map((p) => p.where)).toEqual(['values[2].cell', 'values[4].cell']);
  });

  test('the sample file lists the model’s cells with zeros of the right size and imports as it is', async () => {
    const { svc, modelId } = await setUp(weatherStationRingConsistent());
    const sample = await svc.readingsSample(modelId);
    expect(sample.split('\n').slice(0, 3)).toEqual(['cell,value,weight', '0,0;0,1', '1,0;0,1']);
    expect(sample).toContain('\n0-5,0;0,1\n');
    const imported = await svc.importReadings(modelId, 'sample.csv', sample);
    expect(imported).toMatchObject({ ok: true, readings: { count: 12 } });
  });
});
