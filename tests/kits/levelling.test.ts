/**
 * The levelling-net kit. Loop misclosure and allowable c·√K follow
 * check-values.md ("Levelling networks": the sum of observed differences
 * around a loop should be zero, common practice; c = 4, 6, 8, 12 mm for
 * first order class II, second order classes I and II, third order, from
 * memory after the FGCC 1984 standards). Weights 1/length are the textbook
 * choice (Ghilani, Adjustment Computations, from memory); adjusted heights
 * are checked against an independent weighted least-squares solve with
 * ml-matrix, and σ0, dof by hand.
 */
import { inverse, Matrix, solve } from 'ml-matrix';
import { describe, expect, test } from 'vitest';
import { adjustLevellingNet, customStandard, levellingStandard, readLevellingCsv, type LevellingNet } from '../../shared/kits';

function net(stations: string, lines: string): LevellingNet {
  const r = readLevellingCsv(stations, lines);
  if (!r.net) throw new Error(JSON.stringify(r.problems));
  return r.net;
}

/*
 * A hand-checkable net: benchmark A at 100.000 m, stations B and C.
 *   A → B  +2.010 m  1 km
 *   B → C  +1.005 m  2 km
 *   C → A  −3.000 m  1 km
 * Loop A-B-C: misclosure 2.010 + 1.005 − 3.000 = +0.015 m = 15 mm, K = 4 km.
 * Allowable (second order, class II): 8 √4 = 16 mm, so the loop passes;
 * first order class II: 4 √4 = 8 mm, so it fails.
 * With weights 1/L the single loop's misclosure is spread in proportion to
 * length: v = −15·L/4 mm = −3.75, −7.5, −3.75 mm, so
 *   H_B = 100 + 2.010 − 0.00375 = 102.00625 m,
 *   H_C = 102.00625 + 1.005 − 0.0075 = 103.00375 m.
 * dof = 3 lines − 2 unknown heights = 1;
 * vᵀWv = 3.75²/1 + 7.5²/2 + 3.75²/1 = 56.25 mm², σ0 = √56.25 = 7.5 mm (per √km).
 */
const HAND_STATIONS = 'id,height\nA,100.000\nB,\nC,\n';
const HAND_LINES = 'from,to,rise,length_km\nA,B,2.010,1\nB,C,1.005,2\nC,A,-3.000,1\n';

