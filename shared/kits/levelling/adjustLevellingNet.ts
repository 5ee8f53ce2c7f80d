import { adjustObservations } from '../../engine/data/adjustObservations';
import { readModelOrThrow } from '../../engine/model/readModel';
import type { ModelFile } from '../../engine/model/ModelFile';
import { cycleBasis, shortestPath } from './cycleBasis';
import type { LevellingNet } from './LevellingNet';
import { allowableMm, levellingStandard, type LevellingStandard } from './LevellingStandard';

/** A closed loop of lines and how far its observed rises fail to sum to zero. */
export interface LoopCheck {
  /** Stations in walking order; the loop returns from the last to the first. */
  stations: string[];
  /** Sum of the observed rises walked around the loop, millimetres. */
  misclosure_mm: number;
  length_km: number;
  /** c · √K for the standard used. */
  allowable_mm: number;
  ok: boolean;
}

/** A run of lines from one benchmark to another: observed rises against the fixed heights. */
export interface TraverseCheck extends LoopCheck {
  /** Sum of observed rises minus (height of the last benchmark − height of the first). */
  misclosure_mm: number;
}

export interface LevellingReport {
  /** Adjusted heights, metres; benchmarks keep their fixed heights. */
  heights: Record<string, number>;
  /** Per line in file order: adjusted rise − observed rise, metres (observed + residual = adjusted). */
  residuals: { from: string; to: string; residual: number }[];
  /** An independent set of loops (a cycle basis of the net). */
  loops: LoopCheck[];
  /** Benchmark-to-benchmark runs: with the loops, one check per degree of freedom. */
  traverses: TraverseCheck[];
  /** A-posteriori standard deviation of unit weight, metres for one kilometre of levelling; null when dof = 0. */
  sigma0: number | null;
  /** Degrees of freedom (redundancy): lines − stations whose height is unknown. */
  dof: number;
  /** Lines whose residual exceeds the standard's allowable c·√K for the line's own length. */
  flagged: { from: string; to: string; residual_mm: number; allowable_mm: number }[];
  standard: { key: string; name: string; c_mm: number; source: string; rule: string };
  weights: string;
  caution: string;
}

export interface LevellingOptions {
  /** The tolerance standard; second order, class II when absent. */
  standard?: LevellingStandard;
}

export const LEVELLING_CAUTION =
  'Survey adjustments depend on the observation weights and on the tolerance standard chosen; both are shown in this report. Defer to local survey regulations.';

/**
 * Least-squares adjustment of a levelling net as observations on the edges
 * of the constant sheaf R on its graph (check-values.md, "Levelling
 * networks"): weights 1/length (common practice), benchmarks held fixed.
 * Repeated lines between the same two stations enter as their weighted
 * mean for the heights, and one by one for residuals, σ0 and the degrees of
 * freedom, which gives the same answer as adjusting them separately.
 */
