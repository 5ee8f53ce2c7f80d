import { useRef, useState } from 'react';
import type { MeshField, MeshResult } from '../compute/kitService';
import type { Progress } from '../compute/computeService';
import { Button } from '../ui/Button';
import { ProgressBar } from '../ui/ProgressBar';
import { meshThroughWorker } from '../workers/engineClient';
import { DEMO } from './demoFiles';
import { download, stem, toCsv } from './download';
import { FilePick } from './FilePick';
import { Figure, KitReport } from './KitReport';
import { KitStatus } from './KitStatus';
import { meshCaution } from './meshCaution';
import { cycleDrawStride, MeshSketch } from './MeshSketch';
import { unpackMeshReport } from '../../shared/kits/mesh/packedCycles';
import { useKitRun } from './useKitRun';


/** Mesh topology: an OBJ or OFF mesh in; components, tunnels, voids, closed/orientable and representative cycles out. */
export function MeshKit() {
  const [file, setFile] = useState<{ name: string; data: string | Blob }>();
  const [progress, setProgress] = useState<Progress>();
  const [field, setField] = useState<MeshField>('prime:2');
  const { state, start } = useKitRun<MeshResult>();
  const cancelRef = useRef<() => void>(undefined);
  const compute = (name: string, data: string | Blob, f: MeshField = field) => {
    // A new file supersedes a computation still running: stop it rather than queue behind it.
    if (state.status === 'running') cancelRef.current?.();
    setFile({ name, data });
    setProgress(undefined);
    start(() => {
      const handle = meshThroughWorker(name, data, { field: f }, (p: Progress) => setProgress(p));
      cancelRef.current = handle.cancel;
      return handle.result;
    });
  };
  return (
    <div className="space-y-4">
      <div className="no-print flex flex-wrap items-end gap-3">
        <FilePick label="Mesh (OBJ or OFF)" accept=".obj,.off" testId="mesh-input" file={file ? { name: file.name, text: '' } : undefined} onFile={(f) => compute(f.name, f)} />
        <label className="flex flex-col gap-0.5 text-sm">
          <span className="text-xs text-ink-soft">Coefficients</span>
          <select
            aria-label="Coefficients"
            className="rounded border border-rule bg-sheet px-2 py-1"
            value={field}
            onChange={(e) => {
              const f = e.target.value as MeshField;
              setField(f);
              if (file) compute(file.name, file.data, f);
            }}
          >
            <option value="prime:2">GF(2): every closed piece encloses a void</option>
            <option value="rational">rationals: a void only where the piece is orientable</option>
          </select>
        </label>
        <Button onClick={() => compute(DEMO.mesh.name, DEMO.mesh.text)}>Load the invented culvert ring</Button>
      </div>
      {state.status === 'running' && (
        <div className="max-w-md space-y-1 text-sm text-ink-soft" data-testid="mesh-progress">
          <p>Computing in the engine worker{progress ? `: ${progress.phase}` : '…'} — large meshes take a while; the page stays usable.</p>
          <ProgressBar fraction={progress?.fraction ?? 0} label="mesh topology progress" />
          <Button onClick={() => cancelRef.current?.()} data-testid="mesh-cancel">
            Cancel
          </Button>
        </div>
      )}
      {state.status !== 'running' && <KitStatus state={state} what="The mesh" />}
      {state.status === 'done' && file && <MeshResultView key={file.name} result={state.result} file={file} />}
    </div>
  );
}

function ordinal(n: number): string {
  const teen = n % 100 >= 11 && n % 100 <= 13;
  return `${n}${teen ? 'th' : (['th', 'st', 'nd', 'rd'][n % 10] ?? 'th')}`;
}

