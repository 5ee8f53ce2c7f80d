import { ProblemList, type Problem } from '../../engine/model/Problem';
import { parseDecimalCell, readCsvTable } from '../csv/readCsvTable';
import type { LevelLine, LevellingNet, Station } from './LevellingNet';

export type ReadNetResult = { net: LevellingNet; problems: [] } | { net: undefined; problems: Problem[] };

/**
 * Read a levelling net from `stations.csv` (`id,height`, the height in
 * metres only for fixed benchmarks) and `lines.csv`
 * (`from,to,rise,length_km`). Checks every cell and that each station has
 * a path of lines to a benchmark; never throws on bad input. `files` names
 * the two files in messages.
 */
export function readLevellingCsv(stationsText: string, linesText: string, files = { stations: 'stations.csv', lines: 'lines.csv' }): ReadNetResult {
  const problems = new ProblemList();
  const fail = (): ReadNetResult => ({ net: undefined, problems: problems.items });
  const st = readCsvTable(stationsText, files.stations, ['id', 'height'], problems);
  const ln = readCsvTable(linesText, files.lines, ['from', 'to', 'rise', 'length_km'], problems);
  if (!st || !ln) return fail();
  const stations: Station[] = [];
  const byId = new Map<string, Station>();
  for (const row of st.rows) {
    const at = `${st.file} line ${row.line}`;
    const id = row.cells.id;
    if (id === '') {
      problems.add(at, 'the station id is empty');
      continue;
    }
    if (byId.has(id)) {
      problems.add(at, `station "${id}" is listed twice (first on line ${byId.get(id)!.line})`);
      continue;
    }
    let height: number | undefined;
    if (row.cells.height !== '') {
      const h = parseDecimalCell(row.cells.height);
      if (typeof h === 'string') {
        problems.add(at, `height of station "${id}": ${h}`);
        continue;
      }
      height = h;
    }
    const s = { id, height, line: row.line };
    stations.push(s);
    byId.set(id, s);
  }
  if (stations.length === 0 && !problems.any) problems.add(st.file, 'lists no stations');
  const lines: LevelLine[] = [];
  for (const row of ln.rows) {
    const at = `${ln.file} line ${row.line}`;
    const { from, to } = row.cells;
    let ok = true;
    for (const [end, id] of [['from', from], ['to', to]] as const) {
      if (id === '') {
        problems.add(at, `"${end}" is empty`);
        ok = false;
      } else if (!byId.has(id)) {
        problems.add(at, `unknown station "${id}" (not in ${st.file})`);
        ok = false;
      }
    }
    if (ok && from === to) {
      problems.add(at, `the line starts and ends at station "${from}"`);
      ok = false;
    }
    const rise = parseDecimalCell(row.cells.rise);
    if (typeof rise === 'string') {
      problems.add(at, `rise ${rise}`);
      ok = false;
    }
    const length = parseDecimalCell(row.cells.length_km);
    if (typeof length === 'string') {
      problems.add(at, `length_km ${length}`);
      ok = false;
    } else if (!(length > 0)) {
      problems.add(at, `length_km ${length} must be positive`);
      ok = false;
    }
    if (ok) lines.push({ from, to, rise: rise as number, lengthKm: length as number, line: row.line });
  }
  if (problems.any) return fail();
  checkBenchmarks(stations, lines, st.file, problems);
  if (problems.any) return fail();
  return { net: { stations, lines }, problems: [] };
}

/** Every station must reach a benchmark along lines, or its height is not determined. */
function checkBenchmarks(stations: Station[], lines: LevelLine[], file: string, problems: ProblemList): void {
  const index = new Map(stations.map((s, i) => [s.id, i]));
  const adjacency: number[][] = stations.map(() => []);
  for (const l of lines) {
    const a = index.get(l.from)!;
    const b = index.get(l.to)!;
    adjacency[a].push(b);
    adjacency[b].push(a);
  }
  const reached = new Uint8Array(stations.length);
  const queue: number[] = [];
  stations.forEach((s, i) => {
    if (s.height !== undefined) {
      reached[i] = 1;
      queue.push(i);
    }
  });
  if (queue.length === 0) {
    problems.add(file, 'no benchmark: give the height of at least one station');
    return;
  }
  for (let q = 0; q < queue.length; q++) {
    for (const b of adjacency[queue[q]]) {
      if (!reached[b]) {
        reached[b] = 1;
        queue.push(b);
      }
    }
  }
  stations.forEach((s, i) => {
    if (!reached[i]) problems.add(`${file} line ${s.line}`, `station "${s.id}" has no path of lines to a benchmark, so its height is not determined`);
  });
}
