import { useSyncState } from './teamClient';

/**
 * Whether the signed-in user only reads this project: a viewer on the team
 * server. The server would refuse their pushes (403), so the screens stop
 * the edit before it is made instead of letting it pile up unsent.
 * Undefined until the project's link is read: callers keep writes off
 * until then (`!== false`) and show the banner only for a known viewer.
 */
export function useReadOnly(projectId: string): boolean | undefined {
  const s = useSyncState(projectId);
  if (!s.data) return undefined;
  return s.data.link?.role === 'viewer';
}

/** Says plainly why the bench's import, edit, save and run controls are off. */
export function ReadOnlyBanner() {
  return (
    <p role="status" data-testid="read-only-banner" className="no-print border-b border-rule bg-odds-soft px-3 py-1.5 text-xs text-ink">
      <b>Read only.</b> You are a viewer in this team project: you can open, export and compare its models and runs, but not import, edit, save or run
      them (runs are saved to the project). Ask an owner to make you an editor.
    </p>
  );
}
