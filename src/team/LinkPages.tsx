/** Pages for the e-mailed links: `/reset-password/:token` and `/invitations/:token`. */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import type { AuthResponse, InvitationPreview, ProjectView } from '../../shared/api/types';
import { appDb } from '../app/db';
import { saveSession } from '../sync/api';
import { openRemoteProject } from '../sync/engine';
import { Button } from '../ui/Button';
import { AccountForm } from './AccountPanel';
import { refreshAfterSync, teamApi, useSession } from './teamClient';

export function ResetPasswordPage() {
  const { token = '' } = useParams();
  const [password, setPassword] = useState('');
  const reset = useMutation({ mutationFn: () => teamApi().request('POST', '/api/auth/password-reset/confirm', { token, password }, { auth: false }) });
  return (
    <div className="mx-auto max-w-sm p-6">
      <h1 className="mb-3 text-xl font-semibold">Choose a new password</h1>
      {reset.isSuccess ? (
        <p role="status">
          Password changed; every session was signed out. <Link className="underline" to="/">Sign in on the desk</Link>.
        </p>
      ) : (
        <form
          className="flex flex-col gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            reset.mutate();
          }}
        >
          <input aria-label="New password" type="password" required value={password} onChange={(e) => setPassword(e.target.value)} className="rounded border border-rule bg-paper px-2 py-1" />
          <Button tone="primary" type="submit" disabled={reset.isPending}>
            Set password
          </Button>
          {reset.error && <p role="alert" className="text-sm text-odds">{reset.error.message}</p>}
        </form>
      )}
    </div>
  );
}

export function InvitationPage() {
  const { token = '' } = useParams();
  const qc = useQueryClient();
  const navigate = useNavigate();
  const session = useSession();
  const [name, setName] = useState('');
  const [password, setPassword] = useState('');
  const preview = useQuery({ queryKey: ['invitation', token], queryFn: () => teamApi().request<InvitationPreview>('GET', `/api/invitations/${token}`, undefined, { auth: false }), retry: false });
  const accept = useMutation({
    mutationFn: async (asNew: boolean) => {
      const res = await teamApi().request<Partial<AuthResponse> & { project: ProjectView }>('POST', `/api/invitations/${token}/accept`, asNew ? { name, password } : {}, { auth: !asNew });
      if (res.accessToken && res.refreshToken && res.user) await saveSession(appDb(), { user: res.user, accessToken: res.accessToken, refreshToken: res.refreshToken });
      return openRemoteProject(appDb(), teamApi(), res.project);
    },
    onSuccess: (projectId) => {
      refreshAfterSync(qc);
      navigate(`/p/${projectId}`);
    },
  });
  const p = preview.data;
  return (
    <div className="mx-auto max-w-md p-6">
      <h1 className="mb-3 text-xl font-semibold">Invitation</h1>
      {preview.isLoading && <p className="text-ink-soft">Reading the invitation…</p>}
      {preview.error && <p role="alert" className="text-odds">{preview.error.message}</p>}
      {p && (
        <div className="flex flex-col gap-3">
          <p>
            {p.invitedBy} invites <b>{p.email}</b> to <b>{p.projectName}</b> as {p.role}.
          </p>
          {session.data ? (
            <Button tone="primary" onClick={() => accept.mutate(false)} disabled={accept.isPending}>
              Accept as {session.data.user.email}
            </Button>
          ) : p.hasAccount ? (
            <>
              <p className="text-sm text-ink-soft">Sign in as {p.email} first.</p>
              <AccountForm onDone={() => undefined} />
            </>
          ) : (
            <form
              className="flex flex-col gap-2"
              onSubmit={(e) => {
                e.preventDefault();
                accept.mutate(true);
              }}
            >
              <input aria-label="Name" required value={name} onChange={(e) => setName(e.target.value)} placeholder="Your name" className="rounded border border-rule bg-paper px-2 py-1" />
              <input aria-label="Password" type="password" required value={password} onChange={(e) => setPassword(e.target.value)} placeholder="Password" className="rounded border border-rule bg-paper px-2 py-1" />
              <Button tone="primary" type="submit" disabled={accept.isPending}>
                Create account and join
              </Button>
            </form>
          )}
          {accept.error && <p role="alert" className="text-sm text-odds">{accept.error.message}</p>}
        </div>
      )}
    </div>
  );
}
