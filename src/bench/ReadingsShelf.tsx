import { useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { appDb } from '../app/db';
import { deleteReadings, loadReadingsText, updateReadings, type ReadingsRow } from '../store';
import { recordReadingsDeleted, recordReadingsSaved } from '../sync/recordChange';
import { download, stem } from '../kits/download';
import { Button } from '../ui/Button';
import { ConfirmDialog } from '../ui/ConfirmDialog';
import { RenameForm } from '../ui/RenameForm';

/** The model's saved readings sets: pick one to check; rename, download, delete (after a question). */
export function ReadingsShelf({ rows, selected, onSelect, readOnly, modelId }: { rows: ReadingsRow[]; selected?: string; onSelect(r: ReadingsRow): void; readOnly: boolean; modelId: string }) {
  const qc = useQueryClient();
  const [renaming, setRenaming] = useState<string>();
  const [doomed, setDoomed] = useState<ReadingsRow>();
  const refresh = () => {
    void qc.invalidateQueries({ queryKey: ['readings', modelId] });
    void qc.invalidateQueries({ queryKey: ['sync'] });
  };
  return (
    <>
      <ul className="space-y-1" data-testid="readings-list" aria-label="Saved readings">
        {rows.map((r) => (
          <li key={r.id} className={`group rounded px-2 py-1.5 ${r.id === selected ? 'bg-glued-soft' : 'hover:bg-rule-soft'}`}>
            {renaming === r.id ? (
              <RenameForm
                initial={r.name}
                label="Readings name"
                save={async (name) => {
                  await recordReadingsSaved(appDb(), await updateReadings(appDb(), r.id, { name }));
                }}
                onDone={() => {
                  setRenaming(undefined);
                  refresh();
                }}
              />
            ) : (
              <button className="block w-full text-left" aria-pressed={r.id === selected} onClick={() => onSelect(r)}>
                <span className="block truncate text-sm font-medium">{r.name}</span>
                <span className="num block text-[11px] text-ink-faint">
                  {r.count.toLocaleString('en')} reading{r.count === 1 ? '' : 's'} · {new Date(r.updatedAt).toLocaleString()}
                </span>
              </button>
            )}
            <div className="mt-1 hidden gap-1 group-focus-within:flex group-hover:flex">
              <Button tone="quiet" className="text-xs" onClick={() => void loadReadingsText(appDb(), r.id).then((text) => download(`${stem(r.name)}.readings.json`, text, 'application/json'))}>
                Download
              </Button>
              {!readOnly && (
                <>
                  <Button tone="quiet" className="text-xs" onClick={() => setRenaming(r.id)} aria-label={`Rename readings ${r.name}`}>
                    Rename
                  </Button>
                  <Button tone="quiet" className="text-xs" onClick={() => setDoomed(r)} aria-label={`Delete readings ${r.name}`}>
                    Delete
                  </Button>
                </>
              )}
            </div>
          </li>
        ))}
      </ul>
      <ConfirmDialog
        open={!!doomed}
        title={`Delete the readings “${doomed?.name}”?`}
        body="The readings file is removed from this machine (and from the team project at the next sync, if the project is linked). The model and its runs stay."
        confirm="Delete readings"
        onClose={() => setDoomed(undefined)}
        onConfirm={() => {
          const r = doomed;
          setDoomed(undefined);
          if (r)
            void (async () => {
              await deleteReadings(appDb(), r.id);
              await recordReadingsDeleted(appDb(), r);
              refresh();
            })();
        }}
      />
    </>
  );
}
