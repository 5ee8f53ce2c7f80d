export {
  DB_NAME,
  MAX_TEXT_VERSIONS,
  SCHEMA_V1,
  SCHEMA_V2,
  SCHEMA_V3,
  SCHEMA_V4,
  SCHEMA_V5,
  GluefieldDb,
  openDb,
  type KitInputRow,
  type KitKind,
  type KitResultRow,
  type ModelRow,
  type ModelSource,
  type ModelTextRow,
  type ProjectRow,
  type ReadingsRow,
  type RunRow,
  type RunSettings,
  type RunStatus,
  type SettingRow,
  type StoredBasis,
} from './db';
export { StoreError, type StoreErrorCode } from './StoreError';
export { packText, unpackText, hashText, prepareText, type PreparedText } from './pack';
export { listProjects, getProject, createProject, renameProject, deleteProject } from './projects';
export {
  listModels,
  getModel,
  saveNewModel,
  saveModelVersion,
  loadModelText,
  listModelVersions,
  renameModel,
  deleteModel,
  type ModelSummary,
  type NewModel,
  type ModelVersionInput,
  type ModelVersionInfo,
} from './models';
export { saveRun, listRuns, getRun, deleteRun, type NewRun } from './runs';
export { getSetting, setSetting } from './settings';
export { saveReadings, updateReadings, listReadings, loadReadingsText, deleteReadings, type NewReadings, type ReadingsUpdate } from './readings';
export { seedDemoIfEmpty, DEMO_PROJECT_NAME, DEMO_SEEDED_KEY, type Summarize } from './seedDemo';
export { saveKitResult, listKitResults, loadKitResult, loadKitInput, deleteKitResult, KIT_KINDS, type NewKitResult, type OpenedKitResult } from './kitResults';
