import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { appDb } from '../app/db';
import { serverBase, setServerBase, signIn, signOut } from '../sync/api';
import { Button } from '../ui/Button';
import { refreshAfterSync, teamApi, useSession } from './teamClient';

type Mode = 'sign-in' | 'register' | 'reset';

/** The header's account corner: who is signed in, or a small panel to sign in, register or ask for a reset link. */
export function AccountPanel() {
  const session = useSession();
  const qc = useQueryClient();
  const [open, setOpen] = useState(false);
  const out = useMutation({ mutationFn: () => signOut(appDb(), teamApi()), onSettled: () => refreshAfterSync(qc) });
  const server = useServerBase();
  if (session.data) {
    return (
      <span className="flex items-center gap-2 text-xs text-ink-soft">
        <span data-testid="signed-in-as" title={`on ${server.data || 'this site'}`}>
          {session.data.user.name}
        </span>
        <Button tone="quiet" onClick={() => out.mutate()}>
          Sign out
        </Button>
      </span>
    );
  }
  return (
    <span className="relative">
      <Button tone="quiet" onClick={() => setOpen((o) => !o)} aria-expanded={open}>
        Sign in
      </Button>
      {open && (
        <div className="absolute right-0 top-8 z-30 w-72 rounded border border-rule bg-sheet p-3 shadow-lg">
          <AccountForm onDone={() => setOpen(false)} />
          <ServerAddressForm />
        </div>
      )}
    </span>
  );
}

function useServerBase() {
  return useQuery({ queryKey: ['server-base'], queryFn: () => serverBase(appDb()) });
}

/** Where the team server is: by default this site's own origin, which serves both the app and the API. */
function ServerAddressForm() {
  const qc = useQueryClient();
  const current = useServerBase();
  const [address, setAddress] = useState('');
  const [note, setNote] = useState<{ text: string; bad: boolean }>();
  useEffect(() => {
    if (current.data !== undefined) setAddress(current.data);
  }, [current.data]);
  const save = useMutation({
    mutationFn: () => setServerBase(appDb(), address),
    onSuccess: (value) => {
      setAddress(value);
      setNote({ text: value ? `Signing in goes to ${value}.` : 'Signing in goes to this site.', bad: false });
      void qc.invalidateQueries({ queryKey: ['server-base'] });
    },
    onError: (e: Error) => setNote({ text: e.message, bad: true }),
  });
  return (
    <form
      aria-label="Team server"
      className="mt-3 flex flex-col gap-1 border-t border-rule-soft pt-2 text-xs"
      onSubmit={(e) => {
        e.preventDefault();
        setNote(undefined);
        save.mutate();
      }}
    >
      <label htmlFor="team-server" className="text-ink-soft">
        Team server address
      </label>
      <span className="flex gap-1">
        <input
          id="team-server"
          value={address}
          onChange={(e) => setAddress(e.target.value)}
          placeholder="this site (default)"
          aria-invalid={note?.bad || undefined}
          className="min-w-0 flex-1 rounded border border-rule bg-paper px-2 py-1"
        />
        <Button type="submit" disabled={save.isPending}>
          Use
        </Button>
      </span>
      {note && (
        <p role={note.bad ? 'alert' : 'status'} className={note.bad ? 'text-odds' : 'text-ink-soft'}>
          {note.text}
        </p>
      )}
      <p className="text-[11px] text-ink-faint">Another address works when that server lists this site as its app origin (APP_ORIGIN).</p>
    </form>
  );
}

export function AccountForm({ onDone, initialMode = 'sign-in' }: { onDone(): void; initialMode?: Mode }) {
  const qc = useQueryClient();
  const [mode, setMode] = useState<Mode>(initialMode);
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [name, setName] = useState('');
  const [note, setNote] = useState<string>();
  const submit = useMutation({
    mutationFn: async () => {
      if (mode === 'reset') {
        await teamApi().request('POST', '/api/auth/password-reset', { email }, { auth: false });
        return 'If the address has an account, a reset link is on its way (see the Mailroom during development).';
      }
      await signIn(appDb(), teamApi(), email, password, mode === 'register' ? { name } : undefined);
      return null;
    },
    onSuccess: (msg) => {
      refreshAfterSync(qc);
      if (msg) setNote(msg);
      else onDone();
    },
    onError: (e: Error) => setNote(navigator.onLine ? e.message : 'Offline: signing in needs the team server. Everything local still works.'),
  });
  return (
    <form
      aria-label="Account"
      className="flex flex-col gap-2 text-sm"
      onSubmit={(e) => {
        e.preventDefault();
        setNote(undefined);
        submit.mutate();
      }}
    >
      <div className="flex gap-2 text-xs">
        {(['sign-in', 'register', 'reset'] as const).map((m) => (
          <button key={m} type="button" onClick={() => setMode(m)} className={mode === m ? 'font-semibold text-ink' : 'text-ink-soft hover:text-ink'}>
            {m === 'sign-in' ? 'Sign in' : m === 'register' ? 'Register' : 'Forgot password'}
          </button>
        ))}
      </div>
      {mode === 'register' && <input aria-label="Name" required value={name} onChange={(e) => setName(e.target.value)} placeholder="Name" className="rounded border border-rule bg-paper px-2 py-1" />}
      <input aria-label="E-mail" type="email" required value={email} onChange={(e) => setEmail(e.target.value)} placeholder="E-mail" className="rounded border border-rule bg-paper px-2 py-1" />
      {mode !== 'reset' && <input aria-label="Password" type="password" required value={password} onChange={(e) => setPassword(e.target.value)} placeholder="Password" className="rounded border border-rule bg-paper px-2 py-1" />}
      <Button tone="primary" type="submit" disabled={submit.isPending}>
        {mode === 'sign-in' ? 'Sign in' : mode === 'register' ? 'Create account' : 'Send reset link'}
      </Button>
      {note && <p role="status" className="text-xs text-ink-soft">{note}</p>}
      <p className="text-[11px] text-ink-faint">Signed out, every project stays on this machine and works offline.</p>
    </form>
  );
}
