/**
 * The trade kits as worker methods: read the user's files with the kit
 * readers (located problems, never a throw), run the kit, and add what the
 * pictures need (positions, edges) so the page draws without re-parsing.
 */
import type { FieldSpec, Problem } from '../../shared/engine';
import { detectFormat, readObj, readOff } from '../../shared/import';
import {
  adjustLevellingNet,
  analyseFrame,
  analyseMeshDataPacked,
  customStandard,
  levellingStandard,
  readLevellingCsv,
  readFrameCsv,
  readCsvTable,
  type FrameReport,
  type LevellingReport,
  type PackedMeshReport,
} from '../../shared/kits';
import { ProblemList } from '../../shared/engine/model/Problem';
import { spectralLayout } from '../../shared/layout/spectralLayout';
import type { ProgressSink } from './computeService';
import { meshPicture, type MeshPicture } from './meshPicture';

export type KitOutcome<T> = { ok: true; result: T } | { ok: false; problems: Problem[] };

export interface LevelNetResult {
  report: LevellingReport;
  stations: { id: string; benchmark: boolean }[];
  lines: { from: string; to: string; rise: number; lengthKm: number }[];
  /** x, y per station in [0, 1]² (y down), in station order. */
  positions: number[];
  /** Positions from x/y (or east/north) columns of stations.csv, or an automatic layout. */
  positionsGiven: boolean;
}

export interface FrameResult {
  report: FrameReport;
  joints: { id: string; position: number[]; fixed: boolean[] }[];
  bars: { id: string; from: string; to: string }[];
}

export interface MeshResult extends MeshPicture {
  /** Cycles packed flat, so a 10^6-triangle void reaches the page as one array. */
  report: PackedMeshReport;
  /** Cycles were skipped because the mesh is too large. */
  cyclesSkipped: string | null;
}

export interface LevelNetSettings {
  /** A listed standard key, or 'custom' with cMm. */
  standard: string;
  cMm?: number;
  /** Critical value of the standardised residual test; 3.29 when absent. */
  critical?: number;
  /** A-priori σ0, mm per √km; the adjustment's own (a-posteriori) σ0 when absent. */
  sigma0Mm?: number;
}

/** The coefficient fields the mesh kit offers: GF(2) (the default) or the rationals, where orientability shows in b₂. */
export type MeshField = 'prime:2' | 'rational';

export interface MeshSettings {
  field?: MeshField;
}

/** Representative cycles are found up to this many triangles; past it only the Betti numbers. */
export const MESH_CYCLE_LIMIT = 2_000_000;
/** At most this many edges are sent back for the picture. */
const MESH_DRAW_EDGES = 60_000;

export interface KitService {
  levelNet(stationsName: string, stationsText: string, linesName: string, linesText: string, settings: LevelNetSettings): Promise<KitOutcome<LevelNetResult>>;
  frameCheck(jointsName: string, jointsText: string, barsName: string, barsText: string): Promise<KitOutcome<FrameResult>>;
  meshTopology(fileName: string, data: string | Blob, onProgress?: ProgressSink, settings?: MeshSettings): Promise<KitOutcome<MeshResult>>;
}

