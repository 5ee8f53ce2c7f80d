import type { Readings, ReadingsFile } from '../engine/data/Readings';
import { readReadings } from '../engine/data/readReadings';
import type { Problem } from '../engine/model/Problem';
import type { Sheaf } from '../engine/model/Sheaf';
import { readReadingsCsv } from './readingsCsv';

export type ReadReadingsTextResult = { readings: Readings; file: ReadingsFile; problems: [] } | { readings: undefined; problems: Problem[] };

/**
 * A readings file as the user gave it, checked against a sheaf: a
 * `gluefield.readings` JSON file (by a `.json` name or a leading `{`), else
 * a readings CSV ({@link readReadingsCsv}). CSV problems are located by
 * line, field and the cell as written in the row; JSON problems by their
 * path (`values[3].value`). The file comes back in the JSON form, which is
 * what gets stored.
 */
export function readReadingsText(fileName: string, text: string, sheaf: Sheaf<unknown>): ReadReadingsTextResult {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const asJson = /\.json$/i.test(fileName) || (!/\.(csv|tsv|txt)$/i.test(fileName) && body.trimStart().startsWith('{'));
  if (asJson) {
    let json: unknown;
    try {
      json = JSON.parse(body);
    } catch (err) {
      return { readings: undefined, problems: [{ where: fileName, message: `not valid JSON: ${(err as Error).message}` }] };
    }
    const read = readReadings(json, sheaf);
    return read.readings ? { readings: read.readings, file: json as ReadingsFile, problems: [] } : read;
  }
  const csv = readReadingsCsv(body, fileName.replace(/\.(csv|tsv|txt)$/i, ''));
  if (!csv.file) return { readings: undefined, problems: csv.problems };
  // The well-formed rows are checked against the sheaf too, so one pass shows every bad row.
  const read = readReadings(csv.file, sheaf);
  if (read.readings && csv.problems.length === 0) return { readings: read.readings, file: csv.file, problems: [] };
  const all = [...csv.problems, ...read.problems.map((p) => relocate(p, csv.lines, csv.cellText))];
  return { readings: undefined, problems: all.sort((a, b) => lineOf(a) - lineOf(b)).slice(0, 50) };
}

function lineOf(p: Problem): number {
  const m = /^line (\d+)/.exec(p.where);
  return m ? Number(m[1]) : 0;
}

const PATH = /^values\[(\d+)\]\.(cell|value|weight)(?:\[(\d+)\])?$/;

/** `values[i].value[j]` becomes `line L, value (coordinate j+1), cell 0-1`, and `values[k]` in a message `line M`: the user wrote lines, not a JSON list. */
function relocate(p: Problem, lines: number[], cells: string[]): Problem {
  const message = p.message.replace(/values\[(\d+)\]/g, (_, k: string) => `line ${lines[Number(k)]}`);
  const m = PATH.exec(p.where);
  if (!m) return { where: p.where, message };
  const i = Number(m[1]);
  if (m[2] === 'cell') return { where: `line ${lines[i]}, cell ${cells[i]}`, message };
  const field = m[3] === undefined ? m[2] : `${m[2]} (coordinate ${Number(m[3]) + 1})`;
  return { where: `line ${lines[i]}, ${field}, cell ${cells[i]}`, message };
}
