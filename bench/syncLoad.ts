/**
 * Bounded sync load on loopback: `npx tsx bench/syncLoad.ts [--clients 50] [--seconds 20]`.
 *
 * Starts the server in a child process on a fresh SQLite file, signs in
 * CLIENTS editors spread over a few shared projects, and lets each push and
 * pull for SECONDS: new documents, edits of shared documents from the
 * version it last saw (so conflicts happen), and re-sends of an earlier
 * push as if its answer had been lost (which must change nothing). Then
 * checks the server's history against what the clients were told:
 * - lost: an accepted change whose version or revision is missing, or a
 *   document whose final content is not its last accepted change;
 * - duplicated: a change applied twice (a second version or revision for
 *   one change id), or a document delivered twice at one revision by pull;
 * and reports the error rate and latency percentiles.
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { ChangeInput, PullResponse, PushResponse } from '../shared/sync/types';

const arg = (name: string, fallback: number) => {
  const i = process.argv.indexOf(`--${name}`);
  return i > 0 ? Number(process.argv[i + 1]) : fallback;
};
const CLIENTS = arg('clients', 50);
const SECONDS = arg('seconds', 20);
const PROJECTS = Math.max(1, Math.round(CLIENTS / 10));
const SHARED_DOCS = 8;
const root = fileURLToPath(new URL('..', import.meta.url));

interface Sample { op: 'push' | 'pull'; ms: number; ok: boolean }
const samples: Sample[] = [];
/** Every accepted change the clients were told about, by project and change id. */
const acceptedLog = new Map<string, Map<string, { docId: string; version: number; revision: number; body: string }>>();
let replays = 0;
let replayMismatches = 0;
let conflicts = 0;
let pullDuplicates = 0;

