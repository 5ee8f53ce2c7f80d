import type { ModelFile, Problem } from '../engine';

/** What every importer returns: a model file, or the located problems that stopped it. */
export type ImportResult = { model: ModelFile } | { problems: Problem[] };

/** Choices the file formats cannot express; the imported sheaf is constant. */
export interface ImportOptions {
  /** Display name of the model. */
  name?: string;
  /** Coefficients; rational when absent. */
  field?: ModelFile['field'];
  /** Dimension of every stalk (a non-negative integer); 1 when absent. */
  stalkDim?: number;
}
