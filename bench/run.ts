/**
 * `npm run bench`: Morse reduction against the direct method and against
 * the floor of a plain JSON.parse of the same model, measured in one run.
 * Each case runs in a child process (its own heap and peak RSS).
 */
import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { CaseSpec } from './benchCase';

const here = fileURLToPath(new URL('.', import.meta.url));
const quick = process.argv.includes('--quick');
// `--only TEXT`: just the cases whose name contains TEXT (the browser mesh case is "mesh kit torus 10^6").
const onlyAt = process.argv.indexOf('--only');
const only = onlyAt >= 0 ? process.argv[onlyAt + 1] : undefined;
const wanted = (name: string) => only === undefined || name.includes(only);
const MESH_CASE = 'mesh kit torus 10^6, GF(2), with cycles';
const DIRECT_CAP_MS = quick ? 20_000 : 90_000;

interface Row {
  name: string;
  morse: Result;
  direct?: Result;
  blockOnly?: Result;
}
interface Result {
  ok: boolean;
  capped?: boolean;
  bytes?: number;
  parseMs: number;
  totalMs?: number;
  peakMB: number;
  report?: {
    dims: number[];
    cells: number[];
    cochainDims: number[];
    ms: { build: number; reduce: number; solve: number; total: number };
    morse?: { criticalCells: number[]; criticalCochainDims: number[]; rounds: number; blockCriticalCochainDims: number[]; smallestPivot?: number };
  };
}

function runCase(spec: CaseSpec): Result {
  const out = execFileSync(process.execPath, ['--import', 'tsx', '--max-old-space-size=4096', `${here}benchCase.ts`, JSON.stringify(spec)], {
    encoding: 'utf8',
    maxBuffer: 1 << 26,
  });
  return JSON.parse(out.trim().split('\n').pop() as string) as Result;
}

const prime = { kind: 'prime', p: 1000003 } as const;
const real = { kind: 'real' } as const;
const rational = { kind: 'rational' } as const;
type F = CaseSpec['field'];
const cases: { name: string; kind: CaseSpec['kind']; cells: number; dim: number; field: F; direct: boolean }[] = [];
const sizes = quick ? [1e4, 1e5] : [1e4, 1e5, 1e6];
for (const cells of sizes) {
  for (const dim of [1, 3]) {
    cases.push({ name: `torus ${fmt(cells)} d=${dim} prime`, kind: 'torus', cells, dim, field: prime, direct: cells <= 1e5 });
    cases.push({ name: `torus ${fmt(cells)} d=${dim} real`, kind: 'torus', cells, dim, field: real, direct: cells <= 1e5 });
    if (cells <= 1e5) cases.push({ name: `torus ${fmt(cells)} d=${dim} rational`, kind: 'torus', cells, dim, field: rational, direct: cells <= 1e4 || dim === 1 });
  }
}
cases.push({ name: 'rank-deficient 10^4 rational', kind: 'quotient', cells: 1e4, dim: 0, field: rational, direct: true });
cases.push({ name: 'rank-deficient 10^5 prime', kind: 'quotient', cells: 1e5, dim: 0, field: prime, direct: true });

const rows: Row[] = [];
for (const c of cases.filter((x) => wanted(x.name))) {
  const base = { kind: c.kind, cells: c.cells, dim: c.dim, field: c.field, capMs: DIRECT_CAP_MS };
  const morse = runCase({ ...base, method: 'morse' });
  const direct = c.direct ? runCase({ ...base, method: 'direct' }) : undefined;
  const blockOnly = c.kind === 'quotient' ? runCase({ ...base, method: 'morse', split: false }) : undefined;
  rows.push({ name: c.name, morse, direct, blockOnly });
  process.stderr.write(`done: ${c.name}\n`);
}

// The mesh kit on 10^6 triangles in headless Chromium, against the same kit in Node in the same process run.
interface MeshBrowser {
  triangles: number;
  nodeMs: number;
  nodeReadMs: number;
  nodeNoCyclesMs: number;
  cycles: string[];
  cyclesSkipped: boolean;
  readBarPositions: number;
  browserMs: number;
  kitMsInWorker: number | null;
  ratio: number;
  longestTaskMs: number;
  peakMB: number;
  idleMB: number;
  betti: string;
  cancelMs: number | null;
  saveMs: number;
}
let meshBrowser: MeshBrowser | undefined;
if (!quick && wanted(MESH_CASE) && existsSync(process.env.CHROMIUM_PATH ?? '/usr/bin/chromium')) {
  const out = execFileSync(process.execPath, ['--import', 'tsx', `${here}browserMesh.ts`, '--json'], { encoding: 'utf8', maxBuffer: 1 << 26, stdio: ['ignore', 'pipe', 'ignore'] });
  meshBrowser = JSON.parse(out.trim().split('\n').pop() as string) as MeshBrowser;
  process.stderr.write('done: mesh kit 10^6 triangles in the browser\n');
}

