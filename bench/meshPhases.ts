/**
 * `npx tsx bench/meshPhases.ts [N] [--cycles]`: the mesh kit's pipeline on
 * a torus of 2·N² triangles (default N = 708, about 10^6), timed phase by
 * phase in Node, so the costs the browser bench sums up can be told apart.
 * `--cycles` also times the dual reduction and the cycles on their own.
 */
import { computeCohomology } from '../shared/engine/computeCohomology';
import { HomologyCycles } from '../shared/engine/data/cycleRepresentatives';
import { readObj } from '../shared/import';
import { analyseMeshData, analyseMeshDataPacked, surfaceChecks } from '../shared/kits/mesh';
import { meshSheaf } from '../shared/kits/mesh/meshSheaf';
import { createKitService } from '../src/compute/kitService';
import { torusObj } from './torusObj';

const N = Number(process.argv[2] ?? 708);
const text = torusObj(N);
console.log(`torus ${N}×${N}: ${2 * N * N} triangles, ${(text.length / 1e6).toFixed(1)} MB of OBJ`);
const time = <T>(label: string, f: () => T): T => {
  const t0 = performance.now();
  const out = f();
  console.log(`${label.padEnd(40)} ${(performance.now() - t0).toFixed(0).padStart(7)} ms`);
  return out;
};
const field = { kind: 'prime', p: 2 } as const;
const read = time('OBJ text → typed mesh', () => readObj(text));
if (!('mesh' in read)) throw new Error('the bench mesh did not read');
const sheaf = time('typed mesh → sheaf (closure)', () => meshSheaf(read.mesh, field));
time('surface checks', () => surfaceChecks(sheaf.complex));
const run = time('cohomology', () => computeCohomology(sheaf));
console.log(`  dims ${run.report.dims.join(', ')}`);
if (process.argv.includes('--cycles')) {
  const h = time('cycles: dual reduction', () => new HomologyCycles(sheaf));
  time('cycles: degree 1', () => h.cycles(1));
  time('cycles: degree 2', () => h.cycles(2));
}
const r = time('analyseMeshData, no cycles', () => analyseMeshData(read.mesh, { field, cycles: false }));
console.log(`  betti ${r.betti.join(', ')}; ms ${JSON.stringify(r.ms)}`);
const rc = time('analyseMeshDataPacked, with cycles', () => analyseMeshDataPacked(read.mesh, { field }));
console.log(`  betti ${rc.betti.join(', ')}; cycles of ${rc.cycles.map((c) => c.cellCount).join(', ')} cells; ms ${JSON.stringify(rc.ms)}`);
const service = createKitService();
const t0 = performance.now();
service.meshTopology('torus.obj', text).then((out) => {
  console.log(`${'kit service with cycles (text → picture)'.padEnd(40)} ${(performance.now() - t0).toFixed(0).padStart(7)} ms  ${out.ok ? out.result.report.betti.join(', ') : 'failed'}`);
});
