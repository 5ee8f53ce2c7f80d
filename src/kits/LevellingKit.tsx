import { useState } from 'react';
import { DEFAULT_CRITICAL } from '../../shared/kits/levelling/adjustLevellingNet';
import { DEFAULT_STANDARD_KEY, LEVELLING_STANDARDS } from '../../shared/kits/levelling/LevellingStandard';
import type { LevelNetResult, LevelNetSettings } from '../compute/kitService';
import { Button } from '../ui/Button';
import { engine } from '../workers/engineClient';
import { DEMO, DEMO_LEVELLING_SIGMA0_MM, type NamedText } from './demoFiles';
import { download, stem, toCsv } from './download';
import { FilePick, readPicked } from './FilePick';
import { Figure, KitReport } from './KitReport';
import { KitStatus } from './KitStatus';
import { LevelNetSketch } from './LevelNetSketch';
import { useKitRun } from './useKitRun';

const mm = (m: number) => (m * 1000).toFixed(1);

/** Levelling net: stations and lines in, adjusted heights, residuals and loop misclosures against a tolerance out. */
export function LevellingKit() {
  const [stations, setStations] = useState<NamedText>();
  const [lines, setLines] = useState<NamedText>();
  const [standard, setStandard] = useState(DEFAULT_STANDARD_KEY);
  const [cMm, setCMm] = useState(String(LEVELLING_STANDARDS.find((s) => s.key === DEFAULT_STANDARD_KEY)!.cMm));
  const [critical, setCritical] = useState(String(DEFAULT_CRITICAL));
  const [sigma0, setSigma0] = useState('');
  const { state, start } = useKitRun<LevelNetResult>();

  const settings = (over: { sigma0?: string } = {}): LevelNetSettings => {
    const s0 = (over.sigma0 ?? sigma0).trim();
    // Empty fields fall back to the defaults; anything else is checked by the service and reported as a problem.
    const test = { critical: critical.trim() === '' ? undefined : Number(critical), sigma0Mm: s0 === '' ? undefined : Number(s0) };
    return standard === 'custom' ? { standard, cMm: Number(cMm), ...test } : { standard, ...test };
  };
  const compute = (s: NamedText | undefined, l: NamedText | undefined, set: LevelNetSettings = settings()) => {
    if (!s || !l) return;
    start(() => engine().levelNet(s.name, s.text, l.name, l.text, set));
  };
  const pickStations = async (f: File) => {
    const s = await readPicked(f);
    setStations(s);
    compute(s, lines);
  };
  const pickLines = async (f: File) => {
    const l = await readPicked(f);
    setLines(l);
    compute(stations, l);
  };

  return (
    <div className="space-y-4">
      <div className="no-print flex flex-wrap items-end gap-3">
        <FilePick label="Stations (id, height; optional x, y)" accept=".csv,.tsv,.txt,text/csv" testId="stations-input" file={stations} onFile={pickStations} />
        <FilePick label="Lines (from, to, rise, length_km)" accept=".csv,.tsv,.txt,text/csv" testId="lines-input" file={lines} onFile={pickLines} />
        <div className="flex flex-col gap-1 text-sm">
          <label className="flex flex-col gap-0.5">
            <span className="text-xs text-ink-soft">Tolerance standard</span>
            <select
              aria-label="Tolerance standard"
              className="rounded border border-rule bg-sheet px-2 py-1"
              value={standard}
              onChange={(e) => {
                setStandard(e.target.value);
                const listed = LEVELLING_STANDARDS.find((s) => s.key === e.target.value);
                if (listed) {
                  setCMm(String(listed.cMm));
                  compute(stations, lines, { ...settings(), standard: listed.key, cMm: undefined });
                }
              }}
            >
              {LEVELLING_STANDARDS.map((s) => (
                <option key={s.key} value={s.key}>
                  {s.name} (c = {s.cMm} mm)
                </option>
              ))}
              <option value="custom">project tolerance…</option>
            </select>
          </label>
          <label className="flex items-center gap-1">
            <span className="text-xs text-ink-soft">c (mm per √km)</span>
            <input
              aria-label="c in millimetres"
              className="num w-20 rounded border border-rule bg-sheet px-1 py-0.5"
              value={cMm}
              onChange={(e) => {
                setCMm(e.target.value);
                setStandard('custom');
              }}
            />
          </label>
        </div>
        <div className="flex flex-col gap-1 text-sm">
          <label className="flex items-center gap-1">
            <span className="w-36 text-xs text-ink-soft">critical |w|</span>
            <input aria-label="critical value of w" className="num w-20 rounded border border-rule bg-sheet px-1 py-0.5" value={critical} onChange={(e) => setCritical(e.target.value)} />
          </label>
          <label className="flex items-center gap-1">
            <span className="w-36 text-xs text-ink-soft">a-priori σ0 (mm per √km)</span>
            <input
              aria-label="a-priori sigma0 in millimetres"
              placeholder="from the adjustment"
              className="num w-20 rounded border border-rule bg-sheet px-1 py-0.5"
              value={sigma0}
              onChange={(e) => setSigma0(e.target.value)}
            />
          </label>
        </div>
        <div className="flex flex-col gap-1">
          <Button tone="primary" disabled={!stations || !lines} onClick={() => compute(stations, lines)} data-testid="levelling-compute">
            Adjust the net
          </Button>
          <Button
            onClick={() => {
              setStations(DEMO.stations);
              setLines(DEMO.lines);
              setSigma0(DEMO_LEVELLING_SIGMA0_MM);
              compute(DEMO.stations, DEMO.lines, settings({ sigma0: DEMO_LEVELLING_SIGMA0_MM }));
            }}
          >
            Load the invented ridge-line demo
          </Button>
        </div>
      </div>
      <KitStatus state={state} what="The levelling net" />
      {state.status === 'done' && stations && lines && <LevellingResult result={state.result} files={[stations, lines]} />}
    </div>
  );
}

