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
  /**
   * Per line in file order: adjusted rise − observed rise, metres (observed
   * + residual = adjusted); the line's redundancy number r = q_vv·p, the
   * residual's standard deviation σ0·√q_vv (mm) and the standardised
   * residual w = v / (σ0·√q_vv). `w` and `sd_mm` are null where the line
   * is not checked by the others (r = 0) or no σ0 is available.
   */
  residuals: { from: string; to: string; residual: number; redundancy: number; sd_mm: number | null; w: number | null }[];
  /** An independent set of loops (a cycle basis of the net). */
  loops: LoopCheck[];
  /** Benchmark-to-benchmark runs: with the loops, one check per degree of freedom. */
  traverses: TraverseCheck[];
  /** A-posteriori standard deviation of unit weight, metres for one kilometre of levelling; null when dof = 0. */
  sigma0: number | null;
  /** Degrees of freedom (redundancy): lines − stations whose height is unknown. */
  dof: number;
  /**
   * Lines failing the standardised residual test, |w| > test.critical, in
   * file order; `allowable_mm` is c·√K for the line's own length, for
   * reference, and `line` the line of lines.csv.
   */
  flagged: { from: string; to: string; residual_mm: number; allowable_mm: number; w: number; redundancy: number; line: number }[];
  /** How lines were flagged: the standardised residual test and the σ0 it used. */
  test: ResidualTest;
  standard: { key: string; name: string; c_mm: number; source: string; rule: string };
  weights: string;
  caution: string;
}

export interface ResidualTest {
  name: string;
  /** A line is flagged when |w| exceeds this. */
  critical: number;
  /** σ0 used, millimetres for one kilometre of levelling; null when none is available (a-posteriori with dof 0). */
  sigma0_mm: number | null;
  sigma0_source: 'a-priori' | 'a-posteriori';
  rule: string;
  source: string;
  /** Σ r over the lines; equals dof (trace of the redundancy matrix). */
  redundancy_sum: number;
  /** The tested line with the largest |w|, the one to look at first; null when no line could be tested. */
  largest: { from: string; to: string; line: number; w: number } | null;
  /** Why the test may say little here (an a-posteriori σ0 bounds |w| by √dof), or null. */
  note: string | null;
}

export interface LevellingOptions {
  /** The tolerance standard; second order, class II when absent. */
  standard?: LevellingStandard;
  /** Critical value of |w|; {@link DEFAULT_CRITICAL} when absent. */
  critical?: number;
  /** An a-priori σ0 in millimetres per √km; the a-posteriori σ0 of this adjustment when absent. */
  sigma0Mm?: number;
}

/**
 * 3.29: the two-sided 0.1 % point of the standard normal distribution, the
 * usual critical value of data snooping (common practice in adjustment
 * computations).
 */
export const DEFAULT_CRITICAL = 3.29;

