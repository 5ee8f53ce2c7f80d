import { useState } from 'react';
import type { FrameResult } from '../compute/kitService';
import { Button } from '../ui/Button';
import { engine } from '../workers/engineClient';
import { DEMO, type NamedText } from './demoFiles';
import { download, stem, toCsv } from './download';
import { FilePick, readPicked } from './FilePick';
import { FrameSketch, type FrameView } from './FrameSketch';
import { Figure, KitReport } from './KitReport';
import { KitStatus } from './KitStatus';
import { Table } from './LevellingKit';
import { useKitRun } from './useKitRun';

/** Frame check: joints and bars in; mechanisms, self-stress states and the classification out. */
export function FrameKit() {
  const [joints, setJoints] = useState<NamedText>();
  const [bars, setBars] = useState<NamedText>();
  const { state, start } = useKitRun<FrameResult>();
  const compute = (j: NamedText | undefined, b: NamedText | undefined) => {
    if (j && b) start(() => engine().frameCheck(j.name, j.text, b.name, b.text));
  };
  const demo = (b: NamedText) => {
    setJoints(DEMO.joints);
    setBars(b);
    compute(DEMO.joints, b);
  };
  return (
    <div className="space-y-4">
      <div className="no-print flex flex-wrap items-end gap-3">
        <FilePick
          label="Joints (id, x, y[, z][, fixed])"
          accept=".csv,.tsv,.txt,text/csv"
          testId="joints-input"
          file={joints}
          onFile={async (f) => {
            const j = await readPicked(f);
            setJoints(j);
            compute(j, bars);
          }}
        />
        <FilePick
          label="Bars (id, from, to)"
          accept=".csv,.tsv,.txt,text/csv"
          testId="bars-input"
          file={bars}
          onFile={async (f) => {
            const b = await readPicked(f);
            setBars(b);
            compute(joints, b);
          }}
        />
        <div className="flex flex-col gap-1">
          <Button tone="primary" disabled={!joints || !bars} onClick={() => compute(joints, bars)}>
            Check the frame
          </Button>
          <Button onClick={() => demo(DEMO.bars)}>Load the invented footbridge</Button>
          <Button onClick={() => demo(DEMO.barsExtra)}>…with a counter-diagonal</Button>
        </div>
      </div>
      <KitStatus state={state} what="The frame" />
      {state.status === 'done' && joints && bars && <FrameResultView key={`${joints.name}|${bars.name}`} result={state.result} files={[joints, bars]} />}
    </div>
  );
}

