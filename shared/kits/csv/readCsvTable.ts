import Papa from 'papaparse';
import type { ProblemList } from '../../engine/model/Problem';
import { guessDelimiter, rowLines } from '../../import/csvLayout';

/** One data row of a CSV table: its line in the file and its cells by (lower-case) column name. */
export interface CsvRow {
  line: number;
  cells: Record<string, string>;
}

export interface CsvTable {
  /** The file name used in messages. */
  file: string;
  columns: string[];
  rows: CsvRow[];
}


/**
 * Read a CSV table with a header row: column names are trimmed and
 * lower-cased, cells trimmed, blank lines skipped, unknown columns kept
 * (and ignored by the kits). The delimiter is a comma, semicolon or tab,
 * whichever the first lines use most. Missing `required` columns and
 * malformed quoting are reported as located problems, never thrown.
 */
export function readCsvTable(text: string, file: string, required: string[], problems: ProblemList): CsvTable | undefined {
  const normalised = (text.charCodeAt(0) === 0xfeff ? text.slice(1) : text).replace(/\r\n?/g, '\n');
  const parsed = Papa.parse<string[]>(normalised, { delimiter: guessDelimiter(normalised), newline: '\n', header: false, skipEmptyLines: false });
  const lines = rowLines(parsed.data);
  for (const error of parsed.errors) problems.add(`${file} line ${lines[error.row ?? 0] ?? 1}`, error.message);
  if (problems.any) return undefined;
  let headerRow = -1;
  for (let r = 0; r < parsed.data.length; r++) {
    if (parsed.data[r].some((c) => c.trim() !== '')) {
      headerRow = r;
      break;
    }
  }
  if (headerRow < 0) {
    problems.add(file, `the file is empty (expected a header row: ${required.join(',')})`);
    return undefined;
  }
  const columns = parsed.data[headerRow].map((c) => c.trim().toLowerCase());
  const seen = new Set<string>();
  for (const c of columns) {
    if (c !== '' && seen.has(c)) problems.add(`${file} line ${lines[headerRow]}`, `column "${c}" appears twice in the header`);
    seen.add(c);
  }
  const missing = required.filter((c) => !seen.has(c));
  if (missing.length) {
    problems.add(`${file} line ${lines[headerRow]}`, `missing column${missing.length > 1 ? 's' : ''} ${missing.map((c) => `"${c}"`).join(', ')} (the header has ${columns.filter((c) => c).join(',') || 'no names'})`);
  }
  if (problems.any) return undefined;
  const rows: CsvRow[] = [];
  for (let r = headerRow + 1; r < parsed.data.length; r++) {
    const raw = parsed.data[r].map((c) => c.trim());
    if (raw.every((c) => c === '')) continue;
    if (raw.length > columns.length && raw.slice(columns.length).some((c) => c !== '')) {
      problems.add(`${file} line ${lines[r]}`, `has ${raw.length} cells, the header ${columns.length}`);
      continue;
    }
    const cells: Record<string, string> = {};
    columns.forEach((c, i) => {
      if (c !== '') cells[c] = raw[i] ?? '';
    });
    rows.push({ line: lines[r], cells });
  }
  return { file, columns, rows };
}

const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * A finite decimal number from a cell, or a message saying why not (a
 * decimal comma gets its own hint: the comma is the column separator).
 */
export function parseDecimalCell(cell: string): number | string {
  if (cell === '') return 'is empty';
  if (!DECIMAL.test(cell)) {
    if (/^[+-]?\d+,\d+$/.test(cell)) return `"${cell}" is not a number (use a decimal point, not a comma)`;
    return `"${cell}" is not a number`;
  }
  const x = Number(cell);
  return Number.isFinite(x) ? x : `"${cell}" is too large`;
}
