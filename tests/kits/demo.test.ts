/**
 * The invented demo data of shared/kits/demo runs through each kit and
 * shows what its README promises. (The numbers are invented; the
 * expectations follow from how the data were made.)
 */
import { readFileSync } from 'node:fs';
import { describe, expect, test } from 'vitest';
import { importAny } from '../../shared/import';
import { adjustLevellingNet, analyseFrame, analyseMesh, readFrameCsv, readLevellingCsv } from '../../shared/kits';

const demo = (name: string) => readFileSync(new URL(`../../shared/kits/demo/${name}`, import.meta.url), 'utf8');

describe('kit demo data', () => {
  test('ridge-line net: the blunder on RL-04 → RL-07 fails both its loops and has the largest standardised residual', () => {
    const read = readLevellingCsv(demo('ridge-line-stations.csv'), demo('ridge-line-lines.csv'));
    expect(read.problems).toEqual([]);
    const r = adjustLevellingNet(read.net!);
    expect(Object.keys(r.heights)).toHaveLength(12);
    // 16 lines, 10 unknown heights: dof 6 = 5 loops + 1 benchmark-to-benchmark run.
    expect(r.dof).toBe(6);
    expect(r.loops).toHaveLength(5);
    expect(r.traverses).toHaveLength(1);
    const failing = r.loops.filter((l) => !l.ok);
    expect(failing).toHaveLength(2);
    for (const l of failing) expect(l.stations).toEqual(expect.arrayContaining(['RL-04', 'RL-07']));
    // With σ0 from these residuals |w| ≤ √6 = 2.45 < 3.29: nothing can be flagged, and the report says so.
    expect(r.flagged).toEqual([]);
    expect(r.test.largest).toMatchObject({ from: 'RL-04', to: 'RL-07' });
    expect(r.test.note).toMatch(/√dof = 2\.45/);
    // An a-priori σ0 of 3 mm per √km (a setting invented for the demo) flags exactly the blunder.
    const apriori = adjustLevellingNet(read.net!, { sigma0Mm: 3 });
    expect(apriori.flagged.map((f) => `${f.from}→${f.to}`)).toEqual(['RL-04→RL-07']);
    expect(apriori.flagged[0].w).toBeLessThan(-3.29);
  });
  test('footbridge truss: determinate; with the extra diagonal one self-stress in panel L1-L2-U2-U1', () => {
    const plain = readFrameCsv(demo('footbridge-joints.csv'), demo('footbridge-bars.csv'));
    expect(analyseFrame(plain.frame!)).toMatchObject({ dims: [0, 0], mechanisms: 0, selfStresses: 0 });
    const extra = analyseFrame(readFrameCsv(demo('footbridge-joints.csv'), demo('footbridge-bars-extra-diagonal.csv')).frame!);
    expect(extra).toMatchObject({ dims: [0, 1], selfStresses: 1 });
    const loaded = Object.entries(extra.selfStressStates[0]).filter(([, t]) => t !== 0).map(([id]) => id);
    expect(loaded.sort()).toEqual(['D2', 'D3', 'D4', 'LC2', 'UC1', 'X1']);
  });
  test('culvert ring: a torus, Betti numbers (1, 2, 1), closed and orientable', () => {
    const imported = importAny('culvert-ring.obj', demo('culvert-ring.obj'));
    if (!('model' in imported)) throw new Error('demo mesh did not import');
    expect(analyseMesh(imported.model)).toMatchObject({ betti: [1, 2, 1], closed: true, orientable: true, windingConsistent: true });
  });
});
