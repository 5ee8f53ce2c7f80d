import { useRegisterSW } from 'virtual:pwa-register/react';
import { Button } from '../ui/Button';

/** Offers the new version when one is deployed; never reloads under a running computation by itself. */
export function UpdatePrompt() {
  const {
    needRefresh: [needRefresh, setNeedRefresh],
    offlineReady: [offlineReady, setOfflineReady],
    updateServiceWorker,
  } = useRegisterSW();
  if (!needRefresh && !offlineReady) return null;
  return (
    <div role="status" className="no-print fixed right-4 bottom-4 z-50 flex items-center gap-3 rounded border border-rule bg-sheet px-4 py-2 shadow-lg">
      {needRefresh ? (
        <>
          <span>A new version of Gluefield is ready.</span>
          <Button tone="primary" onClick={() => updateServiceWorker(true)}>
            Reload now
          </Button>
          <Button tone="quiet" onClick={() => setNeedRefresh(false)}>
            Later
          </Button>
        </>
      ) : (
        <>
          <span data-testid="offline-ready">Ready to work offline.</span>
          <Button tone="quiet" onClick={() => setOfflineReady(false)}>
            OK
          </Button>
        </>
      )}
    </div>
  );
}
