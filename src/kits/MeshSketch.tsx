import { useMemo } from 'react';
import type { PackedCycle } from '../../shared/kits/mesh/packedCycles';
import type { MeshResult } from '../compute/kitService';
import { themeColour, useCanvas } from './useCanvas';

/** Past this many cells a highlighted cycle is drawn by every stride-th cell, so a redraw stays short. */
export const CYCLE_DRAW_CELLS = 20_000;

/** The mesh's edges in a fixed oblique projection, with one representative cycle drawn over them. */
export function MeshSketch({ result, cycle }: { result: MeshResult; cycle: PackedCycle | undefined }) {
  // The worker numbers vertices as the file does; a table is only needed when it did not.
  const denseOf = useMemo(() => {
    const ids = result.vertexIds;
    let identity = true;
    for (let i = 0; i < ids.length && identity; i++) identity = ids[i] === i;
    if (identity) return (id: number) => id;
    const dense = new Map<number, number>();
    ids.forEach((id, i) => dense.set(id, i));
    return (id: number) => dense.get(id)!;
  }, [result]);
  const ref = useCanvas(
    (ctx, w, h) => {
      const pad = 20;
      const side = Math.min(w, h) - 2 * pad;
      const ox = (w - side) / 2;
      const oy = (h - side) / 2;
      const p = result.positions;
      const x = (i: number) => ox + p[2 * i] * side;
      const y = (i: number) => oy + p[2 * i + 1] * side;
      ctx.strokeStyle = themeColour('ink-faint', '#8b8f95');
      ctx.globalAlpha = result.edges.length > 20_000 ? 0.25 : 0.6;
      ctx.lineWidth = 0.75;
      ctx.beginPath();
      const e = result.edges;
      for (let k = 0; k < e.length; k += 2) {
        ctx.moveTo(x(e[k]), y(e[k]));
        ctx.lineTo(x(e[k + 1]), y(e[k + 1]));
      }
      ctx.stroke();
      ctx.globalAlpha = 1;
      if (!cycle) return;
      ctx.strokeStyle = themeColour('odds', '#b04a26');
      ctx.lineWidth = 3;
      ctx.beginPath();
      const size = cycle.degree + 1;
      const cv = cycle.vertices;
      const stride = cycleDrawStride(cycle);
      for (let c = 0; c < cycle.cellCount; c += stride) {
        const o = size * c;
        for (let a = 0; a < size; a++)
          for (let b = a + 1; b < size; b++) {
            const va = denseOf(cv[o + a]);
            const vb = denseOf(cv[o + b]);
            ctx.moveTo(x(va), y(va));
            ctx.lineTo(x(vb), y(vb));
          }
      }
      ctx.stroke();
    },
    [result, cycle, denseOf],
  );
  return <canvas ref={ref} data-testid="mesh-sketch" className="h-[420px] w-full" aria-label="Mesh with a representative cycle highlighted" />;
}

/** 1 when the whole cycle is drawn, else the step between the cells drawn. */
export function cycleDrawStride(cycle: PackedCycle): number {
  return Math.max(1, Math.ceil(cycle.cellCount / CYCLE_DRAW_CELLS));
}