describe('a hand-checkable loop', () => {
  const report = adjustLevellingNet(net(HAND_STATIONS, HAND_LINES));
  test('loop misclosure 15 mm over 4 km against 8 √4 = 16 mm (check-values.md; hand computation)', () => {
    expect(report.loops).toHaveLength(1);
    const loop = report.loops[0];
    expect([...loop.stations].sort()).toEqual(['A', 'B', 'C']);
    expect(Math.abs(loop.misclosure_mm)).toBeCloseTo(15, 9);
    expect(loop.length_km).toBe(4);
    expect(loop.allowable_mm).toBe(16);
    expect(loop.ok).toBe(true);
  });
  test('adjusted heights spread the misclosure in proportion to length (hand computation)', () => {
    expect(report.heights).toEqual({ A: 100, B: 102.00625, C: 103.00375 });
    expect(report.residuals.map((r) => r.residual * 1000)).toEqual([-3.75, -7.5, -3.75].map((x) => expect.closeTo(x, 6)));
  });
  test('σ0 = 7.5 mm per √km and dof = 1 (common practice; hand computation)', () => {
    expect(report.dof).toBe(1);
    expect(report.sigma0).toBeCloseTo(0.0075, 9);
  });
  test('the standard is on the report; first order class II (4 √4 = 8 mm) fails the loop', () => {
    expect(report.standard).toMatchObject({ key: 'second-II', c_mm: 8 });
    expect(report.standard.source).toMatch(/FGCC|Federal Geodetic Control Committee/);
    expect(report.caution).toMatch(/local survey regulations/);
    const strict = adjustLevellingNet(net(HAND_STATIONS, HAND_LINES), { standard: levellingStandard('first-II') });
    expect(strict.loops[0]).toMatchObject({ allowable_mm: 8, ok: false });
    const third = adjustLevellingNet(net(HAND_STATIONS, HAND_LINES), { standard: levellingStandard('third') });
    expect(third.loops[0].allowable_mm).toBe(24);
    const own = adjustLevellingNet(net(HAND_STATIONS, HAND_LINES), { standard: customStandard(5) });
    expect(own.standard).toMatchObject({ key: 'custom', c_mm: 5 });
    expect(own.loops[0].allowable_mm).toBe(10);
  });
  /*
   * One loop of length K through one benchmark: Q_vv = P⁻¹Bᵀ(BP⁻¹Bᵀ)⁻¹BP⁻¹
   * with B the loop's row of signs, so q_vv = L²/K and r = L/K:
   * 1/4, 2/4, 1/4, summing to dof = 1 (common practice; hand computation).
   * σ_v = σ0·L/√K = 7.5·(1, 2, 1)/2 = 3.75, 7.5, 3.75 mm with σ0 = 7.5 mm,
   * and w = v/σ_v = −1 on every line: one loop cannot tell which line erred.
   */
  test('redundancy numbers L/K = 0.25, 0.5, 0.25 sum to dof; w = −1 on every line with the a-posteriori σ0 (hand computation)', () => {
    expect(report.residuals.map((r) => r.redundancy)).toEqual([0.25, 0.5, 0.25]);
    expect(report.test.redundancy_sum).toBe(report.dof);
    expect(report.residuals.map((r) => r.sd_mm)).toEqual([3.75, 7.5, 3.75]);
    expect(report.residuals.map((r) => r.w)).toEqual([-1, -1, -1]);
    expect(report.test).toMatchObject({ critical: 3.29, sigma0_mm: 7.5, sigma0_source: 'a-posteriori' });
    expect(report.test.source).toMatch(/common practice/);
    expect(report.flagged).toEqual([]);
    // √dof = 1 < 3.29: the report says why nothing can be flagged.
    expect(report.test.note).toMatch(/√dof = 1\.00/);
  });
  test('with an a-priori σ0 the test can flag: 1 mm gives w = −7.5 on every line, 3 mm gives −2.5 (flagged only below critical 2.5)', () => {
    const tight = adjustLevellingNet(net(HAND_STATIONS, HAND_LINES), { sigma0Mm: 1 });
    expect(tight.residuals.map((r) => r.w)).toEqual([-7.5, -7.5, -7.5]);
    expect(tight.flagged.map((f) => `${f.from}-${f.to}`)).toEqual(['A-B', 'B-C', 'C-A']);
    expect(tight.flagged[1]).toEqual({ from: 'B', to: 'C', residual_mm: -7.5, allowable_mm: 11.314, w: -7.5, redundancy: 0.5, line: 3 });
    expect(tight.test).toMatchObject({ sigma0_mm: 1, sigma0_source: 'a-priori', note: null });
    const loose = adjustLevellingNet(net(HAND_STATIONS, HAND_LINES), { sigma0Mm: 3 });
    expect(loose.residuals.map((r) => r.w)).toEqual([-2.5, -2.5, -2.5]);
    expect(loose.flagged).toEqual([]);
    const edited = adjustLevellingNet(net(HAND_STATIONS, HAND_LINES), { sigma0Mm: 3, critical: 2.4 });
    expect(edited.flagged).toHaveLength(3);
    expect(edited.test.critical).toBe(2.4);
  });
  test('a spur line has redundancy 0 and is not tested; bad test settings are refused', () => {
    const spur = adjustLevellingNet(net(HAND_STATIONS + 'D,\n', HAND_LINES + 'C,D,0.5,0.7\n'), { sigma0Mm: 1 });
    expect(spur.residuals[3]).toMatchObject({ from: 'C', to: 'D', residual: 0, redundancy: 0, sd_mm: null, w: null });
    expect(spur.test.redundancy_sum).toBe(1);
    expect(() => adjustLevellingNet(net(HAND_STATIONS, HAND_LINES), { critical: 0 })).toThrow(RangeError);
    expect(() => adjustLevellingNet(net(HAND_STATIONS, HAND_LINES), { sigma0Mm: -1 })).toThrow(RangeError);
  });
});

