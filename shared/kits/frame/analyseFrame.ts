import { computeCohomology } from '../../engine/computeCohomology';
import { harmonicRepresentatives } from '../../engine/data/harmonicRepresentatives';
import { orthonormalise, principalBasis, projectOut } from '../../engine/data/orthonormalise';
import { realSections } from '../../engine/data/realSections';
import { readModelOrThrow } from '../../engine/model/readModel';
import type { Frame } from './Frame';
import { frameSheaf } from './frameSheaf';
import { rigidMotions } from './rigidMotions';

export interface FrameReport {
  dimension: 2 | 3;
  joints: number;
  bars: number;
  /** Displacement components held by supports. */
  constraints: number;
  /** [dim H^0, dim H^1]: all mechanisms (rigid-body motions included) and states of self-stress. */
  dims: [number, number];
  /** Internal mechanisms m = dim H^0 − rigidMotions. */
  mechanisms: number;
  /** Rigid-body motions the supports still allow (counted apart from the mechanisms). */
  rigidMotions: number;
  /** s = dim H^1. */
  selfStresses: number;
  /** An orthonormal basis of the self-stress states: bar id → bar force coefficient (+ tension, − compression, up to the sign of the whole state). */
  selfStressStates: Record<string, number>[];
  /** An orthonormal basis of the internal mechanisms: joint id → displacement vector (held components 0). */
  mechanismModes: Record<string, number[]>[];
  classification: {
    statically: 'determinate' | 'indeterminate';
    kinematically: 'determinate' | 'indeterminate';
    summary: string;
  };
  maxwellCalladine: {
    /** d·j − b − c, which equals dim H^0 − dim H^1 (the sheaf's Euler characteristic). */
    count: number;
    formula: string;
    /** What the count alone predicts for (m, s) once the rigid-body motions are set apart. */
    countPredicts: { mechanisms: number; selfStresses: number };
    agrees: boolean;
    explanation: string;
  };
  /** Real-field rank decisions close to the tolerance. */
  numericallyUncertain: boolean;
  caution: string;
}

export const FRAME_CAUTION =
  'Structural results are first-order (infinitesimal) checks of an idealised pin-jointed model; they are not a design, a load rating or a safety assessment. Defer to licensed engineers and local building codes.';

/**
 * Mechanisms and states of self-stress of a pin-jointed frame from the
 * cohomology of its sheaf: dims by Morse reduction, mechanism modes from a
 * basis of H^0 with the allowed rigid-body motions projected out, and
 * self-stress states as the harmonic representatives of H^1, which are
 * exactly the bar forces in equilibrium with no load (ker of the
 * equilibrium matrix δ⁰ᵀ). Classification after Pellegrino & Calladine
 * (1986); the count after Maxwell (1864) and Calladine (1978).
 */
export function analyseFrame(frame: Frame): FrameReport {
  const d = frame.dimension;
  const fs = frameSheaf(frame);
  const sheaf = readModelOrThrow(fs.model);
  const run = computeCohomology(sheaf);
  const [h0, h1] = [run.report.dims[0], run.report.dims[1] ?? 0];
  const rigid = rigidMotions(frame, fs);
  const r = Math.min(rigid.length, h0);
  const m = h0 - r;
  const s = h1;
  const h0Basis = orthonormalise(realSections(sheaf, 0, run));
  const internal = m > 0 ? principalBasis(h0Basis.map((v) => projectOut(v, rigid)), m) : [];
  const mechanismModes = internal.map((v) => {
    const scale = largest(v);
    const mode: Record<string, number[]> = {};
    frame.joints.forEach((j, ji) => {
      const u = new Array<number>(d).fill(0);
      fs.freeAxes[ji].forEach((a, k) => (u[a] = clean(v[fs.offset[ji] + k] / scale)));
      mode[j.id] = u;
    });
    return mode;
  });
  const edges = sheaf.complex.simplices[1];
  const barCell = fs.ends.map(([a, b]) => (edges ? edges.find(Int32Array.of(a, b), 0) : -1));
  const stresses = s > 0 ? harmonicRepresentatives(sheaf, 1, run).vectors : [];
  const selfStressStates = stresses.map((t) => {
    const scale = largest(t);
    const state: Record<string, number> = {};
    frame.bars.forEach((bar, i) => (state[bar.id] = clean(t[barCell[i]] / scale)));
    return state;
  });
  const j = frame.joints.length;
  const b = frame.bars.length;
  const c = frame.joints.reduce((n, jt) => n + jt.fixed.filter(Boolean).length, 0);
  const count = d * j - b - c;
  const net = count - r;
  const predicts = { mechanisms: Math.max(0, net), selfStresses: Math.max(0, -net) };
  const agrees = predicts.mechanisms === m && predicts.selfStresses === s;
  return {
    dimension: d,
    joints: j,
    bars: b,
    constraints: c,
    dims: [h0, h1],
    mechanisms: m,
    rigidMotions: r,
    selfStresses: s,
    selfStressStates,
    mechanismModes,
    classification: classify(m, s, r),
    maxwellCalladine: {
      count,
      formula: `m − s = d·j − b − c − r = ${d}·${j} − ${b} − ${c} − ${r} = ${net}`,
      countPredicts: predicts,
      agrees,
      explanation: explain(agrees, net, m, s, count, h0, h1),
    },
    numericallyUncertain: run.report.numericallyUncertain === true,
    caution: FRAME_CAUTION,
  };
}

function classify(m: number, s: number, r: number): FrameReport['classification'] {
  const statically = s === 0 ? 'determinate' : 'indeterminate';
  const kinematically = m === 0 ? 'determinate' : 'indeterminate';
  const stat = s === 0 ? 'statically determinate' : `statically indeterminate to degree ${s}`;
  const kin = m === 0 ? 'kinematically determinate' : `kinematically indeterminate to degree ${m}`;
  const free = r === 0 ? '' : `; the supports still allow ${r} rigid-body motion${r === 1 ? '' : 's'}`;
  return { statically, kinematically, summary: `${stat}, ${kin}${free}` };
}

function explain(agrees: boolean, net: number, m: number, s: number, count: number, h0: number, h1: number): string {
  const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : word.endsWith('s') ? 'es' : 's'}`;
  const euler = `dim H^0 − dim H^1 = ${h0} − ${h1} = ${count} = d·j − b − c (Maxwell 1864, Calladine 1978)`;
  if (agrees) return `The count and the rank agree: ${euler}.`;
  return (
    `Counting alone (d·j − b − c − r = ${net}) would give ${plural(Math.max(0, net), 'mechanism')} and ${plural(Math.max(0, -net), 'self-stress')}, ` +
    `but the geometry gives ${m} and ${s}: some bars are dependent because of where the joints sit ` +
    `(collinear or parallel bars, for example), which frees ${plural(Math.min(m, s), 'mechanism')} more and locks in as many states of self-stress. ` +
    `m − s = ${m - s} still equals the count, since ${euler}.`
  );
}

function largest(v: ArrayLike<number>): number {
  let m = 0;
  let at = 0;
  for (let i = 0; i < v.length; i++) {
    if (Math.abs(v[i]) > m + 1e-12) {
      m = Math.abs(v[i]);
      at = i;
    }
  }
  return m === 0 ? 1 : Math.sign(v[at]) * m;
}

function clean(x: number): number {
  const r = Math.round(x * 1e9) / 1e9;
  return r === 0 ? 0 : r;
}
