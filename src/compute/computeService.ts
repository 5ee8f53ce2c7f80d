/**
 * What the engine worker can do, written against the store and the engine
 * only (no comlink, no DOM), so it runs in the worker, in tests and, if a
 * worker cannot start, on the main thread.
 */
import {
  computeCohomology,
  ENGINE_VERSION,
  readModel,
  readModelText,
  sectionVectors,
  type Computation,
  type Problem,
  type Sheaf,
} from '../../shared/engine';
import { detectFormat, importAny } from '../../shared/import';
import { spectralLayout } from '../../shared/layout/spectralLayout';
import type { GluefieldDb, ModelRow, NewKitResult, RunRow, RunSettings, StoredBasis } from '../store';
import { isPackedMeshReport, unpackMeshReport } from '../../shared/kits/mesh';
import { getModel, loadModelText, saveKitResult, saveModelVersion, saveNewModel, saveRun } from '../store';
import { recordModelSaved, recordRunSaved } from '../sync/recordChange';
import { createKitService, type KitService } from './kitService';
import { createReadingsService, type ReadingsService } from './readingsService';

export interface Progress {
  phase: string;
  fraction: number;
}

export type ProgressSink = (p: Progress) => void;

export type ImportOutcome = { ok: true; model: ModelRow } | { ok: false; problems: Problem[] };

export interface ModelSummary {
  name: string | null;
  field: string;
  dimension: number;
  cells: number[];
  cochainDims: number[];
  hasPositions: boolean;
}

export interface CellRow {
  index: number;
  vertices: number[];
  stalk: number;
}

export interface SketchData {
  /** x, y per vertex in [0, 1]² (y down). */
  positions: Float32Array;
  /** dense vertex index pairs */
  edges: Int32Array;
  /** dense vertex index triples */
  triangles: Int32Array;
  /** given positions (true) or an automatic layout */
  given: boolean;
}

/** A run with the cells that stayed critical, by index in the original complex. */
export type RunRecord = RunRow & { critical?: Int32Array[] };

/** Bases are kept for the findings table when small enough to be read… */
const MAX_BASIS_DIM = 64;
/** …and to be stored with every run without weighing down the store (numbers per degree). */
const MAX_BASIS_VALUES = 2_000_000;

interface Loaded {
  key: string;
  sheaf: Sheaf<unknown>;
}

/** The model methods, and the trade kits (levelling net, frame check, mesh topology). */
/** A kit result to keep, its input files as text or as the Blob the user picked (read in the worker). */
export type KitResultToSave = Omit<NewKitResult, 'inputs'> & { inputs: { name: string; data: string | Blob }[] };

export interface ComputeService extends KitService, ReadingsService {
  /**
   * Keep a kit's inputs and report in a project. Packing a large mesh file
   * takes seconds of gzip, which is why it happens here and not on the page.
   */
  saveKitResult(input: KitResultToSave): Promise<{ id: string; createdAt: number; engineVersion: string }>;
  importFile(projectId: string, fileName: string, data: string | Blob, onProgress?: ProgressSink): Promise<ImportOutcome>;
  replaceModel(modelId: string, fileName: string, data: string | Blob, source?: ModelRow['source']): Promise<ImportOutcome>;
  validateText(text: string): Promise<{ problems: Problem[]; summary?: ModelSummary }>;
  summary(modelId: string): Promise<ModelSummary>;
  cells(modelId: string, k: number, offset: number, count: number): Promise<CellRow[]>;
  sketch(modelId: string): Promise<SketchData>;
  /** Stalk dimension of every k-cell, in cell order. */
  stalks(modelId: string, k: number): Promise<Int32Array>;
  run(modelId: string, settings: RunSettings, onProgress?: ProgressSink): Promise<RunRecord>;
}