/** `meshCycleLimit` overrides {@link MESH_CYCLE_LIMIT} (tests). */
export function createKitService(options: { meshCycleLimit?: number } = {}): KitService {
  const cycleLimit = options.meshCycleLimit ?? MESH_CYCLE_LIMIT;
  return {
    async levelNet(stationsName, stationsText, linesName, linesText, settings) {
      const read = readLevellingCsv(stationsText, linesText, { stations: stationsName, lines: linesName });
      if (!read.net) return { ok: false, problems: read.problems };
      let standard;
      if (settings.standard === 'custom') {
        const c = settings.cMm ?? NaN;
        if (!(c > 0) || !Number.isFinite(c)) return { ok: false, problems: [{ where: 'tolerance', message: `c = ${settings.cMm} mm must be a positive number` }] };
        standard = customStandard(c);
      } else {
        standard = levellingStandard(settings.standard);
        if (!standard) return { ok: false, problems: [{ where: 'tolerance', message: `unknown standard "${settings.standard}"` }] };
      }
      const positive = (x: number | undefined) => x === undefined || (x > 0 && Number.isFinite(x));
      if (!positive(settings.critical)) return { ok: false, problems: [{ where: 'residual test', message: `critical value ${settings.critical} must be a positive number` }] };
      if (!positive(settings.sigma0Mm)) return { ok: false, problems: [{ where: 'residual test', message: `a-priori σ0 = ${settings.sigma0Mm} mm must be a positive number (leave it empty to use the a-posteriori σ0)` }] };
      const report = adjustLevellingNet(read.net, { standard, critical: settings.critical, sigma0Mm: settings.sigma0Mm });
      const net = read.net;
      const index = new Map(net.stations.map((s, i) => [s.id, i]));
      const edges = Int32Array.from(net.lines.flatMap((l) => [index.get(l.from)!, index.get(l.to)!]));
      const given = stationPositions(stationsText, stationsName, net.stations.map((s) => s.id));
      const positions = given ?? Array.from(spectralLayout(net.stations.length, edges));
      return {
        ok: true,
        result: {
          report,
          stations: net.stations.map((s) => ({ id: s.id, benchmark: s.height !== undefined })),
          lines: net.lines.map((l) => ({ from: l.from, to: l.to, rise: l.rise, lengthKm: l.lengthKm })),
          positions,
          positionsGiven: given !== undefined,
        },
      };
    },

    async frameCheck(jointsName, jointsText, barsName, barsText) {
      const read = readFrameCsv(jointsText, barsText, { joints: jointsName, bars: barsName });
      if (!read.frame) return { ok: false, problems: read.problems };
      const report = analyseFrame(read.frame);
      return {
        ok: true,
        result: {
          report,
          joints: read.frame.joints.map((j) => ({ id: j.id, position: j.position, fixed: j.fixed })),
          bars: read.frame.bars.map((b) => ({ id: b.id, from: b.from, to: b.to })),
        },
      };
    },

    async meshTopology(fileName, data, onProgress, settings = {}) {
      const fieldKey = settings.field ?? 'prime:2';
      if (fieldKey !== 'prime:2' && fieldKey !== 'rational') return { ok: false, problems: [{ where: 'coefficients', message: `field "${String(fieldKey)}" is not prime:2 or rational` }] };
      onProgress?.({ phase: 'read', fraction: 0 });
      const text = typeof data === 'string' ? data : await data.text();
      const format = detectFormat(fileName, text.slice(0, 4096));
      if (format !== 'obj' && format !== 'off') return { ok: false, problems: [{ where: fileName, message: 'the mesh kit reads OBJ or OFF meshes' }] };
      onProgress?.({ phase: 'parse', fraction: 0 });
      const field: FieldSpec = fieldKey === 'rational' ? { kind: 'rational' } : { kind: 'prime', p: 2 };
      const read = (format === 'obj' ? readObj : readOff)(text, { progress: (fraction) => onProgress?.({ phase: 'parse', fraction }) });
      if ('problems' in read) return { ok: false, problems: read.problems.map((p) => ({ where: p.where ? `${fileName} ${p.where}` : fileName, message: p.message })) };
      const mesh = read.mesh;
      const triangles = mesh.triangles.length / 3;
      const withCycles = triangles <= cycleLimit;
      const report = analyseMeshDataPacked(mesh, {
        field,
        cycles: withCycles,
        control: { progress: (phase, fraction) => onProgress?.({ phase, fraction }) },
      });
      onProgress?.({ phase: 'picture', fraction: 1 });
      return { ok: true, result: { report, ...meshPicture(mesh, MESH_DRAW_EDGES), cyclesSkipped: withCycles ? null : `representative cycles are skipped above ${cycleLimit.toLocaleString('en')} triangles (this mesh has ${triangles.toLocaleString('en')}); the Betti numbers are complete` } };
    },
  };
}

/** Optional x,y (or east,north) columns of stations.csv, scaled to [0, 1]² with y up on paper. */
function stationPositions(text: string, file: string, ids: string[]): number[] | undefined {
  const table = readCsvTable(text, file, ['id'], new ProblemList());
  if (!table) return undefined;
  const pair = (['x', 'y'] as const).every((c) => table.columns.includes(c)) ? ['x', 'y'] : ['east', 'north'].every((c) => table.columns.includes(c)) ? ['east', 'north'] : undefined;
  if (!pair) return undefined;
  const [xc, yc] = pair;
  const at = new Map<string, [number, number]>();
  for (const r of table.rows) {
    const x = Number(r.cells[xc]);
    const y = Number(r.cells[yc]);
    if (r.cells[xc] === '' || r.cells[yc] === '' || !Number.isFinite(x) || !Number.isFinite(y)) return undefined;
    at.set(r.cells.id, [x, y]);
  }
  if (!ids.every((id) => at.has(id))) return undefined;
  return fitUnit(ids.map((id) => at.get(id)!));
}

function fitUnit(points: [number, number][]): number[] {
  let minX = Infinity, maxX = -Infinity, minY = Infinity, maxY = -Infinity;
  for (const [x, y] of points) {
    minX = Math.min(minX, x);
    maxX = Math.max(maxX, x);
    minY = Math.min(minY, y);
    maxY = Math.max(maxY, y);
  }
  const span = Math.max(maxX - minX, maxY - minY) || 1;
  // Centred in the square whichever side is the shorter.
  const cx = (span - (maxX - minX)) / 2;
  const cy = (span - (maxY - minY)) / 2;
  return points.flatMap(([x, y]) => [0.05 + (0.9 * (x - minX + cx)) / span, 0.95 - (0.9 * (y - minY + cy)) / span]);
}
