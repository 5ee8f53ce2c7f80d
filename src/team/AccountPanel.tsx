import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { appDb } from '../app/db';
import { signIn, signOut } from '../sync/api';
import { Button } from '../ui/Button';
import { refreshAfterSync, teamApi, useSession } from './teamClient';

type Mode = 'sign-in' | 'register' | 'reset';

/** The header's account corner: who is signed in, or a small panel to sign in, register or ask for a reset link. */
export function AccountPanel() {
  const session = useSession();
  const qc = useQueryClient();
  const [open, setOpen] = useState(false);
  const out = useMutation({ mutationFn: () => signOut(appDb(), teamApi()), onSettled: () => refreshAfterSync(qc) });
  if (session.data) {
    return (
      <span className="flex items-center gap-2 text-xs text-ink-soft">
        <span data-testid="signed-in-as">{session.data.user.name}</span>
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
        </div>
      )}
    </span>
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