async function main() {
  const dir = mkdtempSync(join(tmpdir(), 'gluefield-load-'));
  const child = spawn(process.execPath, ['--import', 'tsx', join(root, 'bench/syncLoadServer.ts')], {
    cwd: root,
    env: { ...process.env, GLUEFIELD_DB: join(dir, 'load.sqlite'), GLUEFIELD_SEED_DEMO: '0', BCRYPT_ROUNDS: '6', SMTP_SINK: '1', SMTP_PORT: '0', RATE_LIMIT_LOGIN: '100000' },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  let output = '';
  child.stdout.on('data', (chunk: Buffer) => {
    output += chunk.toString();
  });
  const port = await new Promise<number>((resolve, reject) => {
    child.once('exit', (code) => reject(new Error(`server exited with ${code}`)));
    const poll = setInterval(() => {
      const m = /PORT (\d+)/.exec(output);
      if (m) {
        clearInterval(poll);
        resolve(Number(m[1]));
      }
    }, 20);
  });
  const base = `http://127.0.0.1:${port}/api`;
  try {
    const { projects, tokens } = await setUp(base);
    console.log(`${CLIENTS} clients in ${PROJECTS} projects, ${SECONDS} s, server pid ${child.pid}`);
    const deadline = Date.now() + SECONDS * 1000;
    const started = Date.now();
    await Promise.all(tokens.map((token, i) => runClient(base, token, projects[i % PROJECTS], i, deadline)));
    const elapsed = (Date.now() - started) / 1000;
    const { lost, duplicated } = await verify(base, tokens, projects);
    report(elapsed, lost, duplicated);
  } finally {
    child.removeAllListeners('exit');
    // 'exit' can come before the last of the child's stdout (its STATS line) has been read; 'close' comes after.
    const exited = new Promise((r) => child.once('close', r));
    child.kill('SIGTERM');
    await exited;
    rmSync(dir, { recursive: true, force: true });
  }
  serverStats(output);
}

async function call<T>(base: string, method: string, path: string, token: string | null, body?: unknown): Promise<{ status: number; body: T }> {
  const res = await fetch(`${base}${path}`, {
    method,
    headers: { 'Content-Type': 'application/json', ...(token ? { Authorization: `Bearer ${token}` } : {}) },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  return { status: res.status, body: (res.status === 204 ? null : await res.json()) as T };
}

async function setUp(base: string) {
  const password = 'load-test-password-1';
  const tokens: string[] = [];
  for (let i = 0; i < CLIENTS; i++) {
    const r = await call<{ accessToken: string }>(base, 'POST', '/auth/register', null, { email: `client${i}@load.test`, password, name: `Client ${i}` });
    if (r.status !== 201) throw new Error(`register ${r.status}`);
    tokens.push(r.body.accessToken);
  }
  const projects: string[] = [];
  for (let p = 0; p < PROJECTS; p++) {
    const owner = tokens[p];
    const r = await call<{ id: string }>(base, 'POST', '/projects', owner, { name: `Load ${p}` });
    projects.push(r.body.id);
    for (let i = p; i < CLIENTS; i += PROJECTS) {
      if (i === p) continue;
      const m = await call(base, 'POST', `/projects/${r.body.id}/members`, owner, { email: `client${i}@load.test`, role: 'editor' });
      if (m.status !== 201) throw new Error(`add member ${m.status}`);
    }
  }
  return { projects, tokens };
}

async function timed<T>(op: Sample['op'], work: () => Promise<{ status: number; body: T }>): Promise<{ status: number; body: T } | null> {
  const t0 = performance.now();
  try {
    const r = await work();
    samples.push({ op, ms: performance.now() - t0, ok: r.status < 400 });
    return r;
  } catch {
    samples.push({ op, ms: performance.now() - t0, ok: false });
    return null;
  }
}

async function runClient(base: string, token: string, projectId: string, me: number, deadline: number) {
  const known = new Map<string, number>(); // docId → version this client last saw
  let since = 0;
  let seq = 0;
  let lastPush: ChangeInput[] | null = null;
  let lastAnswer: PushResponse | null = null;
  const log = acceptedLog.get(projectId) ?? new Map();
  acceptedLog.set(projectId, log);
  const seen = new Set<string>(); // docId@revision delivered by pull

  while (Date.now() < deadline) {
    const dice = Math.random();
    if (dice < 0.4) {
      let more = true;
      while (more) {
        const r = await timed('pull', () => call<PullResponse>(base, 'GET', `/projects/${projectId}/changes?since=${since}&limit=200`, token));
        if (!r || r.status !== 200) break;
        for (const d of r.body.changes) {
          const key = `${d.docId}@${d.revision}`;
          if (seen.has(key)) pullDuplicates++;
          seen.add(key);
          known.set(d.docId, d.version);
        }
        since = r.body.revision;
        more = r.body.more;
      }
    } else if (dice < 0.47 && lastPush && lastAnswer) {
      // The answer to the last push "was lost": send it again; nothing may change.
      const again = await timed('push', () => call<PushResponse>(base, 'POST', `/projects/${projectId}/changes`, token, { changes: lastPush }));
      if (again?.status === 200) {
        replays++;
        if (JSON.stringify(again.body.accepted) !== JSON.stringify(lastAnswer.accepted)) replayMismatches++;
      }
    } else {
      const changes: ChangeInput[] = [];
      const count = 1 + Math.floor(Math.random() * 4);
      for (let k = 0; k < count; k++) {
        const changeId = `c${me}-${++seq}`;
        const shared = Math.random() < 0.5;
        const docId = shared ? `shared-${Math.floor(Math.random() * SHARED_DOCS)}` : `own-${me}-${seq}`;
        if (changes.some((c) => c.docId === docId)) continue;
        changes.push({ changeId, docId, kind: 'note', baseVersion: shared ? known.get(docId) ?? 0 : 0, body: { by: me, changeId, text: 'x'.repeat(200) } });
      }
      const r = await timed('push', () => call<PushResponse>(base, 'POST', `/projects/${projectId}/changes`, token, { changes }));
      if (r?.status === 200) {
        lastPush = changes;
        lastAnswer = r.body;
        for (const a of r.body.accepted) {
          const body = JSON.stringify(changes.find((c) => c.changeId === a.changeId)!.body);
          log.set(a.changeId, { docId: a.docId, version: a.version, revision: a.revision, body });
          known.set(a.docId, a.version);
        }
        for (const c of r.body.conflicts) {
          conflicts++;
          known.set(c.docId, c.server?.version ?? 0);
        }
      }
    }
  }
}

async function verify(base: string, tokens: string[], projects: string[]) {
  let lost = 0;
  let duplicated = 0;
  for (const [p, projectId] of projects.entries()) {
    const log = acceptedLog.get(projectId) ?? new Map();
    const docs = new Map<string, { version: number; body: unknown }>();
    let since = 0;
    let revision = 0;
    for (let more = true; more; ) {
      const r = await call<PullResponse>(base, 'GET', `/projects/${projectId}/changes?since=${since}&limit=1000`, tokens[p]);
      for (const d of r.body.changes) docs.set(d.docId, { version: d.version, body: d.body });
      since = revision = r.body.revision;
      more = r.body.more;
    }
    // Every applied change owns one revision: revisions 1..R each exactly once.
    const revisions = [...log.values()].map((a) => a.revision).sort((a, b) => a - b);
    const distinct = new Set(revisions);
    duplicated += revisions.length - distinct.size;
    for (let r = 1; r <= revision; r++) if (!distinct.has(r)) lost++;
    // Per document: versions 1..final each exactly once, and the final content is the last accepted change's.
    const byDoc = new Map<string, { version: number; body: string }[]>();
    for (const a of log.values()) byDoc.set(a.docId, [...(byDoc.get(a.docId) ?? []), a]);
    for (const [docId, list] of byDoc) {
      const server = docs.get(docId);
      if (!server) {
        lost += list.length;
        continue;
      }
      const versions = new Set(list.map((a) => a.version));
      duplicated += list.length - versions.size;
      for (let v = 1; v <= server.version; v++) if (!versions.has(v)) lost++;
      const last = list.find((a) => a.version === server.version);
      if (!last || last.body !== JSON.stringify(server.body)) lost++;
    }
  }
  return { lost, duplicated: duplicated + pullDuplicates + replayMismatches };
}

function percentile(sorted: number[], q: number): number {
  if (!sorted.length) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil(q * sorted.length) - 1)];
}

function report(elapsed: number, lost: number, duplicated: number) {
  const applied = [...acceptedLog.values()].reduce((s, m) => s + m.size, 0);
  const line = (label: string, list: Sample[]) => {
    const ms = list.map((s) => s.ms).sort((a, b) => a - b);
    const errors = list.filter((s) => !s.ok).length;
    return `${label.padEnd(6)} ${String(list.length).padStart(7)} requests  ${(list.length / elapsed).toFixed(0).padStart(5)}/s  errors ${((100 * errors) / Math.max(1, list.length)).toFixed(2)}%  p50 ${percentile(ms, 0.5).toFixed(1)} ms  p95 ${percentile(ms, 0.95).toFixed(1)} ms  p99 ${percentile(ms, 0.99).toFixed(1)} ms  max ${ms[ms.length - 1]?.toFixed(1)} ms`;
  };
  console.log(line('all', samples));
  console.log(line('push', samples.filter((s) => s.op === 'push')));
  console.log(line('pull', samples.filter((s) => s.op === 'pull')));
  console.log(`applied changes ${applied}, conflicts ${conflicts}, replayed pushes ${replays}`);
  console.log(`lost changes ${lost}, duplicated changes ${duplicated}`);
  if (lost || duplicated || samples.some((s) => !s.ok)) process.exitCode = 1;
}

/** What the server itself spent per request (from its STATS line): the rest of the client's latency is queueing and the load generator. */
function serverStats(output: string) {
  const m = /STATS (.*)/.exec(output);
  if (!m) return;
  const { handling, stallMs } = JSON.parse(m[1]) as { handling: Record<string, number[]>; stallMs: number };
  for (const [route, list] of Object.entries(handling)) {
    if (!/changes/.test(route)) continue;
    const ms = list.sort((a, b) => a - b);
    console.log(`server ${route}: ${ms.length} handled, p50 ${percentile(ms, 0.5).toFixed(1)} ms, p99 ${percentile(ms, 0.99).toFixed(1)} ms`);
  }
  console.log(`server: longest event-loop stall ${stallMs.toFixed(0)} ms`);
}

await main();
