import type { MapEntry, ModelFile, VertexInfo } from '../engine';

type Joint = { label: string; x: number; y: number; free: 0 | 1 | 2 };

/**
 * A fictional 24 m footbridge: a 4-panel Warren truss, lower chord L0 … L4
 * every 6 m, upper chord U1 … U4 4 m above the panel midpoints, so every
 * diagonal is a 3-4-5 triangle. L0 is pinned (no free displacement), L4
 * sits on a roller (free horizontally, held vertically). `free` is how
 * many displacement components the joint keeps: 2 = (x, y), 1 = x only.
 */
const JOINTS: Joint[] = [
  { label: 'L0', x: 0, y: 0, free: 0 },
  { label: 'L1', x: 6, y: 0, free: 2 },
  { label: 'L2', x: 12, y: 0, free: 2 },
  { label: 'L3', x: 18, y: 0, free: 2 },
  { label: 'L4', x: 24, y: 0, free: 1 },
  { label: 'U1', x: 3, y: 4, free: 2 },
  { label: 'U2', x: 9, y: 4, free: 2 },
  { label: 'U3', x: 15, y: 4, free: 2 },
  { label: 'U4', x: 21, y: 4, free: 2 },
];

/** Lower chord, upper chord, then the diagonals zig-zagging L0-U1-L1-…-U4-L4. */
const BARS: [number, number][] = [
  [0, 1], [1, 2], [2, 3], [3, 4],
  [5, 6], [6, 7], [7, 8],
  [0, 5], [1, 5], [1, 6], [2, 6], [2, 7], [3, 7], [3, 8], [4, 8],
];

/** The counter-diagonal U1–L2 of the parallelogram L1-L2-U2-U1 (L1–U2 is already a bar): one bar more than the truss needs. */
const EXTRA_DIAGONAL: [number, number] = [2, 5];

/**
 * The footbridge truss as a sheaf over the reals: each joint's stalk is its
 * free displacement components, each bar's stalk R (its elongation), and
 * the map from either end joint to a bar is the bar's unit direction
 * (lower joint id to higher) restricted to that joint's free components.
 * The coboundary is then the compatibility matrix of the supported frame.
 * With 9 joints, 15 bars and 3 support reactions it is statically
 * determinate: 2·9 − 15 − 3 = 0 and rigid, so H^0 = 0 (no mechanism) and
 * H^1 = 0 (no self-stress).
 */
export function footbridgeFrame(): ModelFile {
  return frame('Footbridge frame (Warren truss)', BARS);
}

/**
 * The same truss with the counter-diagonal U1–L2 added: still rigid, one
 * bar more than determinate, so H^0 = 0 and H^1 = 1 (one state of
 * self-stress, carried by the six bars of the parallelogram L1-L2-U2-U1).
 */
export function footbridgeFrameWithExtraDiagonal(): ModelFile {
  return frame('Footbridge frame with extra diagonal', [...BARS, EXTRA_DIAGONAL]);
}

function frame(name: string, bars: [number, number][]): ModelFile {
  const vertices: VertexInfo[] = JOINTS.map((j, id) => ({ id, x: j.x, y: j.y, label: j.label }));
  const entries: MapEntry[] = [];
  for (const [p, q] of bars) {
    const [a, b] = p < q ? [p, q] : [q, p];
    const dx = JOINTS[b].x - JOINTS[a].x;
    const dy = JOINTS[b].y - JOINTS[a].y;
    const len = Math.hypot(dx, dy);
    const row = [dx / len, dy / len];
    for (const end of [a, b]) {
      const free = JOINTS[end].free;
      // A pinned joint has a 0-dimensional stalk; its 1×0 map comes from the zero default.
      if (free > 0) entries.push({ face: [end], coface: [a, b], matrix: [row.slice(0, free)] });
    }
  }
  return {
    format: 'gluefield.sheaf',
    version: 1,
    name,
    field: { kind: 'real' },
    simplices: [...JOINTS.map((_, id) => [id]), ...bars.map(([p, q]) => [p, q])],
    vertices,
    stalks: { default: 1, cells: JOINTS.map((j, id) => ({ cell: [id], dim: j.free })) },
    maps: { default: 'zero', entries },
  };
}
