import type { RunRecord } from '../compute/computeService';

/** Earlier runs of this model, newest first, to compare at a glance and reopen. */
export function RunHistory({ runs, selected, onSelect }: { runs: RunRecord[]; selected?: string; onSelect(id: string): void }) {
  if (runs.length === 0) return <p className="p-3 text-sm text-ink-soft">No runs yet. Choose a field and press Reduce &amp; solve.</p>;
  return (
    <section aria-label="Earlier runs" className="p-3">
      <h2 className="mb-2 text-xs font-semibold tracking-wide text-ink-soft uppercase">Earlier runs</h2>
      <ul className="space-y-0.5 text-xs" data-testid="run-history">
        {runs.map((r) => (
          <li key={r.id}>
            <button onClick={() => onSelect(r.id)} className={`num flex w-full justify-between rounded px-1.5 py-0.5 text-left ${r.id === selected ? 'bg-glued-soft' : 'hover:bg-rule-soft'}`}>
              <span>
                {new Date(r.createdAt).toLocaleTimeString()} · v{r.modelVersion} · {r.report?.field ?? r.settings.field.kind} · {r.settings.method}
              </span>
              <span className={r.status === 'done' ? '' : 'text-odds'}>{r.status === 'done' ? `[${r.report?.dims.join(', ')}]` : r.status}</span>
            </button>
          </li>
        ))}
      </ul>
    </section>
  );
}
