import type { CohomologyReport, Method } from './CohomologyReport';
import { computeCohomology, round } from './computeCohomology';
import { computeSections, type SectionsReport } from './computeSections';
import type { FieldSpec } from './fields/FieldSpec';
import { readModelOrThrow, readModelTextOrThrow } from './model/readModel';
import type { Sheaf } from './model/Sheaf';
import type { Control } from './reduce/Cancelled';

export interface CohomologyOptions {
  method?: Method;
  field?: FieldSpec;
  splitBlocks?: boolean;
  control?: Control;
}

/**
 * The whole job on a parsed model file: validate, reduce, solve.
 * Throws ModelError (with located problems) on invalid input.
 */
export function cohomology(json: unknown, options: CohomologyOptions = {}): CohomologyReport {
  const t0 = performance.now();
  const sheaf = readModelOrThrow(json, { field: options.field });
  // Drop this frame's hold on the parsed file: on a large model its object
  // graph dominates the heap, and every later collection would trace it.
  json = undefined;
  return computeAfterRead(sheaf, t0, options);
}

/** Compute on a sheaf read since t0, the read counted in the build and total times. */
function computeAfterRead(sheaf: Sheaf<unknown>, t0: number, options: CohomologyOptions): CohomologyReport {
  const readMs = performance.now() - t0;
  const { report } = computeCohomology(sheaf, options);
  report.ms.build = round(report.ms.build + readMs);
  report.ms.total = round(report.ms.total + readMs);
  return report;
}

/** A basis of H^degree on the original cells, for a parsed model file. */
export function sections(json: unknown, degree: number, options: CohomologyOptions = {}): SectionsReport {
  const sheaf = readModelOrThrow(json, { field: options.field });
  const run = computeCohomology(sheaf, options);
  return computeSections(sheaf, run, degree).report;
}

/**
 * As {@link cohomology}, for a model file's text: the engine parses it
 * itself (the simplex list straight into typed arrays), so no caller's frame
 * holds a parsed copy of a large model while it computes. Throws a
 * SyntaxError for text that is not JSON.
 */
export function cohomologyOfText(text: string, options: CohomologyOptions = {}): CohomologyReport {
  const t0 = performance.now();
  return computeAfterRead(readModelTextOrThrow(text, { field: options.field }), t0, options);
}

/** As {@link sections}, for a model file's text. */
export function sectionsOfText(text: string, degree: number, options: CohomologyOptions = {}): SectionsReport {
  const sheaf = readModelTextOrThrow(text, { field: options.field });
  const run = computeCohomology(sheaf, options);
  return computeSections(sheaf, run, degree).report;
}
