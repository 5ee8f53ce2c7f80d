import {
  cohomologyOfText,
  formatProblem,
  ModelError,
  parseFieldOption,
  readModelText,
  sectionsOfText,
  type FieldSpec,
  type Method,
} from '../shared/engine';
import { ProblemList } from '../shared/engine/model/Problem';
import { frameCommand, levelNetCommand, meshCommand, readingsCommand } from './kitCommands';
import { UsageError } from './UsageError';

export interface CliIo {
  readFile(path: string): string;
  stdout(text: string): void;
  stderr(text: string): void;
}

export const USAGE = `usage:
  gluefield cohomology FILE [--method morse|direct] [--field rational|real|prime:P] [--tolerance T] [--no-split]
  gluefield check FILE [--field rational|real|prime:P]
  gluefield sections FILE --degree K [--method morse|direct] [--field rational|real|prime:P]
  gluefield readings FILE READINGS.json [--field rational|real|prime:P]
  gluefield level-net STATIONS.csv LINES.csv [--standard first-II|second-I|second-II|third] [--c-mm C] [--critical W] [--sigma0-mm S]
  gluefield frame JOINTS.csv BARS.csv
  gluefield mesh FILE.obj|FILE.off [--field prime:2|rational] [--no-cycles]`;

/** The positional files each command takes, as named in messages. */
const FILES: Record<string, string[]> = {
  cohomology: ['FILE'],
  check: ['FILE'],
  sections: ['FILE'],
  readings: ['FILE', 'READINGS.json'],
  'level-net': ['STATIONS.csv', 'LINES.csv'],
  frame: ['JOINTS.csv', 'BARS.csv'],
  mesh: ['FILE'],
};

interface Args {
  command: string;
  file: string;
  files: string[];
  method: Method;
  field?: FieldSpec;
  degree?: number;
  split: boolean;
  standard?: string;
  cMm?: number;
  critical?: number;
  sigma0Mm?: number;
  cycles: boolean;
}

/**
 * The command line as a function: returns the exit status, writes through
 * `io`. 0 success, 2 bad input (one `error:` line, nothing on stdout),
 * 1 internal failure.
 */
export function runCli(argv: string[], io: CliIo): number {
  if (argv[0] === '--help' || argv[0] === '-h' || argv[0] === 'help') {
    io.stdout(USAGE + '\n');
    return 0;
  }
  try {
    const args = parseArgs(argv);
    const kit = kitCommand(args, io);
    if (kit !== undefined) {
      io.stdout(JSON.stringify(kit) + '\n');
      return 0;
    }
    const text = readText(io, args.file);
    // The engine reads the text itself (the simplex list straight into typed
    // arrays), so no frame here holds a large model's parsed object graph.
    const asJson = <T>(read: () => T): T => {
      try {
        return read();
      } catch (err) {
        if (err instanceof SyntaxError) throw new UsageError(`${args.file} is not valid JSON: ${oneLine(err.message)}`);
        throw err;
      }
    };
    switch (args.command) {
      case 'cohomology': {
        const report = asJson(() => cohomologyOfText(text, { method: args.method, field: args.field, splitBlocks: args.split }));
        io.stdout(JSON.stringify(report) + '\n');
        return 0;
      }
      case 'sections': {
        if (args.degree === undefined) throw new UsageError('sections needs --degree K');
        const degree = args.degree;
        const report = asJson(() => sectionsOfText(text, degree, { method: args.method, field: args.field, splitBlocks: args.split }));
        io.stdout(JSON.stringify(report) + '\n');
        return 0;
      }
      case 'check':
        return check(asJson(() => readModelText(text, { field: args.field })), io);
      default:
        throw new UsageError(`unknown command "${args.command}"`);
    }
  } catch (err) {
    if (err instanceof UsageError) {
      io.stderr(`error: ${err.message}\n`);
      return 2;
    }
    if (err instanceof ModelError) {
      io.stderr(`error: ${oneLine(err.message)}\n`);
      return 2;
    }
    if (err instanceof RangeError && /degree .* is outside/.test(err.message)) {
      io.stderr(`error: --degree: ${err.message}\n`);
      return 2;
    }
    const message = err instanceof Error ? err.message : String(err);
    io.stderr(`error: internal failure: ${oneLine(message)}\n`);
    return 1;
  }
}

/** The commands of the trade kits and readings; undefined for the model-file commands. */
function kitCommand(args: Args, io: CliIo): unknown {
  const [a, b] = args.files;
  switch (args.command) {
    case 'level-net':
      return levelNetCommand([a, b], [readText(io, a), readText(io, b)], { standard: args.standard, cMm: args.cMm, critical: args.critical, sigma0Mm: args.sigma0Mm });
    case 'frame':
      return frameCommand([a, b], [readText(io, a), readText(io, b)]);
    case 'mesh':
      return meshCommand(a, readText(io, a), { field: args.field, cycles: args.cycles });
    case 'readings':
      return readingsCommand(parseJson(readText(io, a), a), parseJson(readText(io, b), b), args.field);
    default:
      return undefined;
  }
}

