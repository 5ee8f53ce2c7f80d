import type { RunRecord } from '../compute/computeService';
import { Button } from '../ui/Button';
import { Cautions } from '../ui/Cautions';
import { download } from './ModelShelf';
import { ReductionChart } from './ReductionChart';

export interface BasisChoice {
  degree: number;
  index: number;
}

/** What a run found: dimensions, what they mean, reduction statistics, bases, export. */
export function Findings({ run, modelName, chosen, onChoose }: { run: RunRecord; modelName: string; chosen?: BasisChoice; onChoose(c: BasisChoice | undefined): void }) {
  if (run.status !== 'done' || !run.report) {
    return (
      <section className="p-3 text-sm" aria-label="Findings">
        <p className="text-odds">This run did not finish: {run.error ?? run.status}.</p>
      </section>
    );
  }
  const r = run.report;
  const h0 = r.dims[0] ?? 0;
  const h1 = r.dims[1];
  const before = r.cochainDims;
  const after = r.morse?.criticalCochainDims ?? r.cochainDims;
  return (
    <section aria-label="Findings" className="space-y-3 p-3 text-sm">
      <h2 className="text-xs font-semibold tracking-wide text-ink-soft uppercase">Findings</h2>
      <p data-testid="findings-headline" className={`rounded px-2 py-1.5 ${h1 ? 'bg-odds-soft' : 'bg-glued-soft'}`}>
        {h0 === 0 ? 'No non-zero global section: the local values cannot be glued except as zero.' : `${h0} independent global section${h0 === 1 ? '' : 's'} (free parameters of a consistent state).`}{' '}
        {h1 === undefined ? '' : h1 === 0 ? 'No obstruction in degree 1.' : `${h1} independent obstruction${h1 === 1 ? '' : 's'} in degree 1 (misclosures, redundancies or self-stresses).`}
      </p>
      <table className="num w-full text-xs" data-testid="findings-dims">
        <thead className="text-ink-faint">
          <tr>
            <th className="text-left font-normal">degree</th>
            <th className="text-right font-normal">dim H</th>
            <th className="text-right font-normal">cells</th>
            <th className="text-right font-normal">cochains</th>
            <th className="text-right font-normal">critical</th>
          </tr>
        </thead>
        <tbody>
          {r.dims.map((d, k) => (
            <tr key={k}>
              <td>H^{k}</td>
              <td className={`text-right font-semibold ${k > 0 && d > 0 ? 'text-odds' : 'text-glued'}`} data-testid={`dim-${k}`}>
                {d}
              </td>
              <td className="text-right">{r.cells[k].toLocaleString()}</td>
              <td className="text-right">{r.cochainDims[k].toLocaleString()}</td>
              <td className="text-right">{r.morse ? `${r.morse.criticalCells[k]} (${r.morse.criticalCochainDims[k]})` : '–'}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {r.morse && <ReductionChart before={before} after={after} />}
      <dl className="grid grid-cols-[8rem_1fr] gap-y-0.5 text-xs">
        <dt className="text-ink-faint">field · method</dt>
        <dd className="num">
          {r.field} · {r.method}
          {run.settings.splitBlocks && r.method === 'morse' ? ' + split blocks' : ''}
        </dd>
        {r.morse && (
          <>
            <dt className="text-ink-faint">rounds</dt>
            <dd className="num">{r.morse.rounds}</dd>
          </>
        )}
        {r.morse?.smallestPivot !== undefined && (
          <>
            <dt className="text-ink-faint">smallest pairing pivot</dt>
            <dd className="num">{r.morse.smallestPivot.toExponential(2)}</dd>
          </>
        )}
        {r.smallestPivot !== undefined && (
          <>
            <dt className="text-ink-faint">smallest solve pivot</dt>
            <dd className="num">{r.smallestPivot.toExponential(2)} (relative)</dd>
          </>
        )}
        {r.numericallyUncertain && (
          <>
            <dt className="text-odds">numerics</dt>
            <dd className="text-odds">uncertain: a rank decision was close to the tolerance</dd>
          </>
        )}
        <dt className="text-ink-faint">time</dt>
        <dd className="num">
          {Math.round(run.ms)} ms (build {r.ms.build}, reduce {r.ms.reduce}, solve {r.ms.solve})
        </dd>
        <dt className="text-ink-faint">provenance</dt>
        <dd className="num truncate" title={run.modelHash}>
          model v{run.modelVersion} · {run.modelHash.slice(0, 10)} · engine {run.engineVersion} · {new Date(run.createdAt).toLocaleString()}
        </dd>
      </dl>
      {run.bases && run.bases.length > 0 && (
        <div>
          <p className="mb-1 text-xs text-ink-soft">Show a basis vector on the sketch and in the ledger:</p>
          <div className="flex flex-wrap gap-1">
            {run.bases.flatMap((b) =>
              Array.from({ length: b.dim }, (_, i) => {
                const on = chosen?.degree === b.degree && chosen.index === i;
                return (
                  <button
                    key={`${b.degree}-${i}`}
                    aria-pressed={on}
                    onClick={() => onChoose(on ? undefined : { degree: b.degree, index: i })}
                    className={`num rounded border px-1.5 text-xs ${on ? 'border-glued bg-glued text-white' : 'border-rule hover:bg-rule-soft'}`}
                  >
                    H^{b.degree} #{i + 1}
                  </button>
                );
              }),
            )}
          </div>
        </div>
      )}
      <div className="no-print flex gap-2">
        <Button onClick={() => exportJson(run, modelName)}>Export JSON</Button>
        <Button onClick={() => exportCsv(run, modelName)} disabled={!run.bases?.length}>
          Export CSV
        </Button>
        <Button onClick={() => window.print()}>Print report</Button>
      </div>
      <Cautions compact />
    </section>
  );
}

function exportJson(run: RunRecord, name: string) {
  const body = {
    model: name,
    modelVersion: run.modelVersion,
    modelHash: run.modelHash,
    engineVersion: run.engineVersion,
    settings: run.settings,
    createdAt: new Date(run.createdAt).toISOString(),
    report: run.report,
    bases: run.bases?.map((b) => ({ degree: b.degree, dim: b.dim, values: b.values.map((v) => Array.from(v)) })),
  };
  download(`${slug(name)}-findings.json`, JSON.stringify(body, null, 2), 'application/json');
}

function exportCsv(run: RunRecord, name: string) {
  const lines = ['degree,basis,coordinate,value'];
  for (const b of run.bases ?? []) b.values.forEach((v, i) => v.forEach((x, j) => lines.push(`${b.degree},${i + 1},${j},${x}`)));
  download(`${slug(name)}-bases.csv`, lines.join('\n') + '\n', 'text/csv');
}

function slug(s: string) {
  return s.replace(/[^\w.-]+/g, '_');
}
