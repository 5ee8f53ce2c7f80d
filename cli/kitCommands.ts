import { simplexIds } from '../shared/engine/complex/SimplicialComplex';
import { computeCohomology } from '../shared/engine/computeCohomology';
import { consistencyRadius } from '../shared/engine/data/consistencyRadius';
import { nearestSection } from '../shared/engine/data/nearestSection';
import { readReadingsOrThrow } from '../shared/engine/data/readReadings';
import type { FieldSpec } from '../shared/engine/fields/FieldSpec';
import { ModelError, type Problem } from '../shared/engine/model/Problem';
import { readModelOrThrow } from '../shared/engine/model/readModel';
import { detectFormat, readObj, readOff } from '../shared/import';
import { analyseFrame, readFrameCsv } from '../shared/kits/frame';
import {
  adjustLevellingNet,
  customStandard,
  LEVELLING_STANDARDS,
  levellingStandard,
  readLevellingCsv,
  type LevellingStandard,
} from '../shared/kits/levelling';
import { analyseMeshData } from '../shared/kits/mesh';
import { UsageError } from './UsageError';

/** `level-net STATIONS.csv LINES.csv`: the adjustment report, or ModelError naming the first bad cell. */
export function levelNetCommand(paths: [string, string], texts: [string, string], options: { standard?: string; cMm?: number; critical?: number; sigma0Mm?: number }): unknown {
  const read = readLevellingCsv(texts[0], texts[1], { stations: paths[0], lines: paths[1] });
  if (!read.net) throw new ModelError(read.problems);
  let standard: LevellingStandard | undefined;
  if (options.standard !== undefined && options.cMm !== undefined) throw new UsageError('give --standard or --c-mm, not both');
  if (options.cMm !== undefined) standard = customStandard(options.cMm);
  else if (options.standard !== undefined) {
    standard = levellingStandard(options.standard);
    if (!standard) throw new UsageError(`--standard: "${options.standard}" is not one of ${LEVELLING_STANDARDS.map((s) => s.key).join(', ')}`);
  }
  return adjustLevellingNet(read.net, { standard, critical: options.critical, sigma0Mm: options.sigma0Mm });
}

/** `frame JOINTS.csv BARS.csv`: mechanisms and self-stresses. */
export function frameCommand(paths: [string, string], texts: [string, string]): unknown {
  const read = readFrameCsv(texts[0], texts[1], { joints: paths[0], bars: paths[1] });
  if (!read.frame) throw new ModelError(read.problems);
  return analyseFrame(read.frame);
}

/** `mesh FILE.obj|off`: Betti numbers, surface checks and cycles. */
export function meshCommand(path: string, text: string, options: { field?: FieldSpec; cycles: boolean }): unknown {
  const format = detectFormat(path, text.slice(0, 4096));
  if (format !== 'obj' && format !== 'off') throw new UsageError(`${path}: the mesh command reads OBJ or OFF meshes`);
  const field = options.field ?? { kind: 'prime', p: 2 };
  if (field.kind === 'real') throw new UsageError('--field: the mesh command works over prime:P or rational');
  const read = (format === 'obj' ? readObj : readOff)(text);
  if ('problems' in read) throw new ModelError(read.problems.map((p: Problem) => ({ where: p.where ? `${path} ${p.where}` : path, message: p.message })));
  return analyseMeshData(read.mesh, { field, cycles: options.cycles });
}

/** `readings FILE READINGS.json`: consistency radius and nearest global section. */
export function readingsCommand(model: unknown, readingsJson: unknown, field: FieldSpec | undefined): unknown {
  const sheaf = readModelOrThrow(model, { field });
  const readings = readReadingsOrThrow(readingsJson, sheaf);
  const run = computeCohomology(sheaf);
  const radius = consistencyRadius(sheaf, readings);
  const fit = nearestSection(sheaf, readings, { run });
  const cx = sheaf.complex;
  const entries = Array.from(readings.cell, (c, i) => {
    const at = (v: Float64Array) => Array.from(v.subarray(readings.offset[i], readings.offset[i + 1]));
    return {
      cell: simplexIds(cx, readings.degree[i], c),
      reading: at(readings.value),
      fitted: at(fit.fitted),
      residual: fit.residualNorm[i],
    };
  });
  const d0 = sheaf.stalkDims[0];
  const section: Record<string, number[]> = {};
  let at = 0;
  for (let v = 0; v < d0.length; v++) {
    section[String(cx.vertexIds[v])] = Array.from(fit.section.subarray(at, at + d0[v]));
    at += d0[v];
  }
  return {
    field: sheaf.field.label,
    consistency: radius,
    nearestSection: { dimH0: fit.dimH0, determined: fit.determined, weightedRms: fit.weightedRms, section, readings: entries },
  };
}
