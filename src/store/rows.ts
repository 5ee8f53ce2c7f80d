import type { CohomologyReport, FieldSpec, Method } from '../../shared/engine';

/** A project on the Desk. */
export interface ProjectRow {
  id: string;
  name: string;
  createdAt: number;
  updatedAt: number;
}

/** Where a model's current text came from. */
export type ModelSource = 'model' | 'csv' | 'obj' | 'off' | 'demo' | 'editor';

/**
 * A model's summary, enough to list it without reading its text. The text
 * itself lives in {@link ModelTextRow}, one packed row per kept version.
 */
export interface ModelRow {
  id: string;
  projectId: string;
  name: string;
  /** The current version, 1 for a new model. */
  version: number;
  /** SHA-256 (hex) of the current version's text. */
  hash: string;
  /** The file's field as the engine labels it (`fieldLabel`, as in CohomologyReport.field): "rational", "real" or "prime:P". */
  field: string;
  /** Number of k-simplices, k = 0 … top dimension. */
  cells: number[];
  /** Sum of stalk dimensions over the k-simplices. */
  cochainDims: number[];
  /** UTF-8 length of the current version's text. */
  bytes: number;
  source: ModelSource;
  createdAt: number;
  updatedAt: number;
}

/** One version of a model's text, gzip-packed: a whole model is one row, never one row per cell. */
export interface ModelTextRow {
  /** `${modelId}@${version}` */
  id: string;
  modelId: string;
  version: number;
  /** gzip of the model file's JSON text */
  packed: Uint8Array;
  /** UTF-8 length of the text before packing */
  bytes: number;
}

export interface RunSettings {
  method: Method;
  field: FieldSpec;
  splitBlocks: boolean;
}

/** A basis of H^degree, kept with its run. */
export interface StoredBasis {
  degree: number;
  dim: number;
  /** One vector per basis element: all stalk coordinates in engine cell order. */
  values: Float64Array[];
}

export type RunStatus = 'done' | 'failed' | 'cancelled';

/** One Reduce & solve run of one model version. */
export interface RunRow {
  id: string;
  modelId: string;
  projectId: string;
  modelVersion: number;
  modelHash: string;
  engineVersion: string;
  settings: RunSettings;
  status: RunStatus;
  report?: CohomologyReport;
  error?: string;
  bases?: StoredBasis[];
  createdAt: number;
  /** Wall-clock milliseconds of the run. */
  ms: number;
  /** Morse runs: per degree, the original cells still critical after the last round. */
  critical?: Int32Array[];
}

/** A readings file (field data on cells) kept with a model, gzip-packed like model texts. */
export interface ReadingsRow {
  id: string;
  modelId: string;
  projectId: string;
  name: string;
  packed: Uint8Array;
  /** uncompressed length */
  bytes: number;
  /** number of readings in the file */
  count: number;
  createdAt: number;
  updatedAt: number;
}

export interface SettingRow {
  key: string;
  value: unknown;
}

/** Which trade kit produced a saved result. */
export type KitKind = 'levelling' | 'frame' | 'mesh';

/** One input file of a saved kit result, gzip-packed as given. */
export interface KitInputRow {
  name: string;
  packed: Uint8Array;
  /** UTF-8 length and SHA-256 (hex) of the text before packing. */
  bytes: number;
  hash: string;
}

/**
 * A kit's input and result kept in a project: the files as they were read,
 * the settings, and the report as JSON, gzip-packed, with where it came
 * from (engine version and when).
 */
export interface KitResultRow {
  id: string;
  projectId: string;
  kit: KitKind;
  name: string;
  /** One line the project's list shows (the kit's headline figures). */
  summary: string;
  settings: Record<string, unknown>;
  inputs: KitInputRow[];
  /** gzip of the report's JSON text */
  packedReport: Uint8Array;
  engineVersion: string;
  createdAt: number;
}
