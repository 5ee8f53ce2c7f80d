import { useEffect, useRef, useState } from 'react';
import type { SketchData } from '../compute/computeService';

export interface SketchPaint {
  /** One value per vertex (a global section's first coordinate, say); coloured on a diverging scale. */
  vertexValues?: Float64Array;
  /** Per degree, indices of cells that stayed critical after reduction. */
  critical?: Int32Array[];
  /** A size per cell (residuals of readings, say), per degree, NaN where there is none; coloured from glued (0) to odds (`max`). */
  shade?: { values: (Float64Array | undefined)[]; max: number; label: string };
  /** Cells to point out (a row picked in a table), by degree and index. */
  highlight?: { degree: number; index: number }[];
}

const INK = '#23262b';
const RULE = '#b9ae98';
const GLUED = [46, 122, 103];
const ODDS = [176, 74, 38];
const PAPER = [244, 239, 228];
const TRIANGLE_BATCH = 256;

/**
 * The picture of the complex on a canvas: triangles, edges, vertices, pan
 * (drag) and zoom (wheel, +/−, 0 to reset). Paths are batched per colour so
 * 10^5 cells redraw within a frame.
 */
export function Sketch({ data, paint }: { data: SketchData; paint: SketchPaint }) {
  const canvas = useRef<HTMLCanvasElement>(null);
  const wrap = useRef<HTMLDivElement>(null);
  const [view, setView] = useState({ scale: 1, tx: 0, ty: 0 });
  const [size, setSize] = useState({ w: 600, h: 400 });
  const drag = useRef<{ x: number; y: number } | null>(null);

  useEffect(() => {
    const el = wrap.current;
    if (!el) return;
    const ro = new ResizeObserver(([entry]) => setSize({ w: Math.max(100, entry.contentRect.width), h: Math.max(100, entry.contentRect.height) }));
    ro.observe(el);
    return () => ro.disconnect();
  }, []);

  useEffect(() => {
    const c = canvas.current;
    if (!c) return;
    // Drawn a slice per frame (at most ~8 ms each), so a million-cell picture
    // builds up over a few frames instead of freezing the page.
    const steps = draw(c, data, paint, view, size);
    let frame = 0;
    const pump = () => {
      const until = performance.now() + 8;
      while (performance.now() < until) if (steps.next().done) return;
      frame = requestAnimationFrame(pump);
    };
    frame = requestAnimationFrame(pump);
    return () => cancelAnimationFrame(frame);
  }, [data, paint, view, size]);

  const zoomAt = (factor: number, cx: number, cy: number) =>
    setView((v) => ({ scale: v.scale * factor, tx: cx - (cx - v.tx) * factor, ty: cy - (cy - v.ty) * factor }));

  return (
    <div ref={wrap} className="relative h-full w-full overflow-hidden bg-sheet">
      <canvas
        ref={canvas}
        data-testid="sketch"
        data-highlight={paint.highlight?.map((h) => `${h.degree}:${h.index}`).join(' ') || undefined}
        data-shaded={paint.shade ? paint.shade.values.reduce((n, v) => n + (v ? v.filter((x) => !Number.isNaN(x)).length : 0), 0) : undefined}
        tabIndex={0}
        aria-label="Sketch of the complex: drag to pan, wheel or +/− to zoom, 0 to reset"
        width={size.w * devicePixelRatio}
        height={size.h * devicePixelRatio}
        style={{ width: size.w, height: size.h, cursor: drag.current ? 'grabbing' : 'grab' }}
        onWheel={(e) => {
          const r = (e.target as HTMLCanvasElement).getBoundingClientRect();
          zoomAt(e.deltaY < 0 ? 1.15 : 1 / 1.15, e.clientX - r.left, e.clientY - r.top);
        }}
        onPointerDown={(e) => {
          drag.current = { x: e.clientX, y: e.clientY };
          (e.target as HTMLElement).setPointerCapture(e.pointerId);
        }}
        onPointerMove={(e) => {
          if (!drag.current) return;
          const dx = e.clientX - drag.current.x;
          const dy = e.clientY - drag.current.y;
          drag.current = { x: e.clientX, y: e.clientY };
          setView((v) => ({ ...v, tx: v.tx + dx, ty: v.ty + dy }));
        }}
        onPointerUp={() => (drag.current = null)}
        onKeyDown={(e) => {
          if (e.key === '+' || e.key === '=') zoomAt(1.25, size.w / 2, size.h / 2);
          else if (e.key === '-') zoomAt(0.8, size.w / 2, size.h / 2);
          else if (e.key === '0') setView({ scale: 1, tx: 0, ty: 0 });
          else if (e.key.startsWith('Arrow')) {
            const step = 40;
            setView((v) => ({ ...v, tx: v.tx + (e.key === 'ArrowLeft' ? step : e.key === 'ArrowRight' ? -step : 0), ty: v.ty + (e.key === 'ArrowUp' ? step : e.key === 'ArrowDown' ? -step : 0) }));
          } else return;
          e.preventDefault();
        }}
      />
      <div className="pointer-events-none absolute bottom-2 left-2 rounded bg-sheet/80 px-2 py-1 text-[11px] text-ink-faint">
        {data.given ? 'positions from the model' : 'automatic layout (no positions in the model)'} · {(data.positions.length / 2).toLocaleString()} vertices
      </div>
      {paint.shade ? <ShadeLegend max={paint.shade.max} label={paint.shade.label} /> : paint.vertexValues && <Legend />}
    </div>
  );
}

