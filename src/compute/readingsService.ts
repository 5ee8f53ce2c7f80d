/**
 * Readings as worker methods: import a readings file for a model (checked
 * against the model before anything is saved), check a saved one against
 * the model (consistency radius, nearest global section, bottom of the
 * sheaf Laplacian's spectrum), and write a sample file for a model. The
 * mathematics is the engine's; this adds the cells' names and indices the
 * page needs to list and draw them.
 */
import {
  CellRestriction,
  consistencyRadius,
  ENGINE_VERSION,
  laplacianSpectrum,
  nearestSection,
  type Problem,
  type Sheaf,
} from '../../shared/engine';
import { simplexIds } from '../../shared/engine/complex/SimplicialComplex';
import { denseIndexer } from '../../shared/engine/model/readSimplices';
import { readReadingsText } from '../../shared/import';
import type { GluefieldDb, ReadingsRow } from '../store';
import { getModel, loadReadingsText, saveReadings } from '../store';
import { recordReadingsSaved } from '../sync/recordChange';
import type { ProgressSink } from './computeService';

/** A cell of the model: its degree and index in the complex (what the Sketch draws), its vertex ids and their labels. */
export interface CellRef {
  degree: number;
  index: number;
  ids: number[];
  /** Vertex labels from the model, when it has them. */
  labels?: string[];
}

export interface ReadingsCheck {
  readingsId: string;
  readingsName: string;
  modelId: string;
  modelVersion: number;
  modelHash: string;
  engineVersion: string;
  /** The model's field; the check itself is in floating point. */
  field: string;
  createdAt: number;
  ms: number;
  count: number;
  /** Over every assigned face pair: the largest and root-mean-square mismatch (Robinson 2017). */
  radius: { max: number; rms: number; pairs: number };
  /** The worst face pairs, largest mismatch first (at most {@link WORST_PAIRS}). */
  worst: { face: CellRef; coface: CellRef; mismatch: number }[];
  /** Each reading against the nearest global section, in file order. */
  cells: { cell: CellRef; reading: number[]; fitted: number[]; residual: number[]; norm: number; weight: number }[];
  section: { dimH0: number; determined: boolean; weightedRms: number };
  /** The smallest eigenvalues of the sheaf Laplacian L⁰, or why they were not computed. */
  spectrum: { values: number[]; harmonicDimension: number; converged: boolean; scale: number } | { skipped: string };
}

export type ReadingsImport = { ok: true; readings: ReadingsRow } | { ok: false; problems: Problem[] };
export type ReadingsCheckOutcome = { ok: true; check: ReadingsCheck } | { ok: false; problems: Problem[] };

/** Worst pairs kept for the table; the figures cover every pair. */
export const WORST_PAIRS = 100;
/** The spectrum is computed up to this many vertex coordinates (one sparse factorisation of L⁰). */
export const SPECTRUM_LIMIT = 100_000;
/** Eigenvalues shown. */
const EIGENVALUES = 4;
/** Rows of the sample file: enough to show the form on any model. */
const SAMPLE_ROWS = 40;

export interface ReadingsService {
  importReadings(modelId: string, fileName: string, data: string | Blob): Promise<ReadingsImport>;
  checkReadings(modelId: string, readingsId: string, onProgress?: ProgressSink): Promise<ReadingsCheckOutcome>;
  /** A readings CSV with the model's first cells and zero values, to fill in. */
  readingsSample(modelId: string): Promise<string>;
}

