import type { MapEntry, ModelFile, VertexInfo } from '../../engine/model/ModelFile';
import type { Frame } from './Frame';

/** The frame's sheaf and how its cochains read in the frame's terms. */
export interface FrameSheaf {
  model: ModelFile;
  /** Per joint (in file order = vertex id), the axes its stalk keeps. */
  freeAxes: number[][];
  /** Offset of each joint's free coordinates in a flat 0-cochain. */
  offset: Int32Array;
  /** Joint indices at the ends of each bar (file order), lower first. */
  ends: [number, number][];
}

/**
 * A pin-jointed frame as a sheaf over the reals (check-values.md,
 * "Pin-jointed frameworks"): the stalk on a joint is its free displacement
 * components, R on each bar (its elongation), and the map from either end
 * to a bar is the bar's unit direction (lower joint to higher) restricted to
 * that joint's free components. δ⁰ is then the compatibility matrix of the
 * supported frame and its transpose the equilibrium matrix, so H^0 holds
 * the mechanisms (rigid-body motions the supports allow included) and H^1
 * the states of self-stress (Pellegrino & Calladine, IJSS 22 (1986) 409–428).
 */
export function frameSheaf(frame: Frame, name?: string): FrameSheaf {
  const index = new Map(frame.joints.map((j, i) => [j.id, i]));
  const freeAxes = frame.joints.map((j) => j.fixed.flatMap((f, a) => (f ? [] : [a])));
  const offset = new Int32Array(frame.joints.length + 1);
  freeAxes.forEach((axes, i) => (offset[i + 1] = offset[i] + axes.length));
  const entries: MapEntry[] = [];
  const ends: [number, number][] = [];
  for (const bar of frame.bars) {
    const p = index.get(bar.from)!;
    const q = index.get(bar.to)!;
    const [a, b] = p < q ? [p, q] : [q, p];
    ends.push([a, b]);
    const pa = frame.joints[a].position;
    const pb = frame.joints[b].position;
    const diff = pb.map((x, k) => x - pa[k]);
    const len = Math.hypot(...diff);
    const unit = diff.map((x) => x / len);
    for (const end of [a, b]) {
      // A joint held on every axis has a 0-dimensional stalk; its 1×0 map is the zero default.
      if (freeAxes[end].length > 0) entries.push({ face: [end], coface: [a, b], matrix: [freeAxes[end].map((ax) => unit[ax])] });
    }
  }
  const vertices: VertexInfo[] = frame.joints.map((j, id) => ({ id, x: j.position[0], y: j.position[1], z: j.position[2], label: j.id }));
  const model: ModelFile = {
    format: 'gluefield.sheaf',
    version: 1,
    field: { kind: 'real' },
    simplices: [...frame.joints.map((_, i) => [i]), ...ends],
    vertices,
    stalks: {
      default: 1,
      cells: frame.joints.map((_, i) => ({ cell: [i], dim: freeAxes[i].length })),
    },
    maps: { default: 'zero', entries },
  };
  if (name !== undefined) model.name = name;
  return { model, freeAxes, offset, ends };
}
