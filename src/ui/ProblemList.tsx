import type { Problem } from '../../shared/engine';

/** Problems in user input, each with the place it was found. */
export function ProblemList({ problems, title }: { problems: Problem[]; title: string }) {
  if (problems.length === 0) return null;
  return (
    <div role="alert" className="rounded border border-odds bg-odds-soft p-3 text-sm">
      <p className="mb-1 font-semibold text-odds">{title}</p>
      <ul className="max-h-48 space-y-0.5 overflow-auto">
        {problems.map((p, i) => (
          <li key={i}>
            {p.where && <span className="num mr-2 text-ink">{p.where}</span>}
            <span className="text-ink-soft">{p.message}</span>
          </li>
        ))}
      </ul>
    </div>
  );
}
