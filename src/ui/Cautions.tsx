/** The cautions every result and report carries (structures, surveys, floating point). */
export function Cautions({ compact = false }: { compact?: boolean }) {
  return (
    <aside className={`rounded border border-rule bg-sheet text-ink-soft ${compact ? 'p-2 text-[11px]' : 'p-3 text-xs'}`} aria-label="Cautions">
      <p className="mb-1 font-semibold text-ink">Read before relying on these results</p>
      <ul className="list-disc space-y-0.5 pl-4">
        <li>Structural results are first-order (infinitesimal) checks of an idealised pin-jointed model, not a design, a load rating or a safety assessment. Defer to licensed engineers and local building codes.</li>
        <li>Survey adjustments depend on the observation weights and the tolerance standard chosen; defer to local survey regulations.</li>
        <li>Floating-point results near the tolerance are flagged as numerically uncertain, with the smallest pivot shown.</li>
      </ul>
    </aside>
  );
}
