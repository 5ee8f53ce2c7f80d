import Papa from 'papaparse';
import type { ReadingsFile } from '../engine/data/Readings';
import { READINGS_FORMAT, READINGS_VERSION } from '../engine/data/Readings';
import { ProblemList, type Problem } from '../engine/model/Problem';
import { rowLines } from './csvLayout';

/**
 * A readings CSV as a readings file of the rows that were well formed,
 * with each entry's line (from 1) and cell as written, for messages, and
 * the problems of the other rows. No `file` when nothing could be read.
 */
export interface ReadingsCsvResult {
  file?: ReadingsFile;
  lines: number[];
  cellText: string[];
  problems: Problem[];
}

const COLUMNS = ['cell', 'value', 'weight'] as const;
const VERTEX_ID = /^\d+$/;
/** Vertex ids are written `0-1-2` or `0 1 2`. */
const CELL_SEPARATOR = /[\s\-–]+/;
/** Stalk coordinates are written `1.5;-0.2` or `1.5 -0.2` (the comma separates columns). */
const VALUE_SEPARATOR = /[\s;]+/;

/**
 * Read a readings CSV: one reading per row, columns `cell,value,weight`
 * (the header row is optional; with one, columns may come in any order
 * and others are ignored; `weight` may be left out or blank for 1).
 * `cell` is the vertex ids of a cell, `value` its stalk coordinates.
 * Columns are separated by commas (tabs when the file has no comma).
 *
 * Only the file's own shape is checked here, located as `line N, field`
 * and the cell as written (bad rows are left out of `file`); whether the cells exist and the values fit
 * their stalks is {@link readReadings}'s job. Never throws on bad input.
 */
export function readReadingsCsv(text: string, name?: string): ReadingsCsvResult {
  const problems = new ProblemList();
  const normalised = (text.charCodeAt(0) === 0xfeff ? text.slice(1) : text).replace(/\r\n?/g, '\n');
  const none = (list: Problem[]): ReadingsCsvResult => ({ lines: [], cellText: [], problems: list });
  if (normalised.trim() === '') return none([{ where: 'line 1', message: 'the file is empty (expected rows of cell,value,weight)' }]);
  const delimiter = !normalised.includes(',') && normalised.includes('\t') ? '\t' : ',';
  const parsed = Papa.parse<string[]>(normalised, { delimiter, newline: '\n', header: false, skipEmptyLines: false });
  const lines = rowLines(parsed.data);
  for (const error of parsed.errors) problems.add(`line ${lines[error.row ?? 0] ?? 1}`, error.message);
  if (problems.any) return none(problems.items);

  const rows = parsed.data.map((r) => r.map((c) => c.trim()));
  const first = rows.findIndex((r) => r.some((c) => c !== ''));
  // Positions of cell, value and weight; a header may reorder them.
  let at: Record<(typeof COLUMNS)[number], number> = { cell: 0, value: 1, weight: 2 };
  let width = 3;
  let start = first;
  if (first >= 0 && !looksLikeCell(rows[first][0])) {
    const header = rows[first].map((c) => c.toLowerCase());
    const missing = COLUMNS.filter((c) => c !== 'weight' && !header.includes(c));
    if (missing.length) {
      problems.add(`line ${lines[first]}`, `the header names ${header.filter((c) => c).join(',') || 'nothing'}; it needs the column${missing.length > 1 ? 's' : ''} ${missing.map((c) => `"${c}"`).join(' and ')} (cell,value,weight)`);
      return none(problems.items);
    }
    at = { cell: header.indexOf('cell'), value: header.indexOf('value'), weight: header.indexOf('weight') };
    width = header.length;
    start = first + 1;
  }

  const values: ReadingsFile['values'] = [];
  const entryLines: number[] = [];
  const cellText: string[] = [];
  for (let r = Math.max(start, 0); r < rows.length && !problems.full; r++) {
    const row = rows[r];
    if (row.every((c) => c === '')) continue;
    const line = `line ${lines[r]}`;
    if (row.length > width && row.slice(width).some((c) => c !== '')) {
      problems.add(line, `has ${row.length} columns; a reading has ${width === 3 ? 'three (cell,value,weight)' : `the header's ${width}`}`);
      continue;
    }
    const rawCell = row[at.cell] ?? '';
    const rawValue = row[at.value] ?? '';
    const rawWeight = at.weight >= 0 ? (row[at.weight] ?? '') : '';
    const named = rawCell === '' ? '' : `, cell ${rawCell}`;
    let ok = true;
    const cell: number[] = [];
    if (rawCell === '') {
      problems.add(`${line}, cell`, 'is empty (give the vertex ids of a cell, such as 0-1)');
      ok = false;
    } else {
      for (const token of rawCell.split(CELL_SEPARATOR).filter((t) => t !== '')) {
        if (!VERTEX_ID.test(token)) {
          problems.add(`${line}, cell`, `${token === rawCell ? '' : `"${rawCell}": `}"${token}" is not a vertex id (a non-negative integer)`);
          ok = false;
          break;
        }
        cell.push(Number(token));
      }
    }
    const value = rawValue.split(VALUE_SEPARATOR).filter((t) => t !== '');
    if (value.length === 0) {
      problems.add(`${line}, value${named}`, 'is empty (give the stalk coordinates, separated by spaces or semicolons)');
      ok = false;
    }
    let weight: number | undefined;
    if (rawWeight !== '') {
      weight = Number(rawWeight);
      if (!Number.isFinite(weight) || weight <= 0 || !/^[+]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(rawWeight)) {
        problems.add(`${line}, weight${named}`, `"${rawWeight}" is not a positive number`);
        ok = false;
      }
    }
    if (!ok) continue;
    values.push(weight === undefined ? { cell, value } : { cell, value, weight });
    entryLines.push(lines[r]);
    cellText.push(rawCell);
  }
  if (values.length === 0 && !problems.any) return none([{ where: start > first ? `line ${lines[first] + 1}` : 'line 1', message: 'the file has no readings (expected rows of cell,value,weight)' }]);
  return { file: { format: READINGS_FORMAT, version: READINGS_VERSION, ...(name ? { name } : {}), values }, lines: entryLines, cellText, problems: problems.items };
}

/** A first cell like `0-1` or `3` is data; anything else starts a header. */
function looksLikeCell(c: string | undefined): boolean {
  return c !== undefined && c !== '' && c.split(CELL_SEPARATOR).every((t) => t === '' || VERTEX_ID.test(t));
}
