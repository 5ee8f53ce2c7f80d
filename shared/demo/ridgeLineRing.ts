import type { ModelFile, VertexInfo } from '../engine';

/**
 * Invented positions (metres, local grid) of ten survey stations along a
 * fictional ridge line, walked out along the crest and back along the
 * lower path, so the stations close into one ring.
 */
const STATIONS: [number, number][] = [
  [0, 0],
  [420, 160],
  [870, 240],
  [1330, 190],
  [1760, 30],
  [1810, -380],
  [1370, -560],
  [900, -610],
  [440, -530],
  [60, -330],
];

/** Two cross links over the ridge, between stations that see each other. */
const CROSS_LINKS: [number, number][] = [
  [2, 7],
  [3, 6],
];

/**
 * Ridge line ring: survey stations RL-01 … RL-10 joined in a ring with two
 * cross links, as the constant sheaf of dimension 1 on the graph over the
 * rationals (one height per station and per link, identity maps).
 * H^0 counts the connected pieces (1), H^1 the independent loops
 * (links − stations + 1 = 12 − 10 + 1 = 3), each a place a levelling
 * misclosure can show.
 */
export function ridgeLineRing(): ModelFile {
  const n = STATIONS.length;
  const vertices: VertexInfo[] = STATIONS.map(([x, y], id) => ({ id, x, y, label: `RL-${String(id + 1).padStart(2, '0')}` }));
  const ring = Array.from({ length: n }, (_, i) => [i, (i + 1) % n]);
  return {
    format: 'gluefield.sheaf',
    version: 1,
    name: 'Ridge line ring',
    field: { kind: 'rational' },
    simplices: [...ring, ...CROSS_LINKS],
    vertices,
    stalks: { default: 1 },
    maps: { default: 'identity' },
  };
}