export function createReadingsService(db: GluefieldDb, sheafOf: (modelId: string) => Promise<Sheaf<unknown>>, options: { spectrumLimit?: number } = {}): ReadingsService {
  const spectrumLimit = options.spectrumLimit ?? SPECTRUM_LIMIT;
  return {
    async importReadings(modelId, fileName, data) {
      const text = typeof data === 'string' ? data : await data.text();
      const sheaf = await sheafOf(modelId);
      const read = readReadingsText(fileName, text, sheaf);
      if (!read.readings) return { ok: false, problems: read.problems };
      const name = (read.file.name?.trim() || fileName.replace(/\.(readings\.json|json|csv|tsv|txt)$/i, '')).slice(0, 200);
      // Stored in the JSON form whatever came in, so every reader (sync, the command line) sees one format.
      const row = await saveReadings(db, { modelId, name, text: JSON.stringify(read.file, null, 1), count: read.readings.cell.length });
      await recordReadingsSaved(db, row);
      return { ok: true, readings: row };
    },

    async checkReadings(modelId, readingsId, onProgress) {
      const started = performance.now();
      onProgress?.({ phase: 'read', fraction: 0 });
      const model = await getModel(db, modelId);
      if (!model) throw new Error(`model ${modelId} not found`);
      const row = await db.readings.get(readingsId);
      if (!row) throw new Error(`readings ${readingsId} not found`);
      const [sheaf, text] = await Promise.all([sheafOf(modelId), loadReadingsText(db, readingsId)]);
      // Checked again: the model may have changed since the readings were imported.
      const read = readReadingsText('readings.json', text, sheaf);
      if (!read.readings) return { ok: false, problems: read.problems };
      const r = read.readings;
      onProgress?.({ phase: 'radius', fraction: 0.1 });
      const radius = consistencyRadius(sheaf, r, { worst: WORST_PAIRS });
      onProgress?.({ phase: 'section', fraction: 0.3 });
      const fit = nearestSection(sheaf, r);
      onProgress?.({ phase: 'spectrum', fraction: 0.7 });
      const spectrum = spectrumOf(sheaf, spectrumLimit);
      onProgress?.({ phase: 'done', fraction: 1 });
      const refs = cellRefs(sheaf);
      const at = (v: Float64Array, i: number) => Array.from(v.subarray(r.offset[i], r.offset[i + 1]));
      return {
        ok: true,
        check: {
          readingsId,
          readingsName: row.name,
          modelId,
          modelVersion: model.version,
          modelHash: model.hash,
          engineVersion: ENGINE_VERSION,
          field: sheaf.field.label,
          createdAt: Date.now(),
          ms: performance.now() - started,
          count: r.cell.length,
          radius: { max: radius.max, rms: radius.rms, pairs: radius.pairs },
          worst: radius.worst.map((p) => ({ face: refs.byIds(p.face), coface: refs.byIds(p.coface), mismatch: p.mismatch })),
          cells: Array.from(r.cell, (c, i) => ({
            cell: refs.byIndex(r.degree[i], c),
            reading: at(r.value, i),
            fitted: at(fit.fitted, i),
            residual: at(fit.residual, i),
            norm: fit.residualNorm[i],
            weight: r.weight[i],
          })),
          section: { dimH0: fit.dimH0, determined: fit.determined, weightedRms: fit.weightedRms },
          spectrum,
        },
      };
    },

    async readingsSample(modelId) {
      const sheaf = await sheafOf(modelId);
      const lines = ['cell,value,weight'];
      for (let k = 0; k < Math.min(2, sheaf.stalkDims.length) && lines.length <= SAMPLE_ROWS; k++) {
        const dims = sheaf.stalkDims[k];
        for (let c = 0; c < dims.length && lines.length <= SAMPLE_ROWS; c++) {
          if (dims[c] === 0) continue;
          lines.push(`${simplexIds(sheaf.complex, k, c).join('-')},${Array(dims[c]).fill('0').join(';')},1`);
        }
      }
      return lines.join('\n') + '\n';
    },
  };
}

function spectrumOf(sheaf: Sheaf<unknown>, limit: number): ReadingsCheck['spectrum'] {
  const n = sheaf.stalkDims[0].reduce((a, b) => a + b, 0);
  if (n === 0) return { skipped: 'the model has no vertex coordinates' };
  if (n > limit) return { skipped: `skipped above ${limit.toLocaleString('en')} vertex coordinates (this model has ${n.toLocaleString('en')})` };
  const s = laplacianSpectrum(sheaf, 0, EIGENVALUES);
  return { values: s.values, harmonicDimension: s.harmonicDimension, converged: s.converged, scale: s.scale };
}

/** Cells by index or by original vertex ids, with the model's vertex labels. */
function cellRefs(sheaf: Sheaf<unknown>) {
  const cx = sheaf.complex;
  const label = new Map<number, string>();
  for (const v of sheaf.vertices ?? []) if (typeof v.label === 'string' && v.label !== '') label.set(v.id, v.label);
  const dense = denseIndexer(cx.vertexIds);
  const R = new CellRestriction(sheaf);
  const named = (degree: number, index: number, ids: number[]): CellRef => {
    const labels = ids.map((id) => label.get(id));
    return labels.every((l) => l !== undefined) ? { degree, index, ids, labels: labels as string[] } : { degree, index, ids };
  };
  return {
    byIndex: (k: number, c: number) => named(k, c, simplexIds(cx, k, c)),
    byIds: (ids: number[]) => named(ids.length - 1, R.find(ids.map(dense).sort((a, b) => a - b)), ids),
  };
}
