/**
 * Gluefield's local database (IndexedDB through Dexie), usable from the
 * main thread and from a Web Worker. What is stored where:
 * - `projects`: the Desk's projects;
 * - `models`: one summary row per model (counts, field, hash of the current text);
 * - `modelTexts`: the model file text, gzip-packed, one row per kept version
 *   (the newest {@link MAX_TEXT_VERSIONS}), never one row per cell;
 * - `runs`: Reduce & solve results, with bases as typed arrays;
 * - `readings`: field data on a model's cells, one packed row per readings file;
 * - `settings`: small key–value preferences;
 * - `kitResults`: a trade kit's input files and report saved into a project, packed.
 */
import Dexie, { type Table } from 'dexie';
import type { KitResultRow, ModelRow, ModelTextRow, ProjectRow, ReadingsRow, RunRow, SettingRow } from './rows';
import type { OutboxRow, SyncLinkRow } from '../sync/rows';
import { upgradeToV2 } from './upgradeToV2';

export type {
  KitInputRow,
  KitKind,
  KitResultRow,
  ModelRow,
  ModelSource,
  ModelTextRow,
  ProjectRow,
  ReadingsRow,
  RunRow,
  RunSettings,
  RunStatus,
  SettingRow,
  StoredBasis,
} from './rows';

export const DB_NAME = 'gluefield';

/** How many text versions of a model are kept; older ones are dropped on save. */
export const MAX_TEXT_VERSIONS = 20;

/** Version 1, as first shipped: runs were found through their model only, models had no `bytes`. */
export const SCHEMA_V1 = {
  projects: 'id, name, updatedAt',
  models: 'id, projectId, updatedAt',
  modelTexts: 'id, modelId, [modelId+version]',
  runs: 'id, modelId, createdAt',
  settings: 'key',
} as const;

/** Version 2: runs carry and index their `projectId`; models carry `bytes`. */
export const SCHEMA_V2 = {
  ...SCHEMA_V1,
  runs: 'id, modelId, projectId, createdAt',
} as const;

/** Version 3: readings files kept with their model. */
export const SCHEMA_V3 = {
  ...SCHEMA_V2,
  readings: 'id, modelId, projectId, updatedAt',
} as const;

/**
 * Version 4: team sync. `outbox` holds local changes to linked projects
 * waiting to be pushed (see src/sync); `syncLinks` one row per project
 * linked to the team server. Both start empty, so the upgrade adds the
 * tables and touches no existing row.
 */
export const SCHEMA_V4 = {
  ...SCHEMA_V3,
  outbox: '++seq, projectId, [projectId+docId]',
  syncLinks: 'projectId',
} as const;

/** Version 5: kit results saved into projects; a new table, so no row changes. */
export const SCHEMA_V5 = {
  ...SCHEMA_V4,
  kitResults: 'id, projectId, createdAt',
} as const;

export class GluefieldDb extends Dexie {
  declare projects: Table<ProjectRow, string>;
  declare models: Table<ModelRow, string>;
  declare modelTexts: Table<ModelTextRow, string>;
  declare runs: Table<RunRow, string>;
  declare settings: Table<SettingRow, string>;
  declare readings: Table<ReadingsRow, string>;
  declare outbox: Table<OutboxRow, number>;
  declare syncLinks: Table<SyncLinkRow, string>;
  declare kitResults: Table<KitResultRow, string>;

  constructor(name: string = DB_NAME) {
    super(name);
    this.version(1).stores(SCHEMA_V1);
    this.version(2).stores(SCHEMA_V2).upgrade(upgradeToV2);
    this.version(3).stores(SCHEMA_V3);
    this.version(4).stores(SCHEMA_V4);
    this.version(5).stores(SCHEMA_V5);
  }
}

/** A handle on the named database; it opens on first use. */
export function openDb(name: string = DB_NAME): GluefieldDb {
  return new GluefieldDb(name);
}
