import { readFileSync } from 'node:fs';
import { describe, expect, test } from 'vitest';
import { createKitService, MESH_CYCLE_LIMIT } from '../../src/compute/kitService';
import { kleinBottle, toObj } from '../kits/meshText';

const demo = (name: string) => readFileSync(new URL(`../../shared/kits/demo/${name}`, import.meta.url), 'utf8');
const kits = createKitService();

describe('the kit methods of the compute service', () => {
  test('the invented ridge-line net: five loops, two over second order class II, the cross link RL-04 → RL-07 flagged with an a-priori σ0, an automatic layout', async () => {
    const out = await kits.levelNet('stations.csv', demo('ridge-line-stations.csv'), 'lines.csv', demo('ridge-line-lines.csv'), { standard: 'second-II', sigma0Mm: 3 });
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    expect(out.result.report.loops).toHaveLength(5);
    expect(out.result.report.loops.filter((l) => !l.ok)).toHaveLength(2);
    expect(out.result.report.flagged.map((f) => `${f.from}-${f.to}`)).toEqual(['RL-04-RL-07']);
    expect(out.result.positionsGiven).toBe(false);
    expect(out.result.positions).toHaveLength(2 * out.result.stations.length);
    expect(out.result.positions.every((p) => p >= 0 && p <= 1)).toBe(true);
  });

  test('a project tolerance replaces the listed standard; a non-positive c is a located problem', async () => {
    const loose = await kits.levelNet('s.csv', demo('ridge-line-stations.csv'), 'l.csv', demo('ridge-line-lines.csv'), { standard: 'custom', cMm: 40 });
    expect(loose.ok && loose.result.report.loops.every((l) => l.ok)).toBe(true);
    expect(loose.ok && loose.result.report.standard.c_mm).toBe(40);
    const bad = await kits.levelNet('s.csv', demo('ridge-line-stations.csv'), 'l.csv', demo('ridge-line-lines.csv'), { standard: 'custom', cMm: 0 });
    expect(bad.ok).toBe(false);
  });

  test('bad residual-test settings are located problems, not throws', async () => {
    for (const settings of [{ standard: 'third', critical: 0 }, { standard: 'third', sigma0Mm: Number.NaN }]) {
      const out = await kits.levelNet('s.csv', demo('ridge-line-stations.csv'), 'l.csv', demo('ridge-line-lines.csv'), settings);
      expect(out.ok).toBe(false);
      if (!out.ok) expect(out.problems[0].where).toBe('residual test');
    }
  });

  test('stations with x, y columns are drawn at their positions (east to the right, north up)', async () => {
    const stations = 'id,height,x,y\nA,10,0,0\nB,,100,0\nC,,0,100\n';
    const lines = 'from,to,rise,length_km\nA,B,1,0.1\nB,C,1,0.1\nC,A,-2,0.1\n';
    const out = await kits.levelNet('s.csv', stations, 'l.csv', lines, { standard: 'third' });
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    expect(out.result.positionsGiven).toBe(true);
    const [ax, ay, bx, , , cy] = out.result.positions;
    expect(bx).toBeGreaterThan(ax);
    expect(cy).toBeLessThan(ay);
  });

  test('a bad lines file comes back as problems located to the file and line', async () => {
    const out = await kits.levelNet('s.csv', demo('ridge-line-stations.csv'), 'lines.csv', 'from,to,rise,length_km\nRL-01,RL-02,abc,0.8\n', { standard: 'second-II' });
    expect(out.ok).toBe(false);
    if (out.ok) return;
    expect(out.problems[0].where).toBe('lines.csv line 2');
  });

  test('the footbridge with a counter-diagonal: dims [0, 1], one state of self-stress', async () => {
    const out = await kits.frameCheck('joints.csv', demo('footbridge-joints.csv'), 'bars.csv', demo('footbridge-bars-extra-diagonal.csv'));
    expect(out.ok && out.result.report.dims).toEqual([0, 1]);
    expect(out.ok && out.result.joints).toHaveLength(9);
  });

  test('the culvert ring over GF(2): Betti numbers (1, 2, 1), closed and orientable, three representative cycles, a projection in the unit square', async () => {
    const phases: string[] = [];
    const out = await kits.meshTopology('culvert-ring.obj', demo('culvert-ring.obj'), (p) => phases.push(p.phase));
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    const r = out.result;
    expect(r.report.betti).toEqual([1, 2, 1]);
    expect(r.report.closed).toBe(true);
    expect(r.report.orientable).toBe(true);
    expect(r.report.cycles).toHaveLength(3);
    expect(r.cyclesSkipped).toBeNull();
    expect(r.edges.length / 2).toBe(r.report.edges);
    expect(r.drawStride).toBe(1);
    expect(Array.from(r.positions).every((p) => p >= 0 && p <= 1)).toBe(true);
    expect(phases[0]).toBe('read');
    expect(MESH_CYCLE_LIMIT).toBeGreaterThan(r.report.triangles);
  });

  test('the Klein bottle: (1, 2, 1) over GF(2), (1, 1, 0) over the rationals, non-orientable either way (Hatcher 2002, check-values.md)', async () => {
    const obj = toObj(36, kleinBottle(6));
    const gf2 = await kits.meshTopology('klein.obj', obj, undefined, { field: 'prime:2' });
    const q = await kits.meshTopology('klein.obj', obj, undefined, { field: 'rational' });
    expect(gf2.ok && gf2.result.report).toMatchObject({ betti: [1, 2, 1], field: 'prime:2', closed: true, orientable: false });
    expect(q.ok && q.result.report).toMatchObject({ betti: [1, 1, 0], field: 'rational', closed: true, orientable: false });
    // The default stays GF(2).
    const plain = await kits.meshTopology('klein.obj', obj);
    expect(plain.ok && plain.result.report.betti).toEqual([1, 2, 1]);
    const bad = await kits.meshTopology('klein.obj', obj, undefined, { field: 'prime:3' as never });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.problems[0]).toMatchObject({ where: 'coefficients', message: expect.stringContaining('prime:3') });
  });

  test('a file that is not a mesh is refused with a message', async () => {
    const out = await kits.meshTopology('notes.txt', 'hello', undefined);
    expect(out.ok).toBe(false);
  });
});

describe('large meshes', () => {
  test('above the cycle limit the Betti numbers are still complete and the skipped cycles are said', async () => {
    const small = createKitService({ meshCycleLimit: 10 });
    const out = await small.meshTopology('culvert-ring.obj', demo('culvert-ring.obj'));
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    expect(out.result.report.betti).toEqual([1, 2, 1]);
    expect(out.result.report.cycles).toEqual([]);
    expect(out.result.cyclesSkipped).toContain('above 10 triangles (this mesh has 64)');
  });
});