function FrameResultView({ result, files }: { result: FrameResult; files: NamedText[] }) {
  const r = result.report;
  const inputs = files.map((f) => f.name);
  const [view, setView] = useState<FrameView>(r.selfStressStates.length ? { kind: 'selfStress', index: 0 } : r.mechanismModes.length ? { kind: 'mechanism', index: 0 } : { kind: 'none' });
  const name = stem(inputs[1]);
  const viewKey = view.kind === 'none' ? 'none' : `${view.kind}:${view.index}`;
  const exportCsv = () => {
    const rows: (string | number)[][] = [];
    r.selfStressStates.forEach((s, k) => {
      for (const [bar, f] of Object.entries(s)) rows.push(['self-stress', k + 1, bar, f, '', '', '']);
    });
    r.mechanismModes.forEach((m, k) => {
      for (const [joint, v] of Object.entries(m)) rows.push(['mechanism', k + 1, joint, '', v[0] ?? '', v[1] ?? '', v[2] ?? '']);
    });
    rows.push(['dims', '', 'H0', r.dims[0], '', '', '']);
    rows.push(['dims', '', 'H1', r.dims[1], '', '', '']);
    download(`${name}-frame.csv`, toCsv(['kind', 'state', 'bar_or_joint', 'force', 'dx', 'dy', 'dz'], rows), 'text/csv');
  };
  return (
    <KitReport
      title="Frame check: mechanisms and states of self-stress"
      inputs={inputs}
      settings={[
        ['model', `${r.dimension === 2 ? 'plane' : 'space'} pin-jointed frame, ${r.joints} joints, ${r.bars} bars, ${r.constraints} support constraints`],
        ['arithmetic', `floating point${r.numericallyUncertain ? ' — rank decisions near the tolerance: numerically uncertain' : ''}`],
      ]}
      kitCaution={r.caution}
      onJson={() => download(`${name}-frame.json`, JSON.stringify(r, null, 2), 'application/json')}
      onCsv={exportCsv}
      save={{
        kit: 'frame',
        name: `Frame check: ${inputs[1]}`,
        summary: `${r.joints} joints · ${r.bars} bars · m = ${r.mechanisms}, s = ${r.selfStresses} · ${r.classification.summary}`,
        settings: { dimension: r.dimension, arithmetic: 'floating point' },
        inputs: files.map((f) => ({ name: f.name, data: f.text })),
        report: r,
      }}
    >
      <div className="flex flex-wrap gap-2">
        <Figure label="dims [H⁰, H¹]" value={`[${r.dims.join(', ')}]`} testId="frame-dims" />
        <Figure label="mechanisms m" value={String(r.mechanisms)} tone={r.mechanisms ? 'odds' : 'glued'} testId="frame-mechanisms" />
        <Figure label="rigid-body motions" value={String(r.rigidMotions)} />
        <Figure label="self-stresses s" value={String(r.selfStresses)} testId="frame-self-stresses" />
        <Figure label="Maxwell–Calladine m − s" value={String(r.maxwellCalladine.count)} />
      </div>
      {r.numericallyUncertain && (
        <p role="status" className="rounded border border-odds bg-odds-soft p-2 text-sm text-odds">
          Numerically uncertain: a rank decision fell close to the tolerance.
        </p>
      )}
      <div className="rounded border border-rule bg-sheet p-3 text-sm">
        <p className="font-semibold" data-testid="frame-classification">
          {r.classification.summary}
        </p>
        <p className="num mt-1 text-xs">{r.maxwellCalladine.formula}</p>
        <p className="mt-1 text-ink-soft" data-testid="frame-explanation">
          {r.maxwellCalladine.agrees ? '' : 'The count alone is not the answer here. '}
          {r.maxwellCalladine.explanation}
        </p>
      </div>
      <figure className="rounded border border-rule bg-sheet p-2">
        <div className="no-print mb-1 flex items-center gap-2 text-sm">
          <label htmlFor="frame-view" className="text-xs text-ink-soft">
            Show
          </label>
          <select
            id="frame-view"
            className="rounded border border-rule bg-sheet px-2 py-0.5"
            value={viewKey}
            onChange={(e) => {
              const [kind, i] = e.target.value.split(':');
              setView(kind === 'none' ? { kind: 'none' } : { kind: kind as 'mechanism' | 'selfStress', index: Number(i) });
            }}
          >
            <option value="none">the frame only</option>
            {r.selfStressStates.map((_, k) => (
              <option key={`s${k}`} value={`selfStress:${k}`}>
                self-stress state {k + 1}
              </option>
            ))}
            {r.mechanismModes.map((_, k) => (
              <option key={`m${k}`} value={`mechanism:${k}`}>
                mechanism {k + 1}
              </option>
            ))}
          </select>
        </div>
        <FrameSketch result={result} view={view} />
        <figcaption className="text-xs text-ink-soft">
          △ support (○○ roller) · <span className="text-glued">—— tension</span> · <span className="text-odds">- - compression</span> (line width ∝ force; a state is defined up to its overall sign) ·{' '}
          <span className="text-odds">→ mechanism displacement</span>
        </figcaption>
      </figure>
      {view.kind === 'selfStress' && (
        <Table caption={`Self-stress state ${view.index + 1}: bar force coefficients`} head={['bar', 'coefficient', '']}>
          {Object.entries(r.selfStressStates[view.index]).map(([bar, f]) => (
            <tr key={bar}>
              <td className="num">{bar}</td>
              <td className="num text-right">{f.toFixed(4)}</td>
              <td className="text-xs text-ink-soft">{Math.abs(f) < 1e-9 ? '' : f > 0 ? 'tension' : 'compression'}</td>
            </tr>
          ))}
        </Table>
      )}
      {view.kind === 'mechanism' && (
        <Table caption={`Mechanism ${view.index + 1}: joint displacements`} head={['joint', 'displacement']}>
          {Object.entries(r.mechanismModes[view.index]).map(([joint, v]) => (
            <tr key={joint}>
              <td className="num">{joint}</td>
              <td className="num">({v.map((x) => x.toFixed(4)).join(', ')})</td>
            </tr>
          ))}
        </Table>
      )}
    </KitReport>
  );
}