describe('benchmark to benchmark', () => {
  test('a run between two benchmarks is checked against their fixed difference; dof counts it', () => {
    // A (100) → B +2.000 → D (105): observed 2.000 + 2.994 = 4.994 m, fixed 5.000 m: −6 mm over 2 km.
    const r = adjustLevellingNet(net('id,height\nA,100\nB,\nD,105\n', 'from,to,rise,length_km\nA,B,2.000,1\nB,D,2.994,1\n'));
    expect(r.loops).toEqual([]);
    expect(r.traverses).toHaveLength(1);
    expect(r.traverses[0]).toMatchObject({ stations: ['A', 'B', 'D'], length_km: 2 });
    expect(r.traverses[0].misclosure_mm).toBeCloseTo(-6, 9);
    expect(r.dof).toBe(1);
    // The −6 mm is split equally: B = 100 + 2.000 + 0.003.
    expect(r.heights.B).toBeCloseTo(102.003, 9);
  });
});

describe('against an independent least-squares solve (ml-matrix)', () => {
  // An invented net of 12 stations, 3 benchmarks, 24 lines including two repeated runs.
  let seed = 99;
  const rand = () => ((seed = (seed * 16807) % 2147483647) / 2147483647);
  const ids = Array.from({ length: 12 }, (_, i) => `S${i}`);
  const truth = ids.map(() => 100 + rand() * 50);
  const benchmarks = new Set([0, 4, 9]);
  const lines: [number, number, number, number][] = [];
  for (let i = 1; i < 12; i++) lines.push([i - 1, i, 0, 0]);
  for (let k = 0; k < 11; k++) {
    const a = Math.floor(rand() * 12);
    const b = (a + 1 + Math.floor(rand() * 11)) % 12;
    lines.push([a, b, 0, 0]);
  }
  lines.push([3, 4, 0, 0], [4, 3, 0, 0]); // repeated runs, one in each direction
  for (const l of lines) {
    l[3] = 0.3 + rand() * 1.5;
    l[2] = truth[l[1]] - truth[l[0]] + (rand() - 0.5) * 0.004 * Math.sqrt(l[3]);
  }
  const stationsCsv = 'id,height\n' + ids.map((id, i) => `${id},${benchmarks.has(i) ? truth[i].toFixed(4) : ''}`).join('\n');
  const linesCsv = 'from,to,rise,length_km\n' + lines.map(([a, b, r, L]) => `${ids[a]},${ids[b]},${r.toFixed(5)},${L.toFixed(3)}`).join('\n');
  const theNet = net(stationsCsv, linesCsv);
  const report = adjustLevellingNet(theNet);

  test('heights, residuals, σ0 and dof agree with ml-matrix on the written-out design', () => {
    const free = ids.map((_, i) => i).filter((i) => !benchmarks.has(i));
    const H = theNet.stations.map((s) => s.height);
    const rows: number[][] = [];
    const rhs: number[] = [];
    for (const l of theNet.lines) {
      const a = ids.indexOf(l.from);
      const b = ids.indexOf(l.to);
      const sw = Math.sqrt(1 / l.lengthKm);
      rows.push(free.map((v) => (v === b ? sw : v === a ? -sw : 0)));
      let r = l.rise;
      if (H[b] !== undefined) r -= H[b]!;
      if (H[a] !== undefined) r += H[a]!;
      rhs.push(sw * r);
    }
    const x = solve(new Matrix(rows), Matrix.columnVector(rhs)).to1DArray();
    free.forEach((v, k) => expect(report.heights[ids[v]]).toBeCloseTo(x[k], 6));
    const heights = ids.map((id, i) => (benchmarks.has(i) ? H[i]! : x[free.indexOf(i)]));
    let vwv = 0;
    theNet.lines.forEach((l, i) => {
      const v = heights[ids.indexOf(l.to)] - heights[ids.indexOf(l.from)] - l.rise;
      expect(report.residuals[i].residual).toBeCloseTo(v, 6);
      vwv += (v * v) / l.lengthKm;
    });
    const dof = theNet.lines.length - free.length;
    expect(report.dof).toBe(dof);
    expect(report.sigma0!).toBeCloseTo(Math.sqrt(vwv / dof), 8);
  });

  test('redundancy numbers, σ_v and w agree with a dense Q_vv = P⁻¹ − A(AᵀPA)⁻¹Aᵀ from ml-matrix (common practice)', () => {
    const free = ids.map((_, i) => i).filter((i) => !benchmarks.has(i));
    const A = new Matrix(theNet.lines.map((l) => free.map((v) => (v === ids.indexOf(l.to) ? 1 : v === ids.indexOf(l.from) ? -1 : 0))));
    const P = Matrix.diag(theNet.lines.map((l) => 1 / l.lengthKm));
    const Qxx = inverse(A.transpose().mmul(P).mmul(A));
    const Qvv = Matrix.diag(theNet.lines.map((l) => l.lengthKm)).sub(A.mmul(Qxx).mmul(A.transpose()));
    const sigma0 = report.test.sigma0_mm! / 1000;
    let sum = 0;
    theNet.lines.forEach((l, i) => {
      const q = Qvv.get(i, i);
      const r = q / l.lengthKm;
      sum += r;
      expect(report.residuals[i].redundancy).toBeCloseTo(r, 6);
      expect(report.residuals[i].sd_mm!).toBeCloseTo(sigma0 * Math.sqrt(q) * 1000, 3);
      const v = report.residuals[i].residual;
      expect(report.residuals[i].w!).toBeCloseTo(v / (sigma0 * Math.sqrt(q)), 1);
    });
    // The trace of the redundancy matrix is the number of degrees of freedom.
    expect(sum).toBeCloseTo(report.dof, 9);
    expect(report.test.redundancy_sum).toBeCloseTo(report.dof, 6);
    // With σ0 from these residuals, w² ≤ dof on every line.
    for (const r of report.residuals) expect(Math.abs(r.w!)).toBeLessThanOrEqual(Math.sqrt(report.dof) + 1e-3);
  });

  test('loops form a cycle basis: lines − stations + 1 closed walks, each checked by its own sum of rises', () => {
    expect(report.loops).toHaveLength(theNet.lines.length - ids.length + 1);
    // Benchmark runs: 3 benchmarks in one piece give 2; loops + runs = dof.
    expect(report.traverses).toHaveLength(2);
    expect(report.loops.length + report.traverses.length).toBe(report.dof);
    for (const loop of report.loops) {
      const s = loop.stations;
      let sum = 0;
      let length = 0;
      for (let i = 0; i < s.length; i++) {
        const a = s[i];
        const b = s[(i + 1) % s.length];
        // Some line joins each consecutive pair (repeated runs make 2-station loops).
        const candidates = theNet.lines.filter((l) => (l.from === a && l.to === b) || (l.from === b && l.to === a));
        expect(candidates.length).toBeGreaterThan(0);
        if (s.length === 2) continue;
        const l = candidates[0];
        sum += l.from === a ? l.rise : -l.rise;
        length += l.lengthKm;
      }
      if (s.length > 2 && new Set(s).size === s.length) {
        expect(loop.misclosure_mm).toBeCloseTo(sum * 1000, 2);
        expect(loop.length_km).toBeCloseTo(length, 5);
      }
    }
  });
});

