import type { FrameResult } from '../compute/kitService';
import { themeColour, useCanvas } from './useCanvas';

export type FrameView = { kind: 'none' } | { kind: 'mechanism'; index: number } | { kind: 'selfStress'; index: number };

/** Plane frames as drawn; space frames in a fixed oblique view. */
function project(p: number[]): [number, number] {
  if (p.length < 3) return [p[0], p[1]];
  const [x, y, z] = p;
  return [x + 0.5 * y * Math.cos(0.6), z + 0.5 * y * Math.sin(0.6)];
}

/** The frame with supports; a chosen self-stress state as bar colours (tension / compression), a chosen mechanism as arrows at the joints. */
export function FrameSketch({ result, view }: { result: FrameResult; view: FrameView }) {
  const ref = useCanvas(
    (ctx, w, h) => {
      const glued = themeColour('glued', '#2e7a67');
      const odds = themeColour('odds', '#b04a26');
      const ink = themeColour('ink', '#23262b');
      const faint = themeColour('ink-faint', '#8b8f95');
      const pts = result.joints.map((j) => project(j.position));
      let minX = Infinity, maxX = -Infinity, minY = Infinity, maxY = -Infinity;
      for (const [x, y] of pts) {
        minX = Math.min(minX, x);
        maxX = Math.max(maxX, x);
        minY = Math.min(minY, y);
        maxY = Math.max(maxY, y);
      }
      const pad = 50;
      const scale = Math.min((w - 2 * pad) / (maxX - minX || 1), (h - 2 * pad) / (maxY - minY || 1));
      const ox = (w - scale * (maxX - minX)) / 2;
      const oy = (h - scale * (maxY - minY)) / 2;
      const at = (i: number): [number, number] => [ox + (pts[i][0] - minX) * scale, h - oy - (pts[i][1] - minY) * scale];
      const index = new Map(result.joints.map((j, i) => [j.id, i]));
      const state = view.kind === 'selfStress' ? result.report.selfStressStates[view.index] : undefined;
      const peak = state ? Math.max(1e-12, ...Object.values(state).map(Math.abs)) : 1;
      ctx.font = '11px "IBM Plex Mono", monospace';
      for (const b of result.bars) {
        const [x1, y1] = at(index.get(b.from)!);
        const [x2, y2] = at(index.get(b.to)!);
        const f = state?.[b.id] ?? 0;
        const active = state && Math.abs(f) > 1e-9 * peak;
        ctx.strokeStyle = !state ? ink : active ? (f > 0 ? glued : odds) : faint;
        ctx.lineWidth = active ? 1.5 + 4 * (Math.abs(f) / peak) : 1.5;
        ctx.setLineDash(active && f < 0 ? [7, 3] : []);
        ctx.beginPath();
        ctx.moveTo(x1, y1);
        ctx.lineTo(x2, y2);
        ctx.stroke();
        if (active) {
          ctx.fillStyle = f > 0 ? glued : odds;
          // Labels a third of the way along, so crossing diagonals do not print over each other.
          ctx.fillText(`${b.id} ${f > 0 ? '+' : ''}${f.toFixed(2)}`, x1 + (x2 - x1) / 3 + 4, y1 + (y2 - y1) / 3 - 4);
        }
      }
      ctx.setLineDash([]);
      result.joints.forEach((j, i) => {
        const [x, y] = at(i);
        if (j.fixed.some(Boolean)) {
          ctx.strokeStyle = ink;
          ctx.lineWidth = 1.2;
          ctx.beginPath();
          ctx.moveTo(x, y);
          ctx.lineTo(x - 8, y + 13);
          ctx.lineTo(x + 8, y + 13);
          ctx.closePath();
          ctx.stroke();
          if (!j.fixed.every(Boolean)) {
            ctx.beginPath();
            ctx.arc(x - 4, y + 17, 2.5, 0, 2 * Math.PI);
            ctx.arc(x + 4, y + 17, 2.5, 0, 2 * Math.PI);
            ctx.stroke();
          }
        }
        ctx.fillStyle = ink;
        ctx.beginPath();
        ctx.arc(x, y, 3.5, 0, 2 * Math.PI);
        ctx.fill();
        ctx.fillText(j.id, x + 6, y - 6);
      });
      if (view.kind === 'mechanism') {
        const mode = result.report.mechanismModes[view.index] ?? {};
        const big = Math.max(1e-12, ...Object.values(mode).map((v) => Math.hypot(...v)));
        const length = 0.12 * Math.min(w, h);
        ctx.strokeStyle = odds;
        ctx.fillStyle = odds;
        ctx.lineWidth = 2;
        result.joints.forEach((j, i) => {
          const v = mode[j.id];
          if (!v || Math.hypot(...v) < 1e-9 * big) return;
          const tip = project(v.length < 3 ? v : [v[0], v[1], v[2]]);
          const [x, y] = at(i);
          const dx = (tip[0] / big) * length;
          const dy = -(tip[1] / big) * length;
          arrow(ctx, x, y, x + dx, y + dy);
        });
      }
    },
    [result, view],
  );
  return <canvas ref={ref} data-testid="frame-sketch" className="h-[380px] w-full" aria-label="Frame with supports, bar forces and mechanism arrows" />;
}

function arrow(ctx: CanvasRenderingContext2D, x1: number, y1: number, x2: number, y2: number) {
  ctx.beginPath();
  ctx.moveTo(x1, y1);
  ctx.lineTo(x2, y2);
  ctx.stroke();
  const a = Math.atan2(y2 - y1, x2 - x1);
  ctx.beginPath();
  ctx.moveTo(x2, y2);
  ctx.lineTo(x2 - 9 * Math.cos(a - 0.4), y2 - 9 * Math.sin(a - 0.4));
  ctx.lineTo(x2 - 9 * Math.cos(a + 0.4), y2 - 9 * Math.sin(a + 0.4));
  ctx.closePath();
  ctx.fill();
}
