import type { ClassCycle } from '../../shared/kits/mesh/analyseMesh';
import type { MeshResult } from '../compute/kitService';
import { themeColour, useCanvas } from './useCanvas';

/** The mesh's edges in a fixed oblique projection, with one representative cycle drawn over them. */
export function MeshSketch({ result, cycle }: { result: MeshResult; cycle: ClassCycle | undefined }) {
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
      const dense = new Map<number, number>();
      result.vertexIds.forEach((id, i) => dense.set(id, i));
      ctx.strokeStyle = themeColour('odds', '#b04a26');
      ctx.lineWidth = 3;
      ctx.beginPath();
      for (const cell of cycle.cells) {
        const vs = cell.map((id) => dense.get(id)!);
        for (let a = 0; a < vs.length; a++)
          for (let b = a + 1; b < vs.length; b++) {
            ctx.moveTo(x(vs[a]), y(vs[a]));
            ctx.lineTo(x(vs[b]), y(vs[b]));
          }
      }
      ctx.stroke();
    },
    [result, cycle],
  );
  return <canvas ref={ref} data-testid="mesh-sketch" className="h-[420px] w-full" aria-label="Mesh with a representative cycle highlighted" />;
}
