/**
 * One benchmark case in its own process, so its peak memory is its own.
 * argv: JSON {kind, cells, dim, field, method, capMs}; prints one JSON line.
 */
import { cohomology, Cancelled, type ModelFile } from '../shared/engine';
import { constantTorus, torusSizeFor } from './torusModel';
import { quotientTorus } from './quotientModel';

export interface CaseSpec {
  kind: 'torus' | 'quotient';
  cells: number;
  dim: number;
  field: NonNullable<ModelFile['field']>;
  method: 'morse' | 'direct';
  capMs: number;
  split?: boolean;
}

const spec = JSON.parse(process.argv[2]) as CaseSpec;
const n = torusSizeFor(spec.cells);
// Only the text survives: a generated model object left alive would sit in the
// heap and be traced by every collection, charging the engine for the generator.
const text = JSON.stringify(spec.kind === 'torus' ? constantTorus(n, spec.dim, spec.field) : quotientTorus(n, spec.field));
// Parse twice and keep the faster: the floor is the parser's speed, not its warm-up.
let parseMs = Infinity;
for (let i = 0; i < 3; i++) {
  const t = performance.now();
  JSON.parse(text);
  parseMs = Math.min(parseMs, performance.now() - t);
}
const rssBefore = process.memoryUsage().rss;
const deadline = performance.now() + spec.capMs;
// Morse runs three times and keeps the fastest (the first ones pay for JIT warm-up);
// the direct method runs once, under the cap.
const runs = spec.method === 'morse' ? 3 : 1;
try {
  let best: { totalMs: number; report: ReturnType<typeof cohomology> } | undefined;
  for (let i = 0; i < runs; i++) {
    const t = performance.now();
    // Parsed inline and handed over, as the command line does: the engine drops
    // the parsed file once read, and no frame here keeps it alive.
    const report = cohomology(JSON.parse(text), {
      method: spec.method,
      splitBlocks: spec.split,
      control: { shouldStop: () => performance.now() > deadline },
    });
    const totalMs = performance.now() - t;
    if (!best || totalMs < best.totalMs) best = { totalMs, report };
  }
  process.stdout.write(
    JSON.stringify({
      ok: true,
      bytes: text.length,
      parseMs,
      totalMs: best!.totalMs,
      report: best!.report,
      peakMB: process.resourceUsage().maxRSS / 1024,
      baseMB: rssBefore / 2 ** 20,
    }) + '\n',
  );
} catch (err) {
  if (!(err instanceof Cancelled)) throw err;
  process.stdout.write(JSON.stringify({ ok: false, capped: true, parseMs, peakMB: process.resourceUsage().maxRSS / 1024 }) + '\n');
}
