import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useMemo, useRef, useState } from 'react';
import type { ModelFile, Problem } from '../../shared/engine';
import { appDb } from '../app/db';
import { useHotkeys } from '../app/useHotkeys';
import { loadModelText, type ModelRow } from '../store';
import { Button } from '../ui/Button';
import { Kbd } from '../ui/Kbd';
import { ProblemList } from '../ui/ProblemList';
import { engine } from '../workers/engineClient';
import { draftOf, modelOf, type Draft } from './draft';
import { useUndoable } from './useUndoable';

/** Models larger than this are edited as files (export, edit, import), not in forms. */
const FORM_LIMIT = 2_000_000;

/**
 * "Stalks & maps": stalk dimensions and restriction maps in forms, entries
 * as numbers, fractions or expressions, checked (shapes, the sheaf
 * condition on every diamond) as you type. Saving makes a new version; the
 * previous ones stay, and every edit can be undone.
 */
export function MapsEditor({ model, readOnly = false }: { model: ModelRow; readOnly?: boolean }) {
  const qc = useQueryClient();
  const [base, setBase] = useState<ModelFile>();
  const [tooLarge, setTooLarge] = useState(false);
  const draft = useUndoable<Draft | undefined>(undefined);
  const [problems, setProblems] = useState<Problem[]>([]);
  const [saved, setSaved] = useState<string>();
  // The draft that matches the newest stored version: Save is offered only when the draft differs from it.
  const [clean, setClean] = useState<Draft>();
  // The version this editor has just saved ("id@version"): reopening it must keep the undo history.
  const ownSave = useRef<string>(undefined);

  useEffect(() => {
    let live = true;
    void loadModelText(appDb(), model.id).then((text) => {
      if (!live) return;
      if (text.length > FORM_LIMIT) return setTooLarge(true);
      const m = JSON.parse(text) as ModelFile;
      setBase(m);
      if (ownSave.current === `${model.id}@${model.version}`) return;
      const fresh = draftOf(m);
      setClean(fresh);
      draft.reset(fresh);
    });
    return () => {
      live = false;
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [model.id, model.version]);

  const built = useMemo(() => (base && draft.value ? modelOf(base, draft.value) : undefined), [base, draft.value]);
  useEffect(() => {
    if (!built) return;
    if (!built.model) return setProblems(built.problems);
    const t = setTimeout(() => {
      void engine()
        .validateText(JSON.stringify(built.model))
        .then((r) => setProblems(r.problems));
    }, 250);
    return () => clearTimeout(t);
  }, [built]);

  useHotkeys(useMemo(() => ({ 'mod+z': draft.undo, 'mod+shift+z': draft.redo, 'mod+y': draft.redo }), [draft.undo, draft.redo]), !readOnly);

  if (tooLarge) return <p className="p-4 text-sm text-ink-soft">This model is too large to edit in forms. Export it, edit the file, and import it again as a new model.</p>;
  if (!draft.value || !base) return <p className="p-4 text-sm text-ink-soft">Opening the model…</p>;
  const d = draft.value;
  const update = (patch: Partial<Draft>) => {
    setSaved(undefined);
    draft.set({ ...d, ...patch });
  };
  const save = async () => {
    if (!built?.model || problems.length || readOnly) return;
    const outcome = await engine().replaceModel(model.id, `${model.name}.sheaf.json`, JSON.stringify(built.model, null, 1), 'editor');
    if (!outcome.ok) return setProblems(outcome.problems);
    ownSave.current = `${model.id}@${outcome.model.version}`;
    setClean(d);
    setSaved(`Saved as version ${outcome.model.version}.`);
    await qc.invalidateQueries({ queryKey: ['model', model.id] });
    await qc.invalidateQueries({ queryKey: ['models', model.projectId] });
  };

  return (
    // A disabled fieldset switches off every input and button inside it at once.
    <fieldset disabled={readOnly} aria-label="Stalks and maps" className="h-full min-w-0 space-y-4 overflow-auto p-4 text-sm">
      <div className="flex flex-wrap items-center gap-2">
        <Button onClick={draft.undo} disabled={!draft.canUndo}>
          Undo <Kbd>mod+z</Kbd>
        </Button>
        <Button onClick={draft.redo} disabled={!draft.canRedo}>
          Redo
        </Button>
        <Button tone="primary" onClick={() => void save()} disabled={!built?.model || problems.length > 0 || d === clean} data-testid="editor-save">
          Save as new version
        </Button>
        {saved && <span className="text-xs text-glued">{saved}</span>}
        {problems.length === 0 && built?.model && <span className="text-xs text-glued">Valid: shapes and the sheaf condition hold.</span>}
      </div>
      <ProblemList title="Not valid yet" problems={problems} />
      <fieldset className="grid max-w-xl grid-cols-[10rem_1fr] items-center gap-2 rounded border border-rule p-3">
        <legend className="px-1 text-xs text-ink-soft">Coefficients and defaults</legend>
        <label htmlFor="ed-field">Field</label>
        <select id="ed-field" value={d.fieldKind} onChange={(e) => update({ fieldKind: e.target.value as Draft['fieldKind'] })} className="rounded border border-rule bg-sheet px-1">
          <option value="rational">rational (exact)</option>
          <option value="prime">prime field GF(P)</option>
          <option value="real">real (floating point)</option>
        </select>
        {d.fieldKind === 'prime' && (
          <>
            <label htmlFor="ed-p">P</label>
            <input id="ed-p" className="num rounded border border-rule bg-sheet px-1" value={d.p} onChange={(e) => update({ p: e.target.value })} />
          </>
        )}
        {d.fieldKind === 'real' && (
          <>
            <label htmlFor="ed-tol">Tolerance</label>
            <input id="ed-tol" className="num rounded border border-rule bg-sheet px-1" value={d.tolerance} onChange={(e) => update({ tolerance: e.target.value })} />
          </>
        )}
        <label htmlFor="ed-stalk">Stalk dimension (default)</label>
        <input id="ed-stalk" className="num w-20 rounded border border-rule bg-sheet px-1" value={d.stalkDefault} onChange={(e) => update({ stalkDefault: e.target.value })} />
        <label htmlFor="ed-map">Restriction map (default)</label>
        <select id="ed-map" value={d.mapDefault} onChange={(e) => update({ mapDefault: e.target.value as Draft['mapDefault'] })} className="rounded border border-rule bg-sheet px-1">
          <option value="identity">identity</option>
          <option value="zero">zero</option>
        </select>
      </fieldset>
      <fieldset className="rounded border border-rule p-3">
        <legend className="px-1 text-xs text-ink-soft">Stalks that differ from the default</legend>
        <table className="num text-xs">
          <thead className="text-ink-faint">
            <tr>
              <th className="pr-2 text-left font-normal">cell (vertex ids)</th>
              <th className="text-left font-normal">dimension</th>
            </tr>
          </thead>
          <tbody>
            {d.stalkCells.map((c, i) => (
              <tr key={i}>
                <td className="pr-2">
                  <input aria-label={`stalk row ${i + 1} cell`} className="w-40 rounded border border-rule bg-sheet px-1" value={c.cell} onChange={(e) => update({ stalkCells: d.stalkCells.map((x, j) => (j === i ? { ...x, cell: e.target.value } : x)) })} />
                </td>
                <td>
                  <input aria-label={`stalk row ${i + 1} dimension`} className="w-16 rounded border border-rule bg-sheet px-1" value={c.dim} onChange={(e) => update({ stalkCells: d.stalkCells.map((x, j) => (j === i ? { ...x, dim: e.target.value } : x)) })} />
                </td>
                <td>
                  <Button tone="quiet" onClick={() => update({ stalkCells: d.stalkCells.filter((_, j) => j !== i) })} aria-label={`remove stalk row ${i + 1}`}>
                    ×
                  </Button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        <Button className="mt-2" onClick={() => update({ stalkCells: [...d.stalkCells, { cell: '', dim: '1' }] })}>
          Add stalk
        </Button>
      </fieldset>
      <fieldset className="rounded border border-rule p-3">
        <legend className="px-1 text-xs text-ink-soft">Restriction maps F(face ◁ coface) that differ from the default</legend>
        <p className="mb-2 text-[11px] text-ink-faint">Matrix rows are separated by “;”, entries by “,”. Rows = coface stalk, columns = face stalk. Entries may be 3, -1/2, 0.125 or expressions such as cos(pi/6) (real field).</p>
        <table className="num text-xs">
          <thead className="text-ink-faint">
            <tr>
              <th className="pr-2 text-left font-normal">face</th>
              <th className="pr-2 text-left font-normal">coface</th>
              <th className="pr-2 text-left font-normal">kind</th>
              <th className="text-left font-normal">entries</th>
            </tr>
          </thead>
          <tbody>
            {d.entries.map((m, i) => {
              const set = (patch: Partial<Draft['entries'][number]>) => update({ entries: d.entries.map((x, j) => (j === i ? { ...x, ...patch } : x)) });
              return (
                <tr key={i}>
                  <td className="pr-2">
                    <input aria-label={`map row ${i + 1} face`} className="w-24 rounded border border-rule bg-sheet px-1" value={m.face} onChange={(e) => set({ face: e.target.value })} />
                  </td>
                  <td className="pr-2">
                    <input aria-label={`map row ${i + 1} coface`} className="w-28 rounded border border-rule bg-sheet px-1" value={m.coface} onChange={(e) => set({ coface: e.target.value })} />
                  </td>
                  <td className="pr-2">
                    <select aria-label={`map row ${i + 1} kind`} value={m.kind} onChange={(e) => set({ kind: e.target.value as 'matrix' | 'scalar' })} className="rounded border border-rule bg-sheet">
                      <option value="matrix">matrix</option>
                      <option value="scalar">scalar × I</option>
                    </select>
                  </td>
                  <td>
                    <input aria-label={`map row ${i + 1} entries`} className="w-64 rounded border border-rule bg-sheet px-1" value={m.text} onChange={(e) => set({ text: e.target.value })} />
                  </td>
                  <td>
                    <Button tone="quiet" onClick={() => update({ entries: d.entries.filter((_, j) => j !== i) })} aria-label={`remove map row ${i + 1}`}>
                      ×
                    </Button>
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
        <Button className="mt-2" onClick={() => update({ entries: [...d.entries, { face: '', coface: '', kind: 'scalar', text: '1' }] })}>
          Add map
        </Button>
      </fieldset>
    </fieldset>
  );
}