export function adjustLevellingNet(net: LevellingNet, options: LevellingOptions = {}): LevellingReport {
  const standard = options.standard ?? levellingStandard()!;
  const n = net.stations.length;
  const index = new Map(net.stations.map((s, i) => [s.id, i]));
  const from = Int32Array.from(net.lines, (l) => index.get(l.from)!);
  const to = Int32Array.from(net.lines, (l) => index.get(l.to)!);
  // One edge per pair of stations, oriented from the lower index.
  const edgeOf = new Map<string, number>();
  const pairs: [number, number][] = [];
  const sumW: number[] = [];
  const sumWR: number[] = [];
  net.lines.forEach((l, i) => {
    const a = Math.min(from[i], to[i]);
    const b = Math.max(from[i], to[i]);
    const key = `${a},${b}`;
    let e = edgeOf.get(key);
    if (e === undefined) {
      e = pairs.push([a, b]) - 1;
      edgeOf.set(key, e);
      sumW.push(0);
      sumWR.push(0);
    }
    const w = 1 / l.lengthKm;
    sumW[e] += w;
    sumWR[e] += w * (from[i] === a ? l.rise : -l.rise);
  });
  const model: ModelFile = {
    format: 'gluefield.sheaf',
    version: 1,
    field: { kind: 'real' },
    simplices: [...net.stations.map((_, i) => [i]), ...pairs],
    stalks: { default: 1 },
    maps: { default: 'identity' },
  };
  const sheaf = readModelOrThrow(model);
  const edges = sheaf.complex.simplices[1];
  const values = new Float64Array(edges.size);
  const weights = new Float64Array(edges.size);
  pairs.forEach(([a, b], e) => {
    const cell = edges.find(Int32Array.of(a, b), 0);
    values[cell] = sumWR[e] / sumW[e];
    weights[cell] = sumW[e];
  });
  const fixed = net.stations.flatMap((s, i) => (s.height === undefined ? [] : [{ vertex: i, value: [s.height] }]));
  // Loop misclosures below describe the class in H^1 in the surveyor's terms.
  const adjustment = adjustObservations(sheaf, { values, weights, fixed }, { unexplained: false });
  if (adjustment.undetermined.length > 0) {
    throw new Error(`internal check failed: station "${net.stations[adjustment.undetermined[0]].id}" is undetermined after validation`);
  }
  const H = adjustment.x;
  const heights: Record<string, number> = {};
  net.stations.forEach((s, i) => (heights[s.id] = round(H[i], 6)));
  let wss = 0;
  const flagged: LevellingReport['flagged'] = [];
  const residuals = net.lines.map((l, i) => {
    const v = H[to[i]] - H[from[i]] - l.rise;
    wss += (v * v) / l.lengthKm;
    const allow = allowableMm(standard, l.lengthKm);
    if (Math.abs(v * 1000) > allow) flagged.push({ from: l.from, to: l.to, residual_mm: round(v * 1000, 3), allowable_mm: round(allow, 3) });
    return { from: l.from, to: l.to, residual: round(v, 6) };
  });
  const dof = net.lines.length - adjustment.rank;
  const check = (stations: number[], edgesWalked: number[], signs: number[], offset: number): LoopCheck => {
    let sum = 0;
    let length = 0;
    edgesWalked.forEach((e, k) => {
      sum += signs[k] * net.lines[e].rise;
      length += net.lines[e].lengthKm;
    });
    const misclosure = (sum - offset) * 1000;
    const allow = allowableMm(standard, length);
    return {
      stations: stations.map((v) => net.stations[v].id),
      misclosure_mm: round(misclosure, 3),
      length_km: round(length, 6),
      allowable_mm: round(allow, 3),
      ok: Math.abs(misclosure) <= allow,
    };
  };
  const loops = cycleBasis(n, from, to).map((c) => check(c.vertices, c.edges, c.signs, 0));
  const traverses = benchmarkRuns(net, from, to).map((p) => {
    const a = p.vertices[0];
    const b = p.vertices[p.vertices.length - 1];
    return check(p.vertices, p.edges, p.signs, net.stations[b].height! - net.stations[a].height!);
  });
  return {
    heights,
    residuals,
    loops,
    traverses,
    sigma0: dof > 0 ? round(Math.sqrt(wss / dof), 9) : null,
    dof,
    flagged,
    standard: {
      key: standard.key,
      name: standard.name,
      c_mm: standard.cMm,
      source: standard.source,
      rule: 'allowable misclosure = c·√K mm, K the length in km',
    },
    weights: 'w = 1 / length_km (common practice)',
    caution: LEVELLING_CAUTION,
  };
}

/** In each connected piece, a shortest run from its first benchmark to each other benchmark. */
function benchmarkRuns(net: LevellingNet, from: Int32Array, to: Int32Array) {
  const n = net.stations.length;
  const piece = new Int32Array(n).fill(-1);
  const adjacency: number[][] = Array.from({ length: n }, () => []);
  for (let e = 0; e < from.length; e++) {
    adjacency[from[e]].push(to[e]);
    adjacency[to[e]].push(from[e]);
  }
  const firstBenchmark = new Map<number, number>();
  const runs: ReturnType<typeof shortestPath>[] = [];
  for (let s = 0; s < n; s++) {
    if (piece[s] < 0) {
      piece[s] = s;
      const queue = [s];
      for (let q = 0; q < queue.length; q++) {
        for (const w of adjacency[queue[q]]) {
          if (piece[w] < 0) {
            piece[w] = s;
            queue.push(w);
          }
        }
      }
    }
    if (net.stations[s].height === undefined) continue;
    const first = firstBenchmark.get(piece[s]);
    if (first === undefined) firstBenchmark.set(piece[s], s);
    else runs.push(shortestPath(n, from, to, first, s));
  }
  return runs.filter((r): r is NonNullable<typeof r> => r !== undefined);
}

function round(x: number, digits: number): number {
  const f = 10 ** digits;
  const r = Math.round(x * f) / f;
  return r === 0 ? 0 : r;
}