export function createComputeService(db: GluefieldDb): ComputeService {
  let cache: Loaded | undefined;

  const load = async (modelId: string): Promise<Loaded> => {
    const row = await getModel(db, modelId);
    if (!row) throw new Error(`model ${modelId} not found`);
    const key = `${modelId}@${row.version}`;
    if (cache?.key === key) return cache;
    const text = await loadModelText(db, modelId);
    // Only the sheaf is kept: a parsed copy of a large file would hold the worker's heap for nothing.
    const read = readModelText(text);
    if (!read.sheaf) throw new Error(read.problems.map((p) => `${p.where}: ${p.message}`).join('; '));
    cache = { key, sheaf: read.sheaf };
    return cache;
  };

  const prepare = async (fileName: string, data: string | Blob, onProgress?: ProgressSink) => {
    onProgress?.({ phase: 'read', fraction: 0 });
    const text = typeof data === 'string' ? data : await data.text();
    onProgress?.({ phase: 'parse', fraction: 0.3 });
    const format = detectFormat(fileName, text.slice(0, 512)) ?? 'model';
    const imported = importAny(fileName, text);
    if ('problems' in imported) return { problems: imported.problems };
    onProgress?.({ phase: 'check', fraction: 0.6 });
    const read = readModel(imported.model);
    if (!read.sheaf) return { problems: read.problems };
    const modelText = format === 'model' ? text : JSON.stringify(imported.model);
    return { text: modelText, sheaf: read.sheaf, format, name: imported.model.name };
  };

  return {
    ...createKitService(),
    ...createReadingsService(db, async (modelId) => (await load(modelId)).sheaf),

    async saveKitResult(input) {
      const inputs = await Promise.all(input.inputs.map(async (f) => ({ name: f.name, text: typeof f.data === 'string' ? f.data : await f.data.text() })));
      // The mesh kit's page holds its cycles packed; the saved report keeps the kit's own form.
      const report = isPackedMeshReport(input.report) ? unpackMeshReport(input.report) : input.report;
      const row = await saveKitResult(db, { ...input, inputs, report });
      return { id: row.id, createdAt: row.createdAt, engineVersion: row.engineVersion };
    },

    async importFile(projectId, fileName, data, onProgress) {
      const p = await prepare(fileName, data, onProgress);
      if (!p.sheaf) return { ok: false, problems: p.problems };
      onProgress?.({ phase: 'save', fraction: 0.85 });
      const s = summarise(p.sheaf);
      const model = await saveNewModel(db, {
        projectId,
        name: p.name || fileName.replace(/\.(sheaf\.json|json|csv|tsv|txt|obj|off)$/i, ''),
        text: p.text,
        source: p.format,
        field: s.field,
        cells: s.cells,
        cochainDims: s.cochainDims,
      });
      await recordModelSaved(db, model);
      onProgress?.({ phase: 'done', fraction: 1 });
      return { ok: true, model };
    },

    async replaceModel(modelId, fileName, data, source) {
      const p = await prepare(fileName, data);
      if (!p.sheaf) return { ok: false, problems: p.problems };
      const s = summarise(p.sheaf);
      const model = await saveModelVersion(db, modelId, { text: p.text, field: s.field, cells: s.cells, cochainDims: s.cochainDims, source: source ?? p.format });
      await recordModelSaved(db, model);
      return { ok: true, model };
    },

    async validateText(text) {
      let json: unknown;
      try {
        json = JSON.parse(text);
      } catch (err) {
        return { problems: [{ where: 'file', message: `not valid JSON: ${(err as Error).message}` }] };
      }
      const read = readModel(json);
      if (!read.sheaf) return { problems: read.problems };
      return { problems: [], summary: summarise(read.sheaf) };
    },

    async summary(modelId) {
      return summarise((await load(modelId)).sheaf);
    },

    async cells(modelId, k, offset, count) {
      const { sheaf } = await load(modelId);
      const table = sheaf.complex.simplices[k];
      if (!table) return [];
      const ids = sheaf.complex.vertexIds;
      const end = Math.min(table.size, offset + count);
      const rows: CellRow[] = [];
      for (let s = offset; s < end; s++) {
        const vertices: number[] = [];
        for (let i = 0; i <= k; i++) vertices.push(ids[table.vertex(s, i)]);
        rows.push({ index: s, vertices, stalk: sheaf.stalkDims[k][s] });
      }
      return rows;
    },

    async stalks(modelId, k) {
      const { sheaf } = await load(modelId);
      return Int32Array.from(sheaf.stalkDims[k] ?? []);
    },

    async sketch(modelId) {
      const { sheaf } = await load(modelId);
      return sketchOf(sheaf);
    },

    async run(modelId, settings, onProgress) {
      const row = await getModel(db, modelId);
      if (!row) throw new Error(`model ${modelId} not found`);
      const started = performance.now();
      const emit = throttle(onProgress);
      emit({ phase: 'read', fraction: 0 });
      const text = await loadModelText(db, modelId);
      emit({ phase: 'build', fraction: 0 });
      const base = {
        modelId,
        projectId: row.projectId,
        modelVersion: row.version,
        modelHash: row.hash,
        engineVersion: ENGINE_VERSION,
        settings,
      };
      // From the text: the simplex list goes straight into typed arrays and no
      // parsed copy of a large model stays alive while the engine runs.
      const read = readModelText(text, { field: settings.field });
      if (!read.sheaf) {
        const error = read.problems.map((p) => `${p.where}: ${p.message}`).join('; ');
        const saved = await saveRun(db, { ...base, status: 'failed', error, ms: performance.now() - started });
        await recordRunSaved(db, saved);
        return saved;
      }
      const sheaf = read.sheaf;
      const computation = computeCohomology(sheaf, {
        method: settings.method,
        splitBlocks: settings.splitBlocks,
        control: { progress: (phase, fraction) => emit({ phase, fraction }) },
      });
      emit({ phase: 'bases', fraction: 0 });
      const bases = basesOf(sheaf, computation);
      const critical = computation.reduction
        ? sheaf.stalkDims.map((_, k) => computation.reduction!.criticalInput(k))
        : undefined;
      emit({ phase: 'save', fraction: 1 });
      const saved = await saveRun(db, {
        ...base,
        status: 'done',
        report: computation.report,
        bases,
        ms: performance.now() - started,
        ...(critical ? { critical } : {}),
      });
      await recordRunSaved(db, saved);
      return saved as RunRecord;
    },
  };
}

