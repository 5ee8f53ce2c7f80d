import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { appDb } from '../app/db';
import { listKitResults, type KitKind } from '../store';

export const KIT_NAMES: Record<KitKind, string> = { levelling: 'Levelling net', frame: 'Frame check', mesh: 'Mesh topology' };

/** The kit results kept in this project (saved from the Kits screens), newest first. */
export function KitShelf({ projectId, selected }: { projectId: string; selected?: string }) {
  const results = useQuery({ queryKey: ['kitResults', projectId], queryFn: () => listKitResults(appDb(), projectId) });
  return (
    <section aria-label="Kit results" className="max-h-[40%] shrink-0 overflow-auto border-t border-r border-rule bg-sheet p-3">
      <h2 className="mb-1 text-xs font-semibold tracking-wide text-ink-soft uppercase">Kit results</h2>
      {results.data?.length === 0 && (
        <p className="text-[11px] text-ink-faint">
          None yet. Results from the <Link to="/kits" className="underline">Kits</Link> can be saved here.
        </p>
      )}
      <ul className="space-y-1" data-testid="kit-shelf">
        {results.data?.map((r) => (
          <li key={r.id} className={`rounded px-2 py-1.5 ${r.id === selected ? 'bg-glued-soft' : 'hover:bg-rule-soft'}`}>
            <Link to={`/p/${projectId}/k/${r.id}`} className="block">
              <span className="block truncate text-sm font-medium">{r.name}</span>
              <span className="num block text-[11px] text-ink-faint">
                {KIT_NAMES[r.kit]} · engine {r.engineVersion} · {new Date(r.createdAt).toLocaleString()}
              </span>
            </Link>
          </li>
        ))}
      </ul>
    </section>
  );
}
