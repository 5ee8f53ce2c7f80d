export function ProgressBar({ fraction, label }: { fraction: number; label?: string }) {
  const pct = Math.max(0, Math.min(1, fraction)) * 100;
  return (
    <div role="progressbar" aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(pct)} aria-label={label ?? 'progress'} className="h-1.5 w-full overflow-hidden rounded bg-rule-soft">
      <div className="h-full bg-glued transition-[width] duration-100" style={{ width: `${pct}%` }} />
    </div>
  );
}