describe('readLevellingCsv rejects bad input with one located problem each', () => {
  const ok = 'id,height\nA,100\nB,\n';
  test.each([
    [ok, 'from,to,rise,length_km\nA,X,1,1\n', /lines\.csv line 2: unknown station "X"/],
    [ok, 'from,to,rise,length_km\nA,B,abc,1\n', /lines\.csv line 2: rise "abc" is not a number/],
    [ok, 'from,to,rise,length_km\nA,B,"1,5",1\n', /decimal point/],
    [ok, 'from,to,rise,length_km\nA,B,1,0\n', /lines\.csv line 2: length_km 0 must be positive/],
    [ok, 'from,to,rise,length_km\nA,B,1,-2\n', /must be positive/],
    [ok, 'from,to,rise,length_km\nA,A,1,1\n', /starts and ends at station "A"/],
    ['id,height\nA,100\nB,\nC,\n', 'from,to,rise,length_km\nA,B,1,1\n', /stations\.csv line 4: station "C" has no path of lines to a benchmark/],
    ['id,height\nA,\nB,\n', 'from,to,rise,length_km\nA,B,1,1\n', /no benchmark/],
    ['id,height\nA,100\nA,\n', 'from,to,rise,length_km\n', /station "A" is listed twice/],
    ['id,height\nA,1oo\n', 'from,to,rise,length_km\n', /height of station "A": "1oo" is not a number/],
    [ok, 'from,to,rise\nA,B,1\n', /missing column "length_km"/],
  ])('%#: %s / %s', (stations, lines, message) => {
    const r = readLevellingCsv(stations, lines);
    expect(r.net).toBeUndefined();
    expect(r.problems.length).toBeGreaterThan(0);
    expect(`${r.problems[0].where}: ${r.problems[0].message}`).toMatch(message);
  });
  test('semicolons and a byte-order mark are read; extra columns are ignored', () => {
    const r = readLevellingCsv('\ufeffid;height;note\nA;100;north pillar\nB;;\n', 'from;to;rise;length_km\nA;B;1.5;0.8\n');
    expect(r.problems).toEqual([]);
    expect(adjustLevellingNet(r.net!).heights).toEqual({ A: 100, B: 101.5 });
  });
});