function MeshResultView({ result, file }: { result: MeshResult; file: { name: string; data: string | Blob } }) {
  const r = result.report;
  const input = file.name;
  const [chosen, setChosen] = useState(0);
  const cycle = r.cycles[chosen];
  const name = stem(input);
  const yesNo = (v: boolean | null) => (v === null ? 'not decided' : v ? 'yes' : 'no');
  const exportCsv = () => {
    const rows: (string | number)[][] = [
      ['vertices', r.vertices],
      ['edges', r.edges],
      ['triangles', r.triangles],
      ...r.betti.map((b, k) => [`b${k}`, b] as (string | number)[]),
      ['euler', r.euler],
      ['closed', String(r.closed)],
      ['orientable', String(r.orientable)],
      ['boundary_edges', r.boundaryEdges],
      ['non_manifold_edges', r.nonManifoldEdges],
      ['non_manifold_vertices', r.nonManifoldVertices],
    ];
    download(`${name}-mesh.csv`, toCsv(['quantity', 'value'], rows), 'text/csv');
  };
  return (
    <KitReport
      title="Mesh topology: components, tunnels and voids"
      inputs={[input]}
      settings={[
        ['coefficients', r.field],
        ['time', `${r.ms.total} ms (cohomology ${r.ms.cohomology} ms, cycles ${r.ms.cycles} ms)`],
      ]}
      kitCaution={meshCaution(r.field)}
      onJson={() => download(`${name}-mesh.json`, JSON.stringify(unpackMeshReport(r)), 'application/json')}
      onCsv={exportCsv}
      save={{
        kit: 'mesh',
        name: `Mesh topology: ${input}`,
        summary: `${r.triangles.toLocaleString('en')} triangles · Betti (${r.betti.join(', ')}) over ${r.field} · closed ${yesNo(r.closed)} · orientable ${yesNo(r.orientable)}`,
        settings: { field: r.field },
        inputs: [{ name: input, data: file.data }],
        report: r,
      }}
    >
      <div className="flex flex-wrap gap-2">
        <Figure label="Betti numbers b₀, b₁, b₂" value={`(${r.betti.join(', ')})`} testId="mesh-betti" />
        <Figure label="components" value={String(r.betti[0])} />
        <Figure label="tunnels" value={String(r.betti[1])} />
        <Figure label="enclosed voids" value={String(r.betti[2])} />
        <Figure label="closed" value={yesNo(r.closed)} testId="mesh-closed" />
        <Figure label="orientable" value={yesNo(r.orientable)} testId="mesh-orientable" />
        <Figure label="Euler characteristic" value={String(r.euler)} />
      </div>
      <p className="num text-xs text-ink-soft">
        {r.vertices.toLocaleString('en')} vertices · {r.edges.toLocaleString('en')} edges · {r.triangles.toLocaleString('en')} triangles · boundary edges {r.boundaryEdges} · non-manifold edges {r.nonManifoldEdges} · winding consistent {yesNo(r.windingConsistent)}
      </p>
      {result.cyclesSkipped && (
        <p role="status" className="rounded border border-rule bg-rule-soft p-2 text-sm" data-testid="mesh-cycles-skipped">
          {result.cyclesSkipped}.
        </p>
      )}
      <figure className="rounded border border-rule bg-sheet p-2">
        {r.cycles.length > 0 && (
          <div className="no-print mb-1 flex items-center gap-2 text-sm">
            <label htmlFor="mesh-cycle" className="text-xs text-ink-soft">
              Highlight
            </label>
            <select id="mesh-cycle" className="rounded border border-rule bg-sheet px-2 py-0.5" value={chosen} onChange={(e) => setChosen(Number(e.target.value))}>
              {r.cycles.map((c, i) => (
                <option key={i} value={i}>
                  {c.degree === 1 ? 'tunnel loop' : 'void surface'} {i + 1} ({c.cellCount.toLocaleString('en')} {c.degree === 1 ? 'edges' : 'triangles'})
                </option>
              ))}
            </select>
          </div>
        )}
        <MeshSketch result={result} cycle={cycle} />
        <figcaption className="text-xs text-ink-soft">
          Oblique projection
          {result.edges.length / 2 < r.edges && (
            <span data-testid="mesh-draw-note">
              {' '}
              — a sample: {(result.edges.length / 2).toLocaleString('en')} of {r.edges.toLocaleString('en')} edges drawn ({result.drawStride > 1 ? `the edges of every ${ordinal(result.drawStride)} cell of the file` : 'the first ones met'}), so the picture stays quick; every figure above counts the whole mesh
            </span>
          )}
          {cycle ? <> · <span className="text-odds">the highlighted cycle</span> represents one class of H{cycle.degree === 1 ? '₁' : '₂'}</> : ''}
          {cycle && cycleDrawStride(cycle) > 1 ? <span data-testid="mesh-cycle-note"> (drawn by every {ordinal(cycleDrawStride(cycle))} of its {cycle.cellCount.toLocaleString('en')} cells)</span> : ''}
        </figcaption>
      </figure>
    </KitReport>
  );
}