function Legend() {
  return (
    <div className="pointer-events-none absolute top-2 right-2 flex items-center gap-1 rounded bg-sheet/90 px-2 py-1 text-[11px] text-ink-soft">
      <span>−</span>
      <span className="h-2 w-20 rounded" style={{ background: `linear-gradient(90deg, rgb(${ODDS}), rgb(${PAPER}), rgb(${GLUED}))` }} />
      <span>+</span>
    </div>
  );
}

function ShadeLegend({ max, label }: { max: number; label: string }) {
  return (
    <div data-testid="sketch-legend" className="pointer-events-none absolute top-2 right-2 rounded bg-sheet/90 px-2 py-1 text-[11px] text-ink-soft">
      <p className="mb-0.5">{label}</p>
      <div className="num flex items-center gap-1">
        <span>0</span>
        <span className="h-2 w-24 rounded" style={{ background: `linear-gradient(90deg, ${shadeColour(0)}, ${shadeColour(0.5)}, ${shadeColour(1)})` }} />
        <span>{formatSize(max)}</span>
      </div>
      <p className="text-ink-faint">cells without a reading in grey</p>
    </div>
  );
}

/** Sizes for the legend: three significant digits. */
export function formatSize(x: number): string {
  return x === 0 ? '0' : Math.abs(x) >= 1e-3 && Math.abs(x) < 1e5 ? String(Number(x.toPrecision(3))) : x.toExponential(2);
}

/** Above this many triangles the faint fill is only a tint over the edges; skip it. */
const FILL_LIMIT = 100_000;
/** Primitives per slice of drawing. */
const SLICE = 4096;