describe('a net of thousands of lines', () => {
  test('a 60 × 60 grid net (3600 stations, 7080 lines, 4 benchmarks): Σ r = dof and every r in [0, 1]', () => {
    const side = 60;
    const id = (i: number, j: number) => `P${i}_${j}`;
    const corners = new Set([id(0, 0), id(0, side - 1), id(side - 1, 0), id(side - 1, side - 1)]);
    const stations = ['id,height'];
    for (let i = 0; i < side; i++) for (let j = 0; j < side; j++) stations.push(`${id(i, j)},${corners.has(id(i, j)) ? (100 + i + j).toFixed(3) : ''}`);
    const lines = ['from,to,rise,length_km'];
    let k = 0;
    const wobble = () => (((k++ * 7919) % 13) - 6) * 0.0002;
    for (let i = 0; i < side; i++)
      for (let j = 0; j < side; j++) {
        if (j + 1 < side) lines.push(`${id(i, j)},${id(i, j + 1)},${(1 + wobble()).toFixed(4)},${(0.4 + (k % 5) * 0.1).toFixed(2)}`);
        if (i + 1 < side) lines.push(`${id(i, j)},${id(i + 1, j)},${(1 + wobble()).toFixed(4)},${(0.4 + (k % 7) * 0.1).toFixed(2)}`);
      }
    const r = adjustLevellingNet(net(stations.join('\n'), lines.join('\n')));
    expect(r.residuals).toHaveLength(2 * side * (side - 1));
    expect(r.dof).toBe(2 * side * (side - 1) - (side * side - 4));
    expect(r.test.redundancy_sum).toBeCloseTo(r.dof, 4);
    for (const x of r.residuals) {
      expect(x.redundancy).toBeGreaterThanOrEqual(0);
      expect(x.redundancy).toBeLessThanOrEqual(1);
    }
  });
});
