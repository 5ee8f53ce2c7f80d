/** The file kinds the importers read. */
export type ImportFormat = 'model' | 'csv' | 'obj' | 'off';

const EXTENSIONS: [RegExp, ImportFormat][] = [
  [/\.json$/i, 'model'],
  [/\.(csv|tsv|txt)$/i, 'csv'],
  [/\.obj$/i, 'obj'],
  [/\.off$/i, 'off'],
];
const OFF_HEADER = /^(ST)?C?N?4?n?OFF(\s|$)/;
const OBJ_STATEMENT = /^[a-z_]\w*(\s|$)/i;
const CSV_ROW = /^\s*\d+\s*([,;\t]\s*\d*\s*)*$/;
const SNIFF_LINES = 30;

/**
 * Which importer reads a file: by its name's extension (`.sheaf.json` and
 * `.json`, `.csv`/`.tsv`/`.txt`, `.obj`, `.off`), else by its first bytes.
 * Undefined when neither says.
 */
export function detectFormat(fileName: string, firstBytes: string | Uint8Array): ImportFormat | undefined {
  for (const [extension, format] of EXTENSIONS) if (extension.test(fileName)) return format;
  const text = typeof firstBytes === 'string' ? firstBytes : new TextDecoder().decode(firstBytes);
  return sniff(text.charCodeAt(0) === 0xfeff ? text.slice(1) : text);
}

function sniff(text: string): ImportFormat | undefined {
  if (text.trimStart().startsWith('{')) return 'model';
  const lines = text.split(/\r?\n|\r/, SNIFF_LINES + 1);
  // The sample may end inside a line; that line is only evidence when it is the only one.
  if (lines.length > 1) lines.pop();
  const content = lines.map((l) => l.trim()).filter((l) => l !== '' && !l.startsWith('#'));
  if (content.length === 0) return undefined;
  if (OFF_HEADER.test(content[0])) return 'off';
  // OBJ: statements that each start with a keyword, vertices among them.
  if (content.every((l) => OBJ_STATEMENT.test(l)) && content.some((l) => /^v\s/.test(l))) return 'obj';
  const rows = CSV_ROW.test(content[0]) ? content : content.slice(1);
  if (rows.length > 0 && rows.every((l) => CSV_ROW.test(l))) return 'csv';
  return undefined;
}
