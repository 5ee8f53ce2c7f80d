export * from './levelling';
export * from './frame';
export * from './mesh';
export { readCsvTable, parseDecimalCell, type CsvTable, type CsvRow } from './csv/readCsvTable';
