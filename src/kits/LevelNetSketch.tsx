import type { LevelNetResult } from '../compute/kitService';
import { themeColour, useCanvas } from './useCanvas';

/** The net: stations at their positions (or a layout), lines in the glued colour, flagged lines in the odds colour, adjusted heights as labels. */
export function LevelNetSketch({ result }: { result: LevelNetResult }) {
  const ref = useCanvas(
    (ctx, w, h) => {
      const glued = themeColour('glued', '#2e7a67');
      const odds = themeColour('odds', '#b04a26');
      const ink = themeColour('ink', '#23262b');
      const index = new Map(result.stations.map((s, i) => [s.id, i]));
      const pad = 40;
      const at = (i: number): [number, number] => [pad + result.positions[2 * i] * (w - 2 * pad), pad + result.positions[2 * i + 1] * (h - 2 * pad)];
      const flagged = new Set(result.report.flagged.map((f) => `${f.from}\u0000${f.to}`));
      for (const l of result.lines) {
        const bad = flagged.has(`${l.from}\u0000${l.to}`);
        const [x1, y1] = at(index.get(l.from)!);
        const [x2, y2] = at(index.get(l.to)!);
        ctx.strokeStyle = bad ? odds : glued;
        ctx.lineWidth = bad ? 3 : 1.5;
        ctx.setLineDash(bad ? [6, 3] : []);
        ctx.beginPath();
        ctx.moveTo(x1, y1);
        ctx.lineTo(x2, y2);
        ctx.stroke();
      }
      ctx.setLineDash([]);
      ctx.font = '11px "IBM Plex Mono", monospace';
      result.stations.forEach((s, i) => {
        const [x, y] = at(i);
        ctx.fillStyle = ink;
        ctx.beginPath();
        if (s.benchmark) ctx.rect(x - 5, y - 5, 10, 10);
        else ctx.arc(x, y, 3.5, 0, 2 * Math.PI);
        ctx.fill();
        const height = result.report.heights[s.id];
        ctx.fillText(s.id, x + 6, y - 4);
        ctx.fillStyle = themeColour('ink-soft', '#5b5f66');
        ctx.fillText(`${height.toFixed(4)} m`, x + 6, y + 9);
      });
    },
    [result],
  );
  return (
    <figure className="rounded border border-rule bg-sheet p-2">
      <canvas ref={ref} data-testid="levelling-sketch" className="h-[420px] w-full" aria-label="Levelling net with adjusted heights" />
      <figcaption className="text-xs text-ink-soft">
        ■ benchmark · ● station · <span className="text-glued">—— line within tolerance</span> · <span className="text-odds">- - flagged line</span> ·{' '}
        {result.positionsGiven ? 'stations at the positions in the stations file' : 'automatic layout (no x,y columns in the stations file)'}
      </figcaption>
    </figure>
  );
}