function LevellingResult({ result, files }: { result: LevelNetResult; files: NamedText[] }) {
  const r = result.report;
  const inputs = files.map((f) => f.name);
  const name = stem(inputs[1]);
  const failing = r.loops.filter((l) => !l.ok).length;
  const isFlagged = (x: { w: number | null }) => x.w !== null && Math.abs(x.w) > r.test.critical;
  const exportCsv = () => {
    const rows: (string | number | boolean | null)[][] = [];
    for (const [id, h] of Object.entries(r.heights)) rows.push(['height', id, '', h, '', '', '', '']);
    r.residuals.forEach((x) => {
      rows.push(['residual', x.from, x.to, x.residual, '', '', '', isFlagged(x) ? 'flag' : 'ok', x.redundancy, x.w]);
    });
    for (const l of r.loops) rows.push(['loop', l.stations.join(' '), '', '', l.misclosure_mm, l.length_km, l.allowable_mm, l.ok ? 'ok' : 'flag']);
    for (const l of r.traverses) rows.push(['traverse', l.stations.join(' '), '', '', l.misclosure_mm, l.length_km, l.allowable_mm, l.ok ? 'ok' : 'flag']);
    rows.push(['sigma0', '', '', r.sigma0, '', '', '', '']);
    rows.push(['dof', '', '', r.dof, '', '', '', '']);
    rows.push(['standard', r.standard.name, r.standard.rule, r.standard.c_mm, '', '', '', '']);
    rows.push(['residual_test', r.test.name, `sigma0 ${r.test.sigma0_source}`, r.test.sigma0_mm === null ? '' : r.test.sigma0_mm / 1000, '', '', '', '', '', r.test.critical]);
    download(`${name}-levelling.csv`, toCsv(['kind', 'station_or_from', 'to', 'metres', 'misclosure_mm', 'length_km', 'allowable_mm', 'check', 'redundancy', 'w'], rows), 'text/csv');
  };
  return (
    <KitReport
      title="Levelling net: adjusted heights and misclosures"
      inputs={inputs}
      settings={[
        ['standard', `${r.standard.name}: ${r.standard.rule} (c = ${r.standard.c_mm} mm)`],
        ['source', r.standard.source],
        ['weights', r.weights],
        ['residual test', `${r.test.name}: |w| > ${r.test.critical}, σ0 = ${r.test.sigma0_mm === null ? 'none' : `${r.test.sigma0_mm.toFixed(2)} mm per √km`} (${r.test.sigma0_source})`],
        ['test source', r.test.source],
      ]}
      kitCaution={r.caution}
      onJson={() => download(`${name}-levelling.json`, JSON.stringify(r, null, 2), 'application/json')}
      onCsv={exportCsv}
      save={{
        kit: 'levelling',
        name: `Levelling net: ${inputs[1]}`,
        summary: `${result.stations.length} stations · ${result.lines.length} lines · dof ${r.dof} · ${failing} of ${r.loops.length} loops over tolerance · ${r.flagged.length} line${r.flagged.length === 1 ? '' : 's'} flagged`,
        settings: { standard: r.standard.key, c_mm: r.standard.c_mm, critical: r.test.critical, sigma0_mm: r.test.sigma0_mm, sigma0_source: r.test.sigma0_source },
        inputs: files.map((f) => ({ name: f.name, data: f.text })),
        report: r,
      }}
    >
      <div className="flex flex-wrap gap-2">
        <Figure label="stations" value={String(result.stations.length)} />
        <Figure label="lines" value={String(result.lines.length)} />
        <Figure label="loops" value={String(r.loops.length)} testId="levelling-loop-count" />
        <Figure label="loops over tolerance" value={String(failing)} tone={failing ? 'odds' : 'glued'} testId="levelling-loops-failing" />
        <Figure label="flagged lines" value={String(r.flagged.length)} tone={r.flagged.length ? 'odds' : 'glued'} testId="levelling-flag-count" />
        <Figure label="a-posteriori σ0 (mm, 1 km)" value={r.sigma0 === null ? '— (dof 0)' : mm(r.sigma0)} testId="levelling-sigma0" />
        <Figure label="degrees of freedom" value={String(r.dof)} testId="levelling-dof" />
        <Figure label="Σ redundancy numbers" value={r.test.redundancy_sum.toFixed(3)} testId="levelling-redundancy-sum" />
        <Figure label="largest |w|" value={r.test.largest ? `${Math.abs(r.test.largest.w).toFixed(2)} (${r.test.largest.from} → ${r.test.largest.to})` : '—'} testId="levelling-largest-w" />
      </div>
      {r.test.note && (
        <p role="status" className="rounded border border-rule bg-rule-soft p-2 text-sm" data-testid="levelling-test-note">
          {r.test.note}.
        </p>
      )}
      <LevelNetSketch result={result} />
      {r.flagged.length > 0 && (
        <p className="rounded border border-odds bg-odds-soft p-2 text-sm" data-testid="levelling-flagged">
          Flagged by the standardised residual test (|w| &gt; {r.test.critical}; look at the largest |w| first, re-observe or drop it, and adjust again):{' '}
          {r.flagged.map((f) => (
            <span key={f.line} className="num mr-3">
              {f.from} → {f.to} (line {f.line}) w = {f.w.toFixed(2)}, residual {f.residual_mm.toFixed(1)} mm, r = {f.redundancy.toFixed(2)}
            </span>
          ))}
        </p>
      )}
      <div className="grid gap-4 lg:grid-cols-2">
        <Table caption="Adjusted heights" head={['station', 'height (m)', '']}>
          {result.stations.map((s) => (
            <tr key={s.id}>
              <td className="num">{s.id}</td>
              <td className="num text-right">{r.heights[s.id].toFixed(4)}</td>
              <td className="text-xs text-ink-soft">{s.benchmark ? 'benchmark (fixed)' : ''}</td>
            </tr>
          ))}
        </Table>
        <Table caption="Residuals (adjusted − observed rise), redundancy numbers r and standardised residuals w" head={['from', 'to', 'residual (mm)', 'r', 'σv (mm)', 'w', 'check']} testId="levelling-residuals">
          {r.residuals.map((x, i) => {
            const bad = isFlagged(x);
            return (
              <tr key={i} className={bad ? 'bg-odds-soft' : ''}>
                <td className="num">{x.from}</td>
                <td className="num">{x.to}</td>
                <td className="num text-right">{mm(x.residual)}</td>
                <td className="num text-right">{x.redundancy.toFixed(3)}</td>
                <td className="num text-right">{x.sd_mm === null ? '—' : x.sd_mm.toFixed(1)}</td>
                <td className="num text-right">{x.w === null ? '—' : x.w.toFixed(2)}</td>
                <td className={x.w === null ? 'text-ink-soft' : bad ? 'text-odds' : 'text-glued'}>{x.w === null ? (x.redundancy === 0 ? 'unchecked (r = 0)' : 'not tested') : bad ? 'flag' : 'ok'}</td>
              </tr>
            );
          })}
        </Table>
      </div>
      <Table caption="Loops and benchmark runs: misclosure against c·√K" head={['', 'stations', 'length (km)', 'misclosure (mm)', 'allowable (mm)', 'check']} testId="levelling-loops">
        {[...r.loops.map((l) => ['loop', l] as const), ...r.traverses.map((l) => ['run', l] as const)].map(([kind, l], i) => (
          <tr key={i} className={l.ok ? '' : 'bg-odds-soft'}>
            <td className="text-xs text-ink-soft">{kind}</td>
            <td className="num text-xs">{l.stations.join(' → ')}</td>
            <td className="num text-right">{l.length_km.toFixed(2)}</td>
            <td className="num text-right">{l.misclosure_mm.toFixed(1)}</td>
            <td className="num text-right">{l.allowable_mm.toFixed(1)}</td>
            <td className={l.ok ? 'text-glued' : 'text-odds'}>{l.ok ? 'ok' : 'flag'}</td>
          </tr>
        ))}
      </Table>
    </KitReport>
  );
}

/** A compact results table. */
export function Table({ caption, head, children, testId }: { caption: string; head: string[]; children: React.ReactNode; testId?: string }) {
  return (
    <div className="overflow-auto rounded border border-rule bg-sheet">
      <table className="w-full text-sm" data-testid={testId}>
        <caption className="border-b border-rule px-2 py-1 text-left text-xs font-semibold">{caption}</caption>
        <thead>
          <tr className="text-left text-xs text-ink-soft">
            {head.map((h, i) => (
              <th key={i} className="px-2 py-0.5 font-normal">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="[&_td]:px-2 [&_td]:py-0.5">{children}</tbody>
      </table>
    </div>
  );
}