function check(read: ReturnType<typeof readModelText>, io: CliIo): number {
  if (!read.sheaf) {
    io.stdout(JSON.stringify({ valid: false, problems: read.problems }) + '\n');
    io.stderr(`error: ${oneLine(formatProblem(read.problems[0]))}\n`);
    return 2;
  }
  const sheaf = read.sheaf;
  const cells = sheaf.stalkDims.map((d) => d.length);
  const cochainDims = sheaf.stalkDims.map((d) => d.reduce((a, b) => a + b, 0));
  io.stdout(
    JSON.stringify({
      valid: true,
      name: sheaf.name ?? null,
      field: sheaf.field.label,
      dimension: sheaf.complex.dimension,
      cells,
      cochainDims,
      euler: cochainDims.reduce((s, x, k) => (k % 2 === 0 ? s + x : s - x), 0),
      matrixMaps: sheaf.restriction.reduce((n, r) => n + r.filter((id) => id >= 0 && sheaf.maps[id].scalar === undefined).length, 0),
      problems: [],
    }) + '\n',
  );
  return 0;
}

function parseArgs(argv: string[]): Args {
  const [command, ...rest] = argv;
  if (!command) throw new UsageError(`no command given (${Object.keys(FILES).join(', ')}; --help lists them)`);
  const files: string[] = [];
  let standard: string | undefined;
  let cMm: number | undefined;
  let critical: number | undefined;
  let sigma0Mm: number | undefined;
  let cycles = true;
  let method: Method = 'morse';
  let fieldText: string | undefined;
  let tolerance: number | undefined;
  let degree: number | undefined;
  let split = true;
  for (let i = 0; i < rest.length; i++) {
    const a = rest[i];
    const value = () => {
      const v = rest[++i];
      if (v === undefined) throw new UsageError(`${a} needs a value`);
      return v;
    };
    if (a === '--method') {
      const m = value();
      if (m !== 'morse' && m !== 'direct') throw new UsageError(`--method: "${m}" is not morse or direct`);
      method = m;
    } else if (a === '--field') fieldText = value();
    else if (a === '--tolerance') {
      const t = Number(value());
      if (!(t > 0 && t < 1)) throw new UsageError('--tolerance must be a number between 0 and 1');
      tolerance = t;
    } else if (a === '--degree') {
      const d = value();
      if (!/^\d+$/.test(d)) throw new UsageError(`--degree: "${d}" is not a non-negative integer`);
      degree = Number(d);
    } else if (a === '--no-split') split = false;
    else if (a === '--standard') standard = value();
    else if (a === '--c-mm') {
      const c = value();
      if (!/^\d*\.?\d+([eE][+-]?\d+)?$/.test(c) || !(Number(c) > 0)) throw new UsageError(`--c-mm: "${c}" is not a positive number of millimetres`);
      cMm = Number(c);
    } else if (a === '--critical') critical = positiveNumber(a, value(), 'a positive critical value of |w|');
    else if (a === '--sigma0-mm') sigma0Mm = positiveNumber(a, value(), 'a positive number of millimetres per √km');
    else if (a === '--no-cycles') cycles = false;
    else if (a.startsWith('--')) throw new UsageError(`unknown option ${a}`);
    else files.push(a);
  }
  if (!Object.hasOwn(FILES, command)) throw new UsageError(`unknown command "${command}"`);
  const names = FILES[command];
  if (files.length > names.length) throw new UsageError(`unexpected argument "${files[names.length]}"`);
  if (files.length < names.length) {
    throw new UsageError(names.length === 1 ? `${command} needs a FILE` : `${command} needs ${names.join(' and ')}`);
  }
  let field: FieldSpec | undefined;
  if (fieldText !== undefined) {
    const problems = new ProblemList();
    field = parseFieldOption(fieldText, problems, tolerance);
    if (!field) throw new UsageError(formatProblem(problems.items[0]));
  } else if (tolerance !== undefined) {
    field = { kind: 'real', tolerance };
  }
  return { command, file: files[0], files, method, field, degree, split, standard, cMm, critical, sigma0Mm, cycles };
}

function positiveNumber(option: string, text: string, what: string): number {
  if (!/^\d*\.?\d+([eE][+-]?\d+)?$/.test(text) || !(Number(text) > 0)) throw new UsageError(`${option}: "${text}" is not ${what}`);
  return Number(text);
}

function readText(io: CliIo, file: string): string {
  try {
    return io.readFile(file);
  } catch (err) {
    const code = (err as { code?: string }).code;
    const why = code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'is a directory' : code ?? 'unreadable';
    throw new UsageError(`cannot read ${file}: ${why}`);
  }
}

function parseJson(text: string, file: string): unknown {
  try {
    return JSON.parse(text);
  } catch (err) {
    const detail = err instanceof Error ? err.message : String(err);
    throw new UsageError(`${file} is not valid JSON: ${oneLine(detail)}`);
  }
}

function oneLine(s: string): string {
  return s.replace(/\s*\n\s*/g, ' ');
}
