import { MODEL_FORMAT, type ModelFile, type Problem } from '../engine';
import type { ImportResult } from './ImportResult';

/**
 * Parse the text of a Gluefield model file (`*.sheaf.json`). Checks only
 * that it is JSON and carries the format tag; everything else is left to
 * the engine's `readModel`, which locates problems by JSON path.
 */
export function importModelText(text: string): ImportResult {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  if (body.trim() === '') return fail({ where: 'line 1', message: 'the file is empty' });
  let json: unknown;
  try {
    json = JSON.parse(body);
  } catch (error) {
    return fail(syntaxProblem(body, error));
  }
  if (typeof json !== 'object' || json === null || Array.isArray(json)) {
    return fail({ where: '', message: 'the model file must hold a JSON object' });
  }
  const format = (json as { format?: unknown }).format;
  if (format !== MODEL_FORMAT) {
    const got = format === undefined ? 'no "format" field' : JSON.stringify(format);
    return fail({ where: 'format', message: `expected "${MODEL_FORMAT}", got ${got}` });
  }
  return { model: json as ModelFile };
}

function fail(problem: Problem): ImportResult {
  return { problems: [problem] };
}

/**
 * Locate a JSON syntax error from the engine's message: V8 gives
 * `(line L column C)` or `at position P`, Firefox `at line L column C`;
 * otherwise the problem is unlocated.
 */
function syntaxProblem(text: string, error: unknown): Problem {
  const raw = error instanceof Error ? error.message : String(error);
  const detail = raw.replace(/\s*\(line \d+ column \d+\)|\s*at position \d+|\s*at line \d+ column \d+ of the JSON data/g, '');
  const message = `not valid JSON: ${detail}`;
  const lineColumn = /line (\d+) column (\d+)/.exec(raw);
  if (lineColumn) return { where: `line ${lineColumn[1]}, column ${lineColumn[2]}`, message };
  const position = /position (\d+)/.exec(raw);
  // "Unexpected end of JSON input" has no position: the end is the place.
  const end = /end of (JSON|data)/i.test(raw);
  if (position || end) {
    const at = position ? Math.min(Number(position[1]), text.length) : text.trimEnd().length;
    let line = 1;
    let lineStart = 0;
    for (let i = text.indexOf('\n'); i >= 0 && i < at; i = text.indexOf('\n', i + 1)) {
      line++;
      lineStart = i + 1;
    }
    return { where: `line ${line}, column ${at - lineStart + 1}`, message };
  }
  return { where: '', message };
}