function* draw(c: HTMLCanvasElement, data: SketchData, paint: SketchPaint, view: { scale: number; tx: number; ty: number }, size: { w: number; h: number }): Generator<void> {
  const ctx = c.getContext('2d');
  if (!ctx) return;
  const dpr = devicePixelRatio;
  ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
  ctx.clearRect(0, 0, size.w, size.h);
  const side = Math.min(size.w, size.h);
  const ox = (size.w - side) / 2;
  const oy = (size.h - side) / 2;
  const P = data.positions;
  const X = (i: number) => (ox + P[2 * i] * side) * view.scale + view.tx;
  const Y = (i: number) => (oy + P[2 * i + 1] * side) * view.scale + view.ty;
  const n = P.length / 2;
  const crit = paint.critical;

  const T = data.triangles;
  if (T.length && T.length / 3 <= FILL_LIMIT) {
    ctx.fillStyle = 'rgba(46,122,103,0.07)';
    // Small batches: one path of many overlapping triangles fills in superlinear time in Chromium's rasteriser.
    for (let start = 0; start < T.length; start += 3 * TRIANGLE_BATCH) {
      ctx.beginPath();
      for (let t = start; t < Math.min(T.length, start + 3 * TRIANGLE_BATCH); t += 3) tri(ctx, X, Y, T[t], T[t + 1], T[t + 2]);
      ctx.fill();
      if ((start / 3) % SLICE === 0) yield;
    }
  }
  const E = data.edges;
  ctx.strokeStyle = E.length > 50_000 ? 'rgba(35,38,43,0.35)' : RULE;
  ctx.lineWidth = E.length > 50_000 ? 0.5 : 1;
  for (let start = 0; start < E.length; start += 2 * SLICE) {
    ctx.beginPath();
    for (let e = start; e < Math.min(E.length, start + 2 * SLICE); e += 2) {
      ctx.moveTo(X(E[e]), Y(E[e]));
      ctx.lineTo(X(E[e + 1]), Y(E[e + 1]));
    }
    ctx.stroke();
    yield;
  }

  const shade = paint.shade;
  const scaled = (x: number) => (shade && shade.max > 0 ? x / shade.max : 0);
  const shadedTriangles = shade?.values[2];
  if (shadedTriangles && T.length) {
    for (let t = 0; t < shadedTriangles.length; t++) {
      if (Number.isNaN(shadedTriangles[t])) continue;
      ctx.fillStyle = shadeColour(scaled(shadedTriangles[t]), 0.55);
      ctx.beginPath();
      tri(ctx, X, Y, T[3 * t], T[3 * t + 1], T[3 * t + 2]);
      ctx.fill();
    }
  }
  const shadedEdges = shade?.values[1];
  if (shadedEdges) {
    ctx.lineWidth = 5;
    ctx.lineCap = 'round';
    for (let e = 0; e < shadedEdges.length; e++) {
      if (Number.isNaN(shadedEdges[e])) continue;
      ctx.strokeStyle = shadeColour(scaled(shadedEdges[e]));
      ctx.beginPath();
      ctx.moveTo(X(E[2 * e]), Y(E[2 * e]));
      ctx.lineTo(X(E[2 * e + 1]), Y(E[2 * e + 1]));
      ctx.stroke();
    }
    ctx.lineCap = 'butt';
  }

  if (crit?.[2]?.length && T.length) {
    ctx.fillStyle = 'rgba(35,38,43,0.35)';
    ctx.beginPath();
    for (const t of crit[2]) tri(ctx, X, Y, T[3 * t], T[3 * t + 1], T[3 * t + 2]);
    ctx.fill();
  }
  if (crit?.[1]?.length) {
    ctx.strokeStyle = INK;
    ctx.lineWidth = 3;
    ctx.beginPath();
    for (const e of crit[1]) {
      ctx.moveTo(X(E[2 * e]), Y(E[2 * e]));
      ctx.lineTo(X(E[2 * e + 1]), Y(E[2 * e + 1]));
    }
    ctx.stroke();
  }
  yield;

  const values = shade ? undefined : paint.vertexValues;
  const shadedVertices = shade?.values[0];
  const r = n > 20_000 ? 1.2 : n > 2000 ? 2.5 : 4.5;
  let maxAbs = 0;
  if (values) for (let i = 0; i < values.length; i++) maxAbs = Math.max(maxAbs, Math.abs(values[i]));
  if (n > 5000) {
    // Many vertices: one path per colour bin of small squares instead of one fill per vertex.
    const BINS = 21;
    const bins: number[][] = Array.from({ length: values ? BINS : 1 }, () => []);
    for (let i = 0; i < n; i++) {
      const b = values ? Math.round(((values[i] / (maxAbs || 1) + 1) / 2) * (BINS - 1)) : 0;
      bins[b].push(i);
    }
    for (let b = 0; b < bins.length; b++) {
      const list = bins[b];
      ctx.fillStyle = values ? colour((b / (BINS - 1)) * 2 - 1) : INK;
      for (let start = 0; start < list.length; start += SLICE) {
        ctx.beginPath();
        for (let j = start; j < Math.min(list.length, start + SLICE); j++) ctx.rect(X(list[j]) - r, Y(list[j]) - r, 2 * r, 2 * r);
        ctx.fill();
        yield;
      }
    }
  } else if (shade) {
    for (let i = 0; i < n; i++) {
      const x = shadedVertices ? shadedVertices[i] : NaN;
      const has = !Number.isNaN(x);
      ctx.fillStyle = has ? shadeColour(scaled(x)) : RULE;
      ctx.beginPath();
      ctx.arc(X(i), Y(i), has ? r + 2.5 : r, 0, 2 * Math.PI);
      ctx.fill();
    }
  } else {
    for (let i = 0; i < n; i++) {
      ctx.fillStyle = values ? colour(values[i] / (maxAbs || 1)) : INK;
      ctx.beginPath();
      ctx.arc(X(i), Y(i), r, 0, 2 * Math.PI);
      ctx.fill();
    }
  }
  if (crit?.[0]?.length) {
    ctx.strokeStyle = INK;
    ctx.lineWidth = 2;
    for (const v of crit[0]) {
      ctx.beginPath();
      ctx.arc(X(v), Y(v), r + 4, 0, 2 * Math.PI);
      ctx.stroke();
    }
  }
  // Last, so nothing covers it: a picked cell outlined in ink with a halo of paper, its own colour kept inside.
  for (const h of paint.highlight ?? []) {
    const own = shade?.values[h.degree]?.[h.index];
    const inside = own === undefined || Number.isNaN(own) || h.degree === 0 ? [] : [[3, shadeColour(scaled(own))] as const];
    for (const [width, style] of [[12, `rgb(${PAPER})`], [8, INK], ...inside] as const) {
      ctx.strokeStyle = style;
      ctx.lineWidth = width;
      ctx.beginPath();
      if (h.degree === 0) ctx.arc(X(h.index), Y(h.index), r + 7, 0, 2 * Math.PI);
      else if (h.degree === 1) {
        ctx.moveTo(X(E[2 * h.index]), Y(E[2 * h.index]));
        ctx.lineTo(X(E[2 * h.index + 1]), Y(E[2 * h.index + 1]));
      } else if (h.degree === 2 && T.length) tri(ctx, X, Y, T[3 * h.index], T[3 * h.index + 1], T[3 * h.index + 2]);
      ctx.stroke();
    }
  }
}

/** Sequential, for sizes: glued colour at 0, obstruction colour at 1. */
export function shadeColour(t: number, alpha = 1): string {
  const a = Math.max(0, Math.min(1, t));
  const mix = (i: number) => Math.round(GLUED[i] + (ODDS[i] - GLUED[i]) * a);
  return `rgba(${mix(0)},${mix(1)},${mix(2)},${alpha})`;
}

function tri(ctx: CanvasRenderingContext2D, X: (i: number) => number, Y: (i: number) => number, a: number, b: number, c: number) {
  ctx.moveTo(X(a), Y(a));
  ctx.lineTo(X(b), Y(b));
  ctx.lineTo(X(c), Y(c));
  ctx.closePath();
}

/** Diverging: obstruction colour below zero, paper at zero, glued colour above. */
export function colour(t: number): string {
  const to = t >= 0 ? GLUED : ODDS;
  const a = Math.min(1, Math.abs(t));
  const mix = (i: number) => Math.round(PAPER[i] + (to[i] - PAPER[i]) * a);
  return `rgb(${mix(0)},${mix(1)},${mix(2)})`;
}
