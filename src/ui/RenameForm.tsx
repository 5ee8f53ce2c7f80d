import { useState } from 'react';
import { Button } from './Button';

/**
 * An inline name editor for a row of a shelf. `save` stores the name (and
 * records it for sync); its error is shown under the field and the form
 * stays open, so a refused name is never lost. Escape cancels.
 */
export function RenameForm({ initial, label, save, onDone }: { initial: string; label: string; save(name: string): Promise<void>; onDone(): void }) {
  const [name, setName] = useState(initial);
  const [error, setError] = useState<string>();
  return (
    <form
      className="flex flex-col gap-1"
      onSubmit={(e) => {
        e.preventDefault();
        void (async () => {
          try {
            await save(name);
            onDone();
          } catch (err) {
            setError((err as Error).message);
          }
        })();
      }}
    >
      <input aria-label={label} autoFocus value={name} onChange={(e) => setName(e.target.value)} onKeyDown={(e) => e.key === 'Escape' && onDone()} className="rounded border border-rule bg-paper px-2 py-0.5 text-sm" />
      <span className="flex gap-1">
        <Button type="submit" className="text-xs">
          Save name
        </Button>
        <Button tone="quiet" type="button" className="text-xs" onClick={onDone}>
          Cancel
        </Button>
      </span>
      {error && <span role="alert" className="text-xs text-odds">{error}</span>}
    </form>
  );
}
