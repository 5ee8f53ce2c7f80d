import Papa from 'papaparse';
import { ProblemList } from '../engine/model/Problem';
import { constantSheafModel } from './constantSheafModel';
import type { ImportOptions, ImportResult } from './ImportResult';
import { guessDelimiter, rowLines } from './csvLayout';

/** A simplex of dimension 7 has 8 vertices; wider rows are almost surely a wrong file. */
const MAX_COLUMNS = 8;
const INTEGER = /^[+-]?\d+$/;
const VERTEX_ID = /^\d+$/;

/**
 * Read a CSV list of simplices, one per row, each row the vertex ids of
 * one simplex (1 to 8 cells; blank trailing cells are allowed), as the
 * constant sheaf on their closure. The delimiter is a comma, semicolon or
 * tab, whichever the first lines use most; a first row that is not all
 * integers is a header and skipped.
 *
 * Never throws on bad input: up to 50 problems come back located by line
 * and column (columns count cells from 1).
 */
export function importSimplexCsv(text: string, options: ImportOptions = {}): ImportResult {
  const problems = new ProblemList();
  // One line ending throughout, so that line numbers can be counted from the rows.
  const normalised = (text.charCodeAt(0) === 0xfeff ? text.slice(1) : text).replace(/\r\n?/g, '\n');
  if (normalised.trim() === '') {
    problems.add('line 1', 'the file is empty');
    return { problems: problems.items };
  }
  const parsed = Papa.parse<string[]>(normalised, {
    delimiter: guessDelimiter(normalised),
    newline: '\n',
    header: false,
    skipEmptyLines: false,
  });
  const rows = parsed.data;
  const lines = rowLines(rows);
  for (const error of parsed.errors) {
    problems.add(`line ${lines[error.row ?? 0] ?? 1}`, error.message);
  }

  const simplices: number[][] = [];
  let first = true;
  let header = false;
  for (let r = 0; r < rows.length && !problems.full; r++) {
    const cells = rows[r].map((c) => c.trim());
    let width = cells.length;
    while (width > 0 && cells[width - 1] === '') width--;
    if (width === 0) continue;
    if (first) {
      first = false;
      if (!cells.every((c) => c === '' || INTEGER.test(c))) {
        header = true;
        continue;
      }
    }
    const line = `line ${lines[r]}`;
    if (width > MAX_COLUMNS) {
      problems.add(line, `a row lists at most ${MAX_COLUMNS} vertices (one 7-simplex), this one has ${width} columns`);
      continue;
    }
    const simplex = readRow(cells, width, line, problems);
    if (simplex) simplices.push(simplex);
  }
  if (!problems.any && simplices.length === 0) {
    problems.add(header ? 'line 2' : 'line 1', header ? 'the file has a header row but no simplices' : 'the file is empty');
  }
  if (problems.any) return { problems: problems.items };
  return { model: constantSheafModel(simplices, options) };
}

/** The vertex ids of one row, or undefined after reporting every bad cell. */
function readRow(cells: string[], width: number, line: string, problems: ProblemList): number[] | undefined {
  const simplex: number[] = [];
  let ok = true;
  for (let c = 0; c < width; c++) {
    const cell = cells[c];
    const id = VERTEX_ID.test(cell) ? Number(cell) : NaN;
    let message: string | undefined;
    if (cell === '') message = 'blank cell before the last vertex id of the row';
    else if (!Number.isSafeInteger(id)) message = `${JSON.stringify(cell)} is not a vertex id`;
    else if (simplex.includes(id)) message = `vertex ${id} appears twice in the row`;
    if (message) {
      problems.add(`${line}, column ${c + 1}`, message);
      ok = false;
    } else simplex.push(id);
  }
  return ok ? simplex : undefined;
}
