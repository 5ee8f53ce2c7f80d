import { detectFormat } from './detectFormat';
import type { ImportOptions, ImportResult } from './ImportResult';
import { importObj } from './meshObj';
import { importOff } from './meshOff';
import { importModelText } from './modelFileText';
import { importSimplexCsv } from './simplexCsv';

/** Enough of a file's start to tell the formats apart. */
const SNIFF_CHARS = 4096;

/**
 * Import a file of any supported kind, chosen by {@link detectFormat}. The
 * name defaults to the file name without its extension. A model file keeps
 * its own name, field and stalks: the options only shape imported meshes
 * and simplex lists.
 */
export function importAny(fileName: string, text: string, options: ImportOptions = {}): ImportResult {
  const format = detectFormat(fileName, text.slice(0, SNIFF_CHARS));
  const named: ImportOptions = { ...options, name: options.name ?? baseName(fileName) };
  switch (format) {
    case 'model':
      return importModelText(text);
    case 'csv':
      return importSimplexCsv(text, named);
    case 'obj':
      return importObj(text, named);
    case 'off':
      return importOff(text, named);
    case undefined:
      return {
        problems: [
          { where: '', message: `cannot tell the kind of "${fileName}": expected a .sheaf.json model, a CSV of simplices, or an OBJ or OFF mesh` },
        ],
      };
  }
}

function baseName(fileName: string): string | undefined {
  const name = fileName.replace(/^.*[\\/]/, '').replace(/(\.sheaf)?\.[^.]*$/i, '');
  return name === '' ? undefined : name;
}
