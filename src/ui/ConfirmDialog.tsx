import { useEffect, useRef } from 'react';
import { Button } from './Button';

/** A modal question with a destructive confirm, using the native dialog element (focus trap, Esc to close). */
export function ConfirmDialog(props: { open: boolean; title: string; body: string; confirm: string; onConfirm(): void; onClose(): void }) {
  const ref = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (props.open && !d.open) d.showModal();
    if (!props.open && d.open) d.close();
  }, [props.open]);
  return (
    <dialog ref={ref} onClose={props.onClose} className="m-auto rounded-lg border border-rule bg-sheet p-5 text-ink shadow-xl backdrop:bg-ink/30">
      <h2 className="mb-2 text-base font-semibold">{props.title}</h2>
      <p className="mb-4 max-w-sm text-sm text-ink-soft">{props.body}</p>
      <div className="flex justify-end gap-2">
        <Button onClick={props.onClose}>Keep</Button>
        <Button tone="danger" onClick={props.onConfirm} autoFocus>
          {props.confirm}
        </Button>
      </div>
    </dialog>
  );
}