/** Below this redundancy number a line is taken as unchecked by the rest of the net (a lone spur line has exactly 0). */
const UNCHECKED_REDUNDANCY = 1e-9;

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
  const critical = options.critical ?? DEFAULT_CRITICAL;
  if (!(critical > 0) || !Number.isFinite(critical)) throw new RangeError(`critical value ${critical} must be a positive number`);
  if (options.sigma0Mm !== undefined && (!(options.sigma0Mm > 0) || !Number.isFinite(options.sigma0Mm))) throw new RangeError(`a-priori σ0 = ${options.sigma0Mm} mm must be a positive number`);
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
  const adjustment = adjustObservations(sheaf, { values, weights, fixed }, { unexplained: false, cofactors: true });
  if (adjustment.undetermined.length > 0) {
    throw new Error(`internal check failed: station "${net.stations[adjustment.undetermined[0]].id}" is undetermined after validation`);
  }
  const H = adjustment.x;
  const heights: Record<string, number> = {};
  net.stations.forEach((s, i) => (heights[s.id] = round(H[i], 6)));
  const v = net.lines.map((l, i) => H[to[i]] - H[from[i]] - l.rise);
  let wss = 0;
  v.forEach((x, i) => (wss += (x * x) / net.lines[i].lengthKm));
  const dof = net.lines.length - adjustment.rank;
  const sigma0 = options.sigma0Mm !== undefined ? options.sigma0Mm / 1000 : dof > 0 ? Math.sqrt(wss / dof) : undefined;
  const cofactor = adjustment.adjustedCofactor!;
  let redundancySum = 0;
  let largest: ResidualTest['largest'] = null;
  const flagged: LevellingReport['flagged'] = [];
  const residuals = net.lines.map((l, i) => {
    // One row of the design serves every line between the same two stations: the same aᵀQa.
    const cell = edges.find(Int32Array.of(Math.min(from[i], to[i]), Math.max(from[i], to[i])), 0);
    // q_vv = 1/p − aᵀ Q_x̂x̂ a, the diagonal of Q_vv = P⁻¹ − A(AᵀPA)⁻¹Aᵀ (common practice).
    const qvv = Math.max(0, l.lengthKm - cofactor[cell]);
    let r = qvv / l.lengthKm;
    if (r < UNCHECKED_REDUNDANCY) r = 0;
    redundancySum += r;
    const sd = r > 0 && sigma0 !== undefined && sigma0 > 0 ? sigma0 * Math.sqrt(qvv) : undefined;
    const w = sd === undefined ? undefined : v[i] / sd;
    if (w !== undefined && (largest === null || Math.abs(w) > Math.abs(largest.w))) largest = { from: l.from, to: l.to, line: l.line, w: round(w, 3) };
    if (w !== undefined && Math.abs(w) > critical) {
      flagged.push({ from: l.from, to: l.to, residual_mm: round(v[i] * 1000, 3), allowable_mm: round(allowableMm(standard, l.lengthKm), 3), w: round(w, 3), redundancy: round(r, 6), line: l.line });
    }
    return { from: l.from, to: l.to, residual: round(v[i], 6), redundancy: round(r, 6), sd_mm: sd === undefined ? null : round(sd * 1000, 3), w: w === undefined ? null : round(w, 3) };
  });
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
    test: {
      name: 'standardised residual test (data snooping)',
      critical,
      sigma0_mm: sigma0 === undefined ? null : round(sigma0 * 1000, 6),
      sigma0_source: options.sigma0Mm !== undefined ? 'a-priori' : 'a-posteriori',
      rule: 'w = v / (σ0·√q_vv), q_vv the diagonal of Q_vv = P⁻¹ − A(AᵀPA)⁻¹Aᵀ; flag |w| > critical; r = q_vv·p is the share of an error in the line that shows in its own residual. Remove or re-observe the line with the largest |w| first, then adjust again',
      source: "common practice in adjustment computations (Baarda's data snooping; critical value 3.29 = two-sided 0.1 % normal point, from memory)",
      redundancy_sum: round(redundancySum, 6),
      largest,
      note: testNote(options.sigma0Mm !== undefined, dof, critical),
    },
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

/**
 * With σ0 estimated from the same residuals, w_i² ≤ vᵀPv / σ̂0² = dof
 * (each v_i²/q_vv,i is at most vᵀPv), so a critical value at or above √dof
 * can never be reached.
 */
function testNote(aPriori: boolean, dof: number, critical: number): string | null {
  if (aPriori) return null;
  if (dof === 0) return 'no degrees of freedom: no σ0 can be estimated and no line can be tested; give an a-priori σ0';
  const bound = Math.sqrt(dof);
  if (bound > critical) return null;
  return `with the a-posteriori σ0 no |w| can exceed √dof = ${bound.toFixed(2)}, so the critical value ${critical} cannot be reached; give an a-priori σ0 (mm per √km) to test the lines`;
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
