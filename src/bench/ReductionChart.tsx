/** Cochain dimension per degree before and after reduction, on a log scale (what Morse theory saved). */
export function ReductionChart({ before, after }: { before: number[]; after: number[] }) {
  const max = Math.max(1, ...before);
  const h = 16;
  const w = 220;
  const scale = (x: number) => (x <= 0 ? 0 : (Math.log10(x + 1) / Math.log10(max + 1)) * w);
  return (
    <svg role="img" aria-label="Cochain dimensions before and after reduction" width={w + 90} height={before.length * (2 * h + 8)} className="num text-[10px]">
      {before.map((b, k) => {
        const y = k * (2 * h + 8);
        return (
          <g key={k}>
            <text x={0} y={y + h} className="fill-ink-soft">
              C^{k}
            </text>
            <rect x={30} y={y + 2} width={scale(b)} height={h - 4} className="fill-rule" />
            <text x={34 + scale(b)} y={y + h - 4} className="fill-ink-soft">
              {b.toLocaleString()}
            </text>
            <rect x={30} y={y + h + 2} width={Math.max(1, scale(after[k] ?? 0))} height={h - 4} className="fill-glued" />
            <text x={34 + scale(after[k] ?? 0)} y={y + 2 * h - 4} className="fill-glued">
              {(after[k] ?? 0).toLocaleString()}
            </text>
          </g>
        );
      })}
    </svg>
  );
}
