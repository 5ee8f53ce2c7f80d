import { computeCohomology } from '../../engine/computeCohomology';
import { HomologyCycles } from '../../engine/data/cycleRepresentatives';
import type { FieldSpec } from '../../engine/fields/FieldSpec';
import type { ModelFile } from '../../engine/model/ModelFile';
import { readModelOrThrow } from '../../engine/model/readModel';
import type { Sheaf } from '../../engine/model/Sheaf';
import type { MeshData } from '../../import/MeshData';
import { meshSheaf } from './meshSheaf';
import { unpackMeshReport, type PackedCycle, type PackedMeshReport } from './packedCycles';
import { denseIndexer } from '../../engine/model/readSimplices';
import type { Control } from '../../engine/reduce/Cancelled';
import { surfaceChecks, windingConsistent } from './surfaceChecks';

/** A representative cycle of one homology class, as the cells it runs over. */
export interface ClassCycle {
  degree: number;
  /** The k-simplices with a nonzero coefficient, by original vertex ids (increasing in each). */
  cells: number[][];
  /** Coefficients, one per cell, relative to increasing vertex order; absent over GF(2), where every one is 1. */
  coefficients?: (number | string)[];
}

export interface MeshReport {
  field: string;
  vertices: number;
  edges: number;
  triangles: number;
  /** Connected components (b0). */
  components: number;
  /** Betti numbers b0, b1, b2 over the field: components, independent tunnels (loops), enclosed voids. */
  betti: number[];
  euler: number;
  closed: boolean;
  orientable: boolean | null;
  /** The file's own corner order already orients the surface consistently. */
  windingConsistent: boolean | null;
  boundaryEdges: number;
  nonManifoldEdges: number;
  nonManifoldVertices: number;
  looseEdges: number;
  looseVertices: number;
  /** One representative cycle per class of H_1 and H_2 (edge loops, closed triangle sets). */
  cycles: ClassCycle[];
  ms: { cohomology: number; cycles: number; total: number };
}

export interface MeshOptions {
  /** GF(2) (the default) or the rationals; any field the model format allows. */
  field?: FieldSpec;
  /** Compute representative cycles (default true). */
  cycles?: boolean;
  control?: Control;
}

/**
 * Topology of a mesh as the constant sheaf on its triangles: Betti numbers
 * by Morse reduction (dim H^k over a field equals the homology Betti number,
 * Hatcher 2002 §3.1), a representative cycle of every class of H_1 and H_2,
 * and the combinatorial surface checks (closed, orientable, consistently
 * wound). Over GF(2) a closed surface always has b2 = 1 per piece; over
 * the rationals b2 counts the orientable closed pieces.
 */
export function analyseMesh(model: ModelFile, options: MeshOptions = {}): MeshReport {
  const t0 = performance.now();
  const field = options.field ?? { kind: 'prime', p: 2 };
  const sheaf = readModelOrThrow(model, { field });
  const dense = denseIndexer(sheaf.complex.vertexIds);
  let n = 0;
  for (const s of model.simplices) if (s.length === 3) n++;
  const listed = new Int32Array(3 * n);
  let w = 0;
  for (const s of model.simplices) if (s.length === 3) for (let i = 0; i < 3; i++) listed[w++] = dense(s[i]);
  return unpackMeshReport(analyseSheaf(sheaf, listed, field, options, t0));
}

/**
 * {@link analyseMesh} on a mesh read into typed arrays (`readObj`,
 * `readOff`): the same report, without building a model file first.
 */
export function analyseMeshData(mesh: MeshData, options: MeshOptions = {}): MeshReport {
  return unpackMeshReport(analyseMeshDataPacked(mesh, options));
}

/** {@link analyseMeshData} with the cycles packed into typed arrays, to send across threads. */
export function analyseMeshDataPacked(mesh: MeshData, options: MeshOptions = {}): PackedMeshReport {
  const t0 = performance.now();
  const field = options.field ?? { kind: 'prime', p: 2 };
  // Every vertex is a cell (unused ones as points), so dense indices are the file's own.
  return analyseSheaf(meshSheaf(mesh, field), mesh.triangles, field, options, t0);
}

/** `listed`: the file's triangles as dense vertex indices in its corner order, for the winding check. */
function analyseSheaf(sheaf: Sheaf<unknown>, listed: Int32Array, field: FieldSpec, options: MeshOptions, t0: number): PackedMeshReport {
  const cx = sheaf.complex;
  const withCycles = options.cycles !== false;
  // With cycles, one reduction (of the dual) gives both the Betti numbers and the
  // representatives; reducing the complex itself as well would double the work.
  const homology = withCycles ? new HomologyCycles(sheaf, options.control) : undefined;
  const dims = homology ? homology.dims(options.control) : computeCohomology(sheaf, { control: options.control }).report.dims;
  const t1 = performance.now();
  const betti = [0, 1, 2].map((k) => dims[k] ?? 0);
  for (let k = 3; k < dims.length; k++) betti.push(dims[k]);
  const checks = surfaceChecks(cx);
  let winding: boolean | null = null;
  if (cx.dimension === 2 && checks.nonManifoldEdges === 0) winding = windingConsistent(cx, listed);
  const cycles: PackedCycle[] = [];
  if (homology) {
    const F = sheaf.field;
    const gf2 = field.kind === 'prime' && field.p === 2;
    for (let k = 1; k <= cx.dimension; k++) {
      if (!dims[k]) continue;
      const reps = homology.cycles(k);
      if (reps.length !== dims[k]) throw new Error(`internal check failed: ${reps.length} cycles in degree ${k}, but dim H_${k} = ${dims[k]}`);
      const table = cx.simplices[k];
      const ids = cx.vertexIds;
      for (const z of reps) {
        let cellCount = 0;
        for (let c = 0; c < z.length; c++) if (!F.isZero(z[c])) cellCount++;
        const vertices = new Int32Array(cellCount * (k + 1));
        const coefficients: (number | string)[] = [];
        let w = 0;
        for (let c = 0; c < z.length; c++) {
          if (F.isZero(z[c])) continue;
          for (let i = 0; i <= k; i++) vertices[w++] = ids[table.vertex(c, i)];
          if (!gf2) coefficients.push(F.toJSON(z[c]));
        }
        cycles.push(gf2 ? { degree: k, cellCount, vertices } : { degree: k, cellCount, vertices, coefficients });
      }
    }
  }
  const t2 = performance.now();
  const round = (ms: number) => Math.round(ms * 10) / 10;
  let euler = 0;
  for (let k = 0; k <= cx.dimension; k++) euler += (k % 2 === 0 ? 1 : -1) * cx.simplices[k].size;
  return {
    field: sheaf.field.label,
    vertices: cx.simplices[0]?.size ?? 0,
    edges: cx.simplices[1]?.size ?? 0,
    triangles: cx.simplices[2]?.size ?? 0,
    components: betti[0],
    betti,
    euler,
    closed: checks.closed,
    orientable: checks.orientable,
    windingConsistent: winding,
    boundaryEdges: checks.boundaryEdges,
    nonManifoldEdges: checks.nonManifoldEdges,
    nonManifoldVertices: checks.nonManifoldVertices,
    looseEdges: checks.looseEdges,
    looseVertices: checks.looseVertices,
    cycles,
    ms: { cohomology: round(t1 - t0), cycles: round(t2 - t1), total: round(t2 - t0) },
  };
}
