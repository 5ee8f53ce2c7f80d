import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { PROJECT_ROLES, type AddMemberResponse, type AuditEntryView, type MembersResponse, type ProjectRole } from '../../shared/api/types';
import { Button } from '../ui/Button';
import { teamApi, useSession, useSyncState } from './teamClient';

function useRemote(projectId: string) {
  const s = useSyncState(projectId);
  return s.data?.link ?? null;
}

function Back({ projectId }: { projectId: string }) {
  return (
    <p className="mb-2 text-xs text-ink-faint">
      <Link to={`/p/${projectId}`} className="hover:text-ink">
        Back to the bench
      </Link>
    </p>
  );
}

/** Crew: the project's members and roles. Owners and admins invite, change and revoke; everyone else sees. */
export function CrewScreen() {
  const { projectId = '' } = useParams();
  const link = useRemote(projectId);
  const session = useSession();
  const qc = useQueryClient();
  const key = ['members', link?.remoteId];
  const members = useQuery({ queryKey: key, queryFn: () => teamApi().request<MembersResponse>('GET', `/api/projects/${link!.remoteId}/members`), enabled: !!link });
  const canManage = link?.role === 'owner' || link?.role === 'admin' || session.data?.user.siteRole === 'admin';
  const [email, setEmail] = useState('');
  const [role, setRole] = useState<ProjectRole>('editor');
  const [note, setNote] = useState<string>();
  const done = () => void qc.invalidateQueries({ queryKey: key });
  const onError = (e: Error) => setNote(e.message);
  const invite = useMutation({
    mutationFn: () => teamApi().request<AddMemberResponse>('POST', `/api/projects/${link!.remoteId}/members`, { email, role }),
    onSuccess: (r) => {
      setEmail('');
      setNote(r.member ? `${r.member.name} joined as ${r.member.role}.` : `Invitation ${r.mailed ? 'mailed' : 'created (not mailed)'} to ${r.invitation?.email}.`);
      done();
    },
    onError,
  });
  const change = useMutation({ mutationFn: (a: { userId: string; role: ProjectRole }) => teamApi().request('PATCH', `/api/projects/${link!.remoteId}/members/${a.userId}`, { role: a.role }), onSuccess: done, onError });
  const revoke = useMutation({ mutationFn: (userId: string) => teamApi().request('DELETE', `/api/projects/${link!.remoteId}/members/${userId}`), onSuccess: done, onError });
  const withdraw = useMutation({ mutationFn: (id: string) => teamApi().request('DELETE', `/api/projects/${link!.remoteId}/invitations/${id}`), onSuccess: done, onError });
  if (!link) return <div className="p-6"><Back projectId={projectId} />This project is not linked to the team server.</div>;
  return (
    <div className="mx-auto max-w-3xl p-6">
      <Back projectId={projectId} />
      <h1 className="mb-1 text-xl font-semibold">Crew</h1>
      <p className="mb-4 text-sm text-ink-soft">Your role: {link.role}. Owners manage the crew; editors change models, readings and runs; viewers read.</p>
      {members.error && <p role="alert" className="text-odds">{members.error.message}</p>}
      <table className="mb-4 w-full text-sm">
        <tbody className="divide-y divide-rule-soft">
          {members.data?.members.map((m) => (
            <tr key={m.userId} data-testid="crew-member">
              <td className="py-1.5">{m.name}</td>
              <td className="text-ink-soft">{m.email}</td>
              <td>
                {canManage ? (
                  <select aria-label={`Role of ${m.name}`} value={m.role} onChange={(e) => change.mutate({ userId: m.userId, role: e.target.value as ProjectRole })} className="rounded border border-rule bg-paper px-1">
                    {PROJECT_ROLES.map((r) => <option key={r}>{r}</option>)}
                  </select>
                ) : (
                  m.role
                )}
              </td>
              <td className="text-right">
                {(canManage || m.userId === session.data?.user.id) && (
                  <Button tone="quiet" onClick={() => revoke.mutate(m.userId)}>
                    {m.userId === session.data?.user.id ? 'Leave' : 'Revoke'}
                  </Button>
                )}
              </td>
            </tr>
          ))}
          {members.data?.invitations.map((i) => (
            <tr key={i.id} className="text-ink-soft">
              <td className="py-1.5 italic">invited</td>
              <td>{i.email}</td>
              <td>{i.role}</td>
              <td className="text-right">
                {canManage && <Button tone="quiet" onClick={() => withdraw.mutate(i.id)}>Withdraw</Button>}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      {canManage && (
        <form
          className="flex gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            setNote(undefined);
            invite.mutate();
          }}
        >
          <input aria-label="Invite e-mail" type="email" required value={email} onChange={(e) => setEmail(e.target.value)} placeholder="colleague@example.org" className="flex-1 rounded border border-rule bg-paper px-2 py-1" />
          <select aria-label="Invite role" value={role} onChange={(e) => setRole(e.target.value as ProjectRole)} className="rounded border border-rule bg-paper px-1">
            {PROJECT_ROLES.map((r) => <option key={r}>{r}</option>)}
          </select>
          <Button tone="primary" type="submit" disabled={invite.isPending}>Invite</Button>
        </form>
      )}
      {note && <p role="status" className="mt-2 text-sm text-ink-soft">{note}</p>}
    </div>
  );
}

/** Logbook: the project's audit trail, newest first. */
export function LogbookScreen() {
  const { projectId = '' } = useParams();
  const link = useRemote(projectId);
  const [pages, setPages] = useState<string[]>([]);
  const log = useQuery({
    queryKey: ['logbook', link?.remoteId, pages],
    queryFn: async () => {
      const all: AuditEntryView[] = [];
      let more = false;
      for (const before of ['', ...pages]) {
        const r = await teamApi().request<{ entries: AuditEntryView[]; more: boolean }>('GET', `/api/projects/${link!.remoteId}/audit?limit=100${before ? `&before=${before}` : ''}`);
        all.push(...r.entries);
        more = r.more;
      }
      return { entries: all, more };
    },
    enabled: !!link,
  });
  if (!link) return <div className="p-6"><Back projectId={projectId} />This project is not linked to the team server.</div>;
  const last = log.data?.entries.at(-1);
  return (
    <div className="mx-auto max-w-4xl p-6">
      <Back projectId={projectId} />
      <h1 className="mb-4 text-xl font-semibold">Logbook</h1>
      {log.error && <p role="alert" className="text-odds">{log.error.message}</p>}
      <table className="w-full text-sm">
        <tbody className="divide-y divide-rule-soft">
          {log.data?.entries.map((e) => (
            <tr key={e.id} data-testid="logbook-entry">
              <td className="num whitespace-nowrap py-1 pr-3 text-ink-faint">{new Date(e.at).toLocaleString()}</td>
              <td className="pr-3">{e.actorName ?? '—'}</td>
              <td className="pr-3 font-medium">{e.action}</td>
              <td className="text-ink-soft">{e.target ?? ''}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {log.data?.more && last && (
        <Button className="mt-3" onClick={() => setPages((p) => [...p, last.id])}>
          Older entries
        </Button>
      )}
    </div>
  );
}
