/**
 * `npx tsx bench/kits.ts [--quick]`: data on a sheaf and the trade kits at
 * the planned scales (product-brief.md: nets of 10^3–10^5 cells, meshes of
 * 10^6). Invented grid nets and a torus mesh, timed phase by phase.
 */
import { adjustObservations, laplacianSpectrum, readModelOrThrow } from '../shared/engine';
import { importAny } from '../shared/import';
import { adjustLevellingNet, analyseMesh, readLevellingCsv } from '../shared/kits';

const quick = process.argv.includes('--quick');
const time = <T>(label: string, f: () => T): T => {
  const t0 = performance.now();
  const out = f();
  console.log(`${label.padEnd(48)} ${(performance.now() - t0).toFixed(0).padStart(7)} ms`);
  return out;
};

/** An N × N grid net: stations at the nodes, lines along the grid. */
function gridNet(N: number): { simplices: number[][]; stationsCsv: string; linesCsv: string } {
  const id = (i: number, j: number) => i * N + j;
  const height = (v: number) => 100 + 20 * Math.sin(v / 97);
  const simplices: number[][] = [];
  const lines: string[] = ['from,to,rise,length_km'];
  for (let i = 0; i < N; i++) {
    for (let j = 0; j < N; j++) {
      for (const [a, b] of [[id(i, j), i + 1 < N ? id(i + 1, j) : -1], [id(i, j), j + 1 < N ? id(i, j + 1) : -1]]) {
        if (b < 0) continue;
        simplices.push([a, b]);
        lines.push(`S${a},S${b},${(height(b) - height(a) + 0.001 * Math.sin(a * 7 + b)).toFixed(5)},${(0.5 + ((a * 13 + b) % 7) / 10).toFixed(1)}`);
      }
    }
  }
  const stations = ['id,height', ...Array.from({ length: N * N }, (_, v) => `S${v},${v === 0 ? height(0).toFixed(4) : ''}`)];
  return { simplices, stationsCsv: stations.join('\n'), linesCsv: lines.join('\n') };
}

for (const N of quick ? [60] : [60, 180]) {
  const net = gridNet(N);
  const cells = N * N + net.simplices.length;
  const sheaf = readModelOrThrow({ format: 'gluefield.sheaf', version: 1, field: { kind: 'real' }, simplices: net.simplices });
  const E = sheaf.complex.simplices[1];
  const values = Float64Array.from({ length: E.size }, (_, e) => E.vertex(e, 1) - E.vertex(e, 0));
  time(`adjust observations, ${cells} cells`, () => adjustObservations(sheaf, { values, weights: new Float64Array(E.size).fill(1), fixed: [{ vertex: 0, value: [0] }] }));
  time(`L^0 smallest 4 eigenvalues, ${cells} cells`, () => laplacianSpectrum(sheaf, 0, 4));
  const read = time(`level-net CSV read, ${net.simplices.length} lines`, () => readLevellingCsv(net.stationsCsv, net.linesCsv));
  time(`level-net adjust + ${E.size - N * N + 1} loops`, () => adjustLevellingNet(read.net!));
}

for (const n of quick ? [200] : [200, 708]) {
  const lines: string[] = [];
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) lines.push(`v ${i} ${j} 0`);
  const v = (i: number, j: number) => (i % n) * n + (j % n) + 1;
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) lines.push(`f ${v(i, j)} ${v(i + 1, j)} ${v(i + 1, j + 1)}`, `f ${v(i, j)} ${v(i + 1, j + 1)} ${v(i, j + 1)}`);
  const imported = time(`OBJ import, ${2 * n * n} triangles`, () => importAny('torus.obj', lines.join('\n')));
  if (!('model' in imported)) throw new Error('the bench mesh did not import');
  const r = time(`mesh kit GF(2) with cycles, ${2 * n * n} triangles`, () => analyseMesh(imported.model));
  console.log(`  betti ${r.betti.join(', ')}; cohomology ${r.ms.cohomology} ms, cycles ${r.ms.cycles} ms`);
}
