export type { ImportOptions, ImportResult } from './ImportResult';
export { importSimplexCsv } from './simplexCsv';
export { importObj } from './meshObj';
export { importOff } from './meshOff';
export { importModelText } from './modelFileText';
export { detectFormat, type ImportFormat } from './detectFormat';
export { importAny } from './importAny';
export { constantSheafModel } from './constantSheafModel';