function summarise(sheaf: Sheaf<unknown>): ModelSummary {
  const cochainDims = sheaf.stalkDims.map((d) => d.reduce((a, b) => a + b, 0));
  return {
    name: sheaf.name ?? null,
    field: sheaf.field.label,
    dimension: sheaf.complex.dimension,
    cells: sheaf.stalkDims.map((d) => d.length),
    cochainDims,
    hasPositions: Boolean(sheaf.vertices?.some((v) => typeof v.x === 'number' && typeof v.y === 'number')),
  };
}

function basesOf(sheaf: Sheaf<unknown>, run: Computation<unknown>): StoredBasis[] {
  const F = sheaf.field;
  const out: StoredBasis[] = [];
  for (let k = 0; k <= Math.min(1, sheaf.complex.dimension); k++) {
    if (run.report.dims[k] === 0 || run.report.dims[k] > MAX_BASIS_DIM) continue;
    if (run.report.dims[k] * run.report.cochainDims[k] > MAX_BASIS_VALUES) continue;
    try {
      const vectors = sectionVectors(sheaf, run, k);
      out.push({ degree: k, dim: vectors.length, values: vectors.map((v) => Float64Array.from({ length: v.length }, (_, i) => F.toNumber(v[i]))) });
    } catch (err) {
      if (!(err instanceof RangeError)) throw err;
      // Too many coordinates left for a dense basis: the findings say so instead.
    }
  }
  return out;
}

function sketchOf(sheaf: Sheaf<unknown>): SketchData {
  const cx = sheaf.complex;
  const n = cx.vertexIds.length;
  const edges = cx.dimension >= 1 ? Int32Array.from(cx.simplices[1].vertices) : new Int32Array(0);
  const triangles = cx.dimension >= 2 ? Int32Array.from(cx.simplices[2].vertices) : new Int32Array(0);
  const given = new Map<number, { x: number; y: number }>();
  for (const v of sheaf.vertices ?? []) if (typeof v.x === 'number' && typeof v.y === 'number') given.set(v.id, { x: v.x, y: v.y });
  if (given.size === n && n > 0) {
    let minX = Infinity;
    let maxX = -Infinity;
    let minY = Infinity;
    let maxY = -Infinity;
    for (const p of given.values()) {
      minX = Math.min(minX, p.x);
      maxX = Math.max(maxX, p.x);
      minY = Math.min(minY, p.y);
      maxY = Math.max(maxY, p.y);
    }
    const span = Math.max(maxX - minX, maxY - minY) || 1;
    const positions = new Float32Array(2 * n);
    for (let i = 0; i < n; i++) {
      const p = given.get(cx.vertexIds[i])!;
      positions[2 * i] = 0.05 + (0.9 * (p.x - minX)) / span;
      // Survey and drawing coordinates grow upwards; the screen grows down.
      positions[2 * i + 1] = 0.95 - (0.9 * (p.y - minY)) / span;
    }
    return { positions, edges, triangles, given: true };
  }
  return { positions: spectralLayout(n, edges), edges, triangles, given: false };
}

function throttle(sink?: ProgressSink): ProgressSink {
  let last = 0;
  let lastPhase = '';
  return (p) => {
    if (!sink) return;
    const now = performance.now();
    if (p.phase !== lastPhase || now - last > 80 || p.fraction >= 1) {
      last = now;
      lastPhase = p.phase;
      sink(p);
    }
  };
}
