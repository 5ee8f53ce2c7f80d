import type { MapEntry, ModelFile, VertexInfo } from '../engine';

/** A plane rotation by the angle with cosine `c` and sine `s`, entries as exact decimal strings. */
type Turn = { c: string; s: string };

/**
 * Relative rotations between the horizontal frames of neighbouring stations
 * around the ring, WS-01 → WS-02 → … → WS-06. Every one is a rational
 * rotation from a Pythagorean triple with hypotenuse 5 or 25, so its
 * entries are finite decimals and the rational field checks them exactly:
 * 53.13° (3, 4, 5), −36.87° (4, −3, 5), 73.74° (7, 24, 25),
 * −16.26° (24, −7, 25), 53.13° again. Their product is the rotation by
 * 126.87° with cosine −3/5 and sine 4/5 (as Gaussian integers:
 * (3+4i)(4−3i)(7+24i)(24−7i)(3+4i) / 5^7 = (−3+4i)/5).
 */
const LEGS: Turn[] = [
  { c: '0.6', s: '0.8' },
  { c: '0.8', s: '-0.6' },
  { c: '0.28', s: '0.96' },
  { c: '0.96', s: '-0.28' },
  { c: '0.6', s: '0.8' },
];

/** The closing link WS-01 → WS-06 read as exactly the product of the legs. */
const CLOSING_CONSISTENT: Turn = { c: '-0.6', s: '0.8' };

/**
 * The closing link read 4.35° off: the product of the legs times the
 * rotation (3116 + 237i) / 3125 (3116² + 237² = 3125²), that is
 * (−10296 + 11753i) / 15625.
 */
const CLOSING_MISREAD: Turn = { c: '-0.658944', s: '0.752192' };

/**
 * Weather station ring: six stations, each with a local horizontal frame
 * (stalk R^2 over the rationals), joined in a ring. The stalk over a link
 * is written in the frame of its later station, so that end maps by the
 * identity and the earlier station maps by the measured relative rotation.
 * Going once round the ring, the rotations multiply to a 4.35° misclosure,
 * so no common frame exists: H^0 = 0 (and H^1 = 0, since
 * dim C^1 − dim C^0 = 12 − 12 = 0). Source for the criterion: Hansen and
 * Ghrist (2019), a sheaf with orthogonal maps on a cycle has dim H^0 = d
 * exactly when the rotations around the cycle multiply to the identity.
 */
export function weatherStationRing(): ModelFile {
  return ring('Weather station ring (4.35° misclosure)', CLOSING_MISREAD);
}

/**
 * The consistent variant: the closing link equals the product of the legs,
 * the rotations around the ring multiply to the identity, and the frames
 * glue into one common frame up to a free rotation and scale: H^0 = 2,
 * H^1 = 2.
 */
export function weatherStationRingConsistent(): ModelFile {
  return ring('Weather station ring (consistent)', CLOSING_CONSISTENT);
}

function ring(name: string, closing: Turn): ModelFile {
  const n = LEGS.length + 1;
  const vertices: VertexInfo[] = Array.from({ length: n }, (_, id) => {
    const angle = (Math.PI / 3) * id;
    // Invented positions, kilometres on a 15 km circle, rounded for display.
    const x = Math.round(15 * Math.cos(angle) * 100) / 100;
    const y = Math.round(15 * Math.sin(angle) * 100) / 100;
    return { id, x, y, label: `WS-${String(id + 1).padStart(2, '0')}` };
  });
  const entries: MapEntry[] = LEGS.map((turn, i) => ({ face: [i], coface: [i, i + 1], matrix: rotation(turn) }));
  entries.push({ face: [0], coface: [0, n - 1], matrix: rotation(closing) });
  return {
    format: 'gluefield.sheaf',
    version: 1,
    name,
    field: { kind: 'rational' },
    simplices: [...LEGS.map((_, i) => [i, i + 1]), [0, n - 1]],
    vertices,
    stalks: { default: 2 },
    maps: { default: 'identity', entries },
  };
}

function rotation({ c, s }: Turn): string[][] {
  return [
    [c, negate(s)],
    [s, c],
  ];
}

function negate(decimal: string): string {
  return decimal.startsWith('-') ? decimal.slice(1) : `-${decimal}`;
}
