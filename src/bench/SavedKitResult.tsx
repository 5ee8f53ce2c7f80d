import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import type { FrameReport, LevellingReport, MeshReport } from '../../shared/kits';
import { appDb } from '../app/db';
import { meshCaution } from '../kits/meshCaution';
import { download, stem } from '../kits/download';
import { deleteKitResult, loadKitInput, loadKitResult, type OpenedKitResult } from '../store';
import { Button } from '../ui/Button';
import { Cautions } from '../ui/Cautions';
import { KIT_NAMES } from './KitShelf';

/** A kit result kept in the project: what went in, what came out, and where it came from. */
export function SavedKitResult({ projectId, id }: { projectId: string; id: string }) {
  const qc = useQueryClient();
  const navigate = useNavigate();
  const saved = useQuery({ queryKey: ['kitResult', id], queryFn: () => loadKitResult(appDb(), id) });
  if (saved.isError) return <p className="p-4 text-odds">This kit result could not be opened: {(saved.error as Error).message}</p>;
  const r = saved.data;
  if (!r) return <p className="p-4 text-ink-soft">Opening the kit result…</p>;
  const remove = async () => {
    await deleteKitResult(appDb(), r.id);
    await qc.invalidateQueries({ queryKey: ['kitResults', projectId] });
    navigate(`/p/${projectId}`);
  };
  return (
    <article aria-label="Saved kit result" className="h-full space-y-3 overflow-auto p-4" data-testid="saved-kit-result">
      <header className="border-b border-rule pb-2">
        <p className="text-xs text-ink-soft">{KIT_NAMES[r.kit]}</p>
        <h2 className="text-base font-semibold">{r.name}</h2>
        <p className="num text-sm" data-testid="saved-kit-summary">
          {r.summary}
        </p>
        <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 text-xs" data-testid="saved-kit-provenance">
          <dt className="text-ink-soft">computed by</dt>
          <dd>Gluefield engine {r.engineVersion}</dd>
          <dt className="text-ink-soft">saved</dt>
          <dd>{new Date(r.createdAt).toLocaleString()}</dd>
          {r.inputs.map((f) => (
            <div key={f.name} className="contents">
              <dt className="text-ink-soft">input</dt>
              <dd className="num">
                {f.name} · {f.bytes.toLocaleString('en')} bytes · SHA-256 {f.hash.slice(0, 12)}…
              </dd>
            </div>
          ))}
          {Object.entries(r.settings).map(([k, v]) => (
            <div key={k} className="contents">
              <dt className="text-ink-soft">{k}</dt>
              <dd className="num">{v === null ? '—' : String(v)}</dd>
            </div>
          ))}
        </dl>
      </header>
      <Headline saved={r} />
      <div className="no-print flex flex-wrap gap-2">
        <Button onClick={() => download(`${stem(r.inputs[r.inputs.length - 1].name)}-${r.kit}.json`, JSON.stringify(r.report, null, 2), 'application/json')} data-testid="saved-kit-export">
          Export the report (JSON)
        </Button>
        {r.inputs.map((f, i) => (
          <Button key={f.name} onClick={() => void loadKitInput(appDb(), r.id, i).then((text) => download(f.name, text, 'text/plain'))}>
            Download {f.name}
          </Button>
        ))}
        <Button tone="quiet" onClick={() => void remove()}>
          Delete from project
        </Button>
      </div>
      <p className="rounded border border-rule bg-sheet p-2 text-xs text-ink-soft" data-testid="kit-caution">
        {kitCaution(r)}
      </p>
      <Cautions compact />
    </article>
  );
}

function kitCaution(r: OpenedKitResult): string {
  if (r.kit === 'mesh') return meshCaution((r.report as MeshReport).field);
  return (r.report as { caution?: string }).caution ?? '';
}

/** The figures a reader looks for first, per kit. */
function Headline({ saved }: { saved: OpenedKitResult }) {
  if (saved.kit === 'levelling') {
    const r = saved.report as LevellingReport;
    return (
      <div className="space-y-1 text-sm" data-testid="saved-kit-headline">
        <p className="num">
          dof {r.dof} · a-posteriori σ0 {r.sigma0 === null ? '—' : `${(r.sigma0 * 1000).toFixed(1)} mm per √km`} · {r.standard.name} (c = {r.standard.c_mm} mm) · test |w| &gt; {r.test.critical} with the {r.test.sigma0_source} σ0 {r.test.sigma0_mm === null ? '' : `= ${r.test.sigma0_mm} mm`}
        </p>
        <p className={r.flagged.length ? 'text-odds' : 'text-glued'}>
          {r.flagged.length ? `Flagged: ${r.flagged.map((f) => `${f.from} → ${f.to} (w = ${f.w.toFixed(2)})`).join(', ')}` : 'No line flagged.'}
        </p>
        <table className="num text-xs">
          <tbody>
            {Object.entries(r.heights).map(([id, h]) => (
              <tr key={id}>
                <td className="pr-3">{id}</td>
                <td className="text-right">{h.toFixed(4)} m</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    );
  }
  if (saved.kit === 'frame') {
    const r = saved.report as FrameReport;
    return (
      <p className="text-sm" data-testid="saved-kit-headline">
        dims [H⁰, H¹] = [{r.dims.join(', ')}] · {r.classification.summary}
      </p>
    );
  }
  const r = saved.report as MeshReport;
  return (
    <p className="num text-sm" data-testid="saved-kit-headline">
      Betti numbers ({r.betti.join(', ')}) over {r.field} · closed {String(r.closed)} · orientable {String(r.orientable)}
    </p>
  );
}
