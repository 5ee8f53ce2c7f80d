import { orthonormalise } from '../../engine/data/orthonormalise';
import { symmetricEigen } from '../../engine/data/symmetricEigen';
import type { Frame } from './Frame';
import type { FrameSheaf } from './frameSheaf';

/**
 * An orthonormal basis of the rigid-body motions the supports allow, as
 * flat 0-cochains of the frame's sheaf (free coordinates only): the
 * infinitesimal translations and rotations of R^d, combined so every held
 * component is zero, then restricted to the free ones. Rotations are taken
 * about the centroid and scaled by the frame's size, so translations and
 * rotations weigh alike. A motion that moves no joint (turning a straight
 * frame in space about its own line) does not count.
 */
export function rigidMotions(frame: Frame, fs: FrameSheaf): Float64Array[] {
  const d = frame.dimension;
  const J = frame.joints.length;
  const centre = new Array<number>(d).fill(0);
  for (const j of frame.joints) for (let a = 0; a < d; a++) centre[a] += j.position[a] / J;
  let size = 0;
  for (const j of frame.joints) size = Math.max(size, Math.hypot(...j.position.map((x, a) => x - centre[a])));
  size ||= 1;
  // Generator g as a displacement of joint j: a full d-vector.
  const generators: ((p: number[]) => number[])[] =
    d === 2
      ? [() => [1, 0], () => [0, 1], (p) => [-p[1], p[0]]]
      : [
          () => [1, 0, 0],
          () => [0, 1, 0],
          () => [0, 0, 1],
          (p) => [0, -p[2], p[1]],
          (p) => [p[2], 0, -p[0]],
          (p) => [-p[1], p[0], 0],
        ];
  const g = generators.length;
  const motion = frame.joints.map((j) => {
    const p = j.position.map((x, a) => (x - centre[a]) / size);
    return generators.map((gen) => gen(p));
  });
  // Combinations α with every held component zero: the kernel of Σ over held (joint, axis) rows.
  const gram = new Float64Array(g * g);
  frame.joints.forEach((j, ji) => {
    j.fixed.forEach((held, a) => {
      if (!held) return;
      for (let r = 0; r < g; r++) for (let c = 0; c < g; c++) gram[r * g + c] += motion[ji][r][a] * motion[ji][c][a];
    });
  });
  const { values, vectors } = symmetricEigen(gram, g);
  const top = Math.max(1, values[g - 1]);
  const allowed: number[][] = [];
  for (let c = 0; c < g; c++) if (values[c] <= 1e-10 * top) allowed.push(Array.from({ length: g }, (_, r) => vectors[r * g + c]));
  const n = fs.offset[J];
  const cochains = allowed.map((alpha) => {
    const v = new Float64Array(n);
    frame.joints.forEach((_, ji) => {
      fs.freeAxes[ji].forEach((a, k) => {
        let s = 0;
        for (let r = 0; r < g; r++) s += alpha[r] * motion[ji][r][a];
        v[fs.offset[ji] + k] = s;
      });
    });
    return v;
  });
  return orthonormalise(cochains, 1e-8);
}