const sum = (v: number[]) => v.reduce((a, b) => a + b, 0);
const lines: string[] = [];
lines.push('| case | cells | critical cells | rounds | parse ms | build | reduce | solve | Morse total ms | direct ms | direct / Morse | Morse / parse | peak MB | critical dims (block only → split) |');
lines.push('|---|---|---|---|---|---|---|---|---|---|---|---|---|---|');
for (const r of rows) {
  const m = r.morse.report!;
  const total = r.morse.totalMs!;
  const direct = r.direct ? (r.direct.ok ? r.direct.totalMs! : undefined) : undefined;
  const directText = r.direct ? (r.direct.ok ? ms(direct!) : `> ${ms(DIRECT_CAP_MS)} (capped)`) : 'not run';
  const ratio = direct !== undefined ? `${(direct / total).toFixed(1)}×` : r.direct ? `> ${(DIRECT_CAP_MS / total).toFixed(0)}×` : '–';
  const blockDims = r.blockOnly?.report?.morse?.criticalCochainDims ?? m.morse!.blockCriticalCochainDims;
  lines.push(
    `| ${r.name} | ${sum(m.cells)} | ${m.morse!.criticalCells.join(', ')} | ${m.morse!.rounds} | ${ms(r.morse.parseMs)} | ${ms(m.ms.build)} | ${ms(m.ms.reduce)} | ${ms(m.ms.solve)} | ${ms(total)} | ${directText} | ${ratio} | ${(total / r.morse.parseMs).toFixed(1)}× | ${r.morse.peakMB.toFixed(0)} | ${blockDims.join(', ')} → ${m.morse!.criticalCochainDims.join(', ')} |`,
  );
}
if (rows.length) console.log(lines.join('\n'));
if (meshBrowser) {
  const m = meshBrowser;
  console.log('');
  console.log('| case | triangles | Node ms (read + kit with cycles) | Node read ms | Node ms without cycles | browser ms (file → Betti on screen) | kit in the worker ms | browser / Node | longest main-thread task ms | Chromium peak MB (idle) | save to project ms | cancel ms | bar positions during the read |');
  console.log('|---|---|---|---|---|---|---|---|---|---|---|---|---|');
  console.log(`| ${MESH_CASE} | ${m.triangles} | ${ms(m.nodeMs)} | ${ms(m.nodeReadMs)} | ${ms(m.nodeNoCyclesMs)} | ${ms(m.browserMs)} | ${m.kitMsInWorker === null ? '?' : ms(m.kitMsInWorker)} | ${m.ratio.toFixed(2)}× | ${m.longestTaskMs} | ${m.peakMB} (${m.idleMB}) | ${ms(m.saveMs)} | ${m.cancelMs ?? '—'} | ${m.readBarPositions} |`);
}

// The targets this machine is held to.
const checks: [string, boolean][] = [];
const find = (name: string) => rows.find((r) => r.name === name);
const t5 = find('torus 10^5 d=3 prime');
if (t5?.direct) {
  const d = t5.direct.ok ? t5.direct.totalMs! : Infinity;
  checks.push([`10^5 torus d=3: direct / Morse = ${(d / t5.morse.totalMs!).toFixed(1)} ≥ 20`, d / t5.morse.totalMs! >= 20]);
}
for (const name of ['torus 10^6 d=3 prime', 'torus 10^6 d=3 real']) {
  const r = find(name);
  if (!r) continue;
  const m = r.morse;
  checks.push([`${name}: Morse total ${ms(m.totalMs!)} < 10 s`, m.totalMs! < 10_000]);
  checks.push([`${name}: Morse / JSON.parse = ${(m.totalMs! / m.parseMs).toFixed(1)} < 10`, m.totalMs! / m.parseMs < 10]);
  checks.push([`${name}: peak ${m.peakMB.toFixed(0)} MB < 2048 MB`, m.peakMB < 2048]);
  const crit = m.report!.morse!.criticalCochainDims.join(',');
  checks.push([`${name}: critical cochain dims ${crit} = 3,6,3`, crit === '3,6,3']);
}
for (const r of rows.filter((x) => x.blockOnly)) {
  const block = sum(r.blockOnly!.report!.morse!.criticalCochainDims);
  const split = sum(r.morse.report!.morse!.criticalCochainDims);
  checks.push([`${r.name}: split ${split} ≤ half of block-only ${block}`, split * 2 <= block]);
}
for (const r of rows) {
  if (r.direct?.ok) checks.push([`${r.name}: Morse dims = direct dims`, r.direct.report!.dims.join() === r.morse.report!.dims.join()]);
}
if (meshBrowser) {
  const m = meshBrowser;
  checks.push([`mesh 10^6 in the browser: Betti ${m.betti} = (1, 2, 1)`, m.betti === '(1, 2, 1)']);
  checks.push([`mesh 10^6 in the browser: ${m.cycles.length} representative cycles on screen = 3`, !m.cyclesSkipped && m.cycles.length === 3]);
  checks.push([`mesh 10^6 in the browser: the bar moved ${m.readBarPositions} times while the file was read ≥ 5`, m.readBarPositions >= 5]);
  checks.push([`mesh 10^6 in the browser: longest main-thread task ${m.longestTaskMs} ms < 200 ms`, m.longestTaskMs < 200]);
  checks.push([`mesh 10^6 in the browser: cancel stops it in ${m.cancelMs ?? '—'} ms < 2000 ms`, m.cancelMs !== null && m.cancelMs < 2000]);
}
console.log('');
for (const [text, ok] of checks) console.log(`${ok ? 'PASS' : 'FAIL'}  ${text}`);

function ms(x: number): string {
  return x >= 1000 ? `${(x / 1000).toFixed(2)} s` : `${x.toFixed(1)}`;
}
function fmt(cells: number): string {
  return `10^${Math.round(Math.log10(cells))}`;
}
