import { NavLink, Route, Routes } from 'react-router-dom';
import { FrameKit } from './FrameKit';
import { LevellingKit } from './LevellingKit';
import { MeshKit } from './MeshKit';

const KITS = [
  { path: 'levelling', name: 'Levelling net', blurb: 'adjusted heights, residuals, loop misclosures against a tolerance' },
  { path: 'frame', name: 'Frame check', blurb: 'mechanisms, states of self-stress, Maxwell–Calladine' },
  { path: 'mesh', name: 'Mesh topology', blurb: 'components, tunnels, voids, closed and orientable' },
] as const;

/** The trade kits: one screen each, reached from a strip of tabs. */
export function KitsScreen() {
  return (
    <div className="flex h-full flex-col">
      <nav aria-label="Kits" className="no-print flex gap-1 border-b border-rule bg-sheet px-4 pt-2">
        {KITS.map((k) => (
          <NavLink key={k.path} to={`/kits/${k.path}`} className={({ isActive }) => `rounded-t border border-b-0 px-3 py-1 text-sm ${isActive ? 'border-rule bg-paper font-medium' : 'border-transparent text-ink-soft hover:text-ink'}`}>
            {k.name}
          </NavLink>
        ))}
      </nav>
      <div className="min-h-0 flex-1 overflow-auto p-4">
        <Routes>
          <Route index element={<KitIndex />} />
          <Route path="levelling" element={<LevellingKit />} />
          <Route path="frame" element={<FrameKit />} />
          <Route path="mesh" element={<MeshKit />} />
        </Routes>
      </div>
    </div>
  );
}

function KitIndex() {
  return (
    <div className="max-w-2xl space-y-2">
      <h1 className="text-lg font-semibold">Kits</h1>
      <p className="text-sm text-ink-soft">Bring the trade's own files; each kit builds the sheaf, computes in the engine worker and answers in the trade's terms, with a printable report.</p>
      <ul className="space-y-1">
        {KITS.map((k) => (
          <li key={k.path}>
            <NavLink to={`/kits/${k.path}`} className="font-medium underline">
              {k.name}
            </NavLink>{' '}
            <span className="text-sm text-ink-soft">— {k.blurb}</span>
          </li>
        ))}
      </ul>
    </div>
  );
}
