import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { Link, Route, Routes } from 'react-router-dom';
import { readModel } from '../../shared/engine';
import { KitsScreen } from '../kits/KitsScreen';
import { BenchScreen } from '../screens/BenchScreen';
import { Desk } from '../screens/Desk';
import { Mailroom } from '../screens/Mailroom';
import { seedDemoIfEmpty } from '../store';
import { AccountPanel } from '../team/AccountPanel';
import { ConflictsScreen } from '../team/ConflictsScreen';
import { CrewScreen, LogbookScreen } from '../team/CrewScreen';
import { InvitationPage, ResetPasswordPage } from '../team/LinkPages';
import { SyncRunner } from '../team/teamClient';
import { Kbd } from '../ui/Kbd';
import { appDb } from './db';
import { UpdatePrompt } from './UpdatePrompt';
import { useHotkeys } from './useHotkeys';

export function App() {
  const [help, setHelp] = useState(false);
  const queryClient = useQueryClient();
  useHotkeys({ '?': () => setHelp((h) => !h), escape: () => setHelp(false) });
  useEffect(() => {
    // First visit: an invented demo project so the desk is never empty on day one.
    void seedDemoIfEmpty(appDb(), summariseText).then(() => queryClient.invalidateQueries({ queryKey: ['projects'] }));
  }, [queryClient]);
  return (
    <div className="flex h-full flex-col">
      <header className="no-print flex items-center gap-4 border-b border-rule bg-sheet px-4 py-2">
        <Link to="/" className="flex items-center gap-2 font-semibold tracking-tight">
          <img src="/favicon.svg" alt="" className="h-5 w-5" />
          Gluefield
        </Link>
        <nav className="flex gap-3 text-sm text-ink-soft">
          <Link to="/" className="hover:text-ink">
            Desk
          </Link>
          <Link to="/kits" className="hover:text-ink">
            Kits
          </Link>
          <Link to="/mailroom" className="hover:text-ink">
            Mailroom
          </Link>
        </nav>
        <OnlineBadge />
        <span className="ml-auto">
          <AccountPanel />
        </span>
        <button className="text-xs text-ink-faint hover:text-ink" onClick={() => setHelp(true)}>
          Shortcuts <Kbd>?</Kbd>
        </button>
      </header>
      <main className="min-h-0 flex-1">
        <Routes>
          <Route path="/" element={<Desk />} />
          <Route path="/p/:projectId" element={<BenchScreen />} />
          <Route path="/p/:projectId/m/:modelId" element={<BenchScreen />} />
          <Route path="/p/:projectId/k/:kitResultId" element={<BenchScreen />} />
          <Route path="/kits/*" element={<KitsScreen />} />
          <Route path="/p/:projectId/conflicts" element={<ConflictsScreen />} />
          <Route path="/p/:projectId/crew" element={<CrewScreen />} />
          <Route path="/p/:projectId/logbook" element={<LogbookScreen />} />
          <Route path="/reset-password/:token" element={<ResetPasswordPage />} />
          <Route path="/invitations/:token" element={<InvitationPage />} />
          <Route path="/mailroom" element={<Mailroom />} />
          <Route path="*" element={<p className="p-6">Nothing here. <Link className="underline" to="/">Back to the desk</Link>.</p>} />
        </Routes>
      </main>
      {help && <ShortcutHelp onClose={() => setHelp(false)} />}
      <UpdatePrompt />
      <SyncRunner />
    </div>
  );
}

function summariseText(text: string) {
  const read = readModel(JSON.parse(text));
  if (!read.sheaf) throw new Error(read.problems[0]?.message ?? 'invalid demo model');
  const d = read.sheaf.stalkDims;
  return { field: read.sheaf.field.label, cells: d.map((a) => a.length), cochainDims: d.map((a) => a.reduce((x, y) => x + y, 0)) };
}

function OnlineBadge() {
  const [online, setOnline] = useState(typeof navigator === 'undefined' ? true : navigator.onLine);
  useEffect(() => {
    const up = () => setOnline(true);
    const down = () => setOnline(false);
    window.addEventListener('online', up);
    window.addEventListener('offline', down);
    return () => {
      window.removeEventListener('online', up);
      window.removeEventListener('offline', down);
    };
  }, []);
  return (
    <span data-testid="network-state" className={`rounded-full px-2 py-0.5 text-[11px] ${online ? 'bg-glued-soft text-glued' : 'bg-rule-soft text-ink-soft'}`}>
      {online ? 'online' : 'offline — everything still works here'}
    </span>
  );
}

function ShortcutHelp({ onClose }: { onClose(): void }) {
  const rows: [string, string][] = [
    ['?', 'show or hide this list'],
    ['n', 'new project (on the desk)'],
    ['i', 'import a file into the bench'],
    ['1 / 2 / 3', 'sketch, cell ledger, stalks & maps'],
    ['mod+enter', 'reduce & solve'],
    ['escape', 'cancel the running computation'],
    ['mod+z / mod+shift+z', 'undo / redo an edit'],
  ];
  return (
    <div role="dialog" aria-label="Keyboard shortcuts" className="fixed inset-0 z-40 flex items-center justify-center bg-ink/30" onClick={onClose}>
      <div className="rounded-lg border border-rule bg-sheet p-5 shadow-xl" onClick={(e) => e.stopPropagation()}>
        <h2 className="mb-3 font-semibold">Keyboard shortcuts</h2>
        <table className="text-sm">
          <tbody>
            {rows.map(([k, what]) => (
              <tr key={k}>
                <td className="num pr-6 py-0.5">{k}</td>
                <td className="text-ink-soft">{what}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
