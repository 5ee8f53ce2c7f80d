/** Column separators a CSV from a spreadsheet or a field logger may use. */
export const CSV_DELIMITERS = [',', ';', '\t'] as const;

/** The line (from 1) where each parsed row starts: quoted cells may hold line breaks. */
export function rowLines(rows: string[][]): number[] {
  const lines = new Array<number>(rows.length);
  let line = 1;
  for (let r = 0; r < rows.length; r++) {
    lines[r] = line;
    line++;
    for (const cell of rows[r]) for (let i = cell.indexOf('\n'); i >= 0; i = cell.indexOf('\n', i + 1)) line++;
  }
  return lines;
}

/** The candidate used most often in the first lines; a comma when none is (one-column files). */
export function guessDelimiter(text: string): string {
  const sample = text.split('\n', 40).filter((l) => l.trim() !== '').slice(0, 20).join('\n');
  let best: string = CSV_DELIMITERS[0];
  let bestCount = 0;
  for (const d of CSV_DELIMITERS) {
    const count = sample.split(d).length - 1;
    if (count > bestCount) {
      best = d;
      bestCount = count;
    }
  }
  return best;
}
