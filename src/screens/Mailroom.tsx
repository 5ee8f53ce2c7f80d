import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import type { MailroomMessage } from '../../shared/api/types';
import { appDb } from '../app/db';
import { serverBase } from '../sync/api';
import { Button } from '../ui/Button';

/**
 * The Mailroom: e-mail the server sent while it runs with the local sink
 * (invitations, password resets), for development and demos. With a real
 * relay configured the server has no mailroom and this page says so.
 */
export function Mailroom() {
  const mail = useQuery({
    queryKey: ['mailroom'],
    queryFn: async (): Promise<MailroomMessage[]> => {
      const res = await fetch(`${await serverBase(appDb())}/api/mailroom`);
      if (res.status === 404) throw new Error('This server sends mail through a real relay; there is no local mailroom.');
      if (!res.ok) throw new Error(`The server answered ${res.status}.`);
      return ((await res.json()) as { messages: MailroomMessage[] }).messages;
    },
    refetchInterval: 5000,
    staleTime: 0,
  });
  const [open, setOpen] = useState<string>();
  return (
    <div className="mx-auto max-w-4xl p-6">
      <div className="mb-4 flex items-end justify-between">
        <div>
          <h1 className="text-xl font-semibold">Mailroom</h1>
          <p className="text-sm text-ink-soft">Messages caught by the local mail sink. Links in them work as they would in a real inbox.</p>
        </div>
        <Button onClick={() => void mail.refetch()}>Refresh</Button>
      </div>
      {mail.isLoading && <p className="text-ink-soft">Fetching…</p>}
      {mail.error && <p className="text-ink-soft">{(mail.error as Error).message} {navigator.onLine ? '' : '(You are offline.)'}</p>}
      {mail.data?.length === 0 && <p className="rounded border border-dashed border-rule p-8 text-center text-ink-soft">No messages yet. Invite someone to a project or ask for a password reset.</p>}
      <ul className="divide-y divide-rule-soft rounded border border-rule bg-sheet" data-testid="mailroom">
        {mail.data?.map((m) => (
          <li key={m.id} className="px-4 py-3">
            <button className="flex w-full justify-between text-left" onClick={() => setOpen(open === m.id ? undefined : m.id)} aria-expanded={open === m.id}>
              <span>
                <span className="font-medium">{m.subject}</span>
                <span className="ml-3 text-xs text-ink-faint">to {m.to.join(', ')}</span>
              </span>
              <span className="num text-xs text-ink-faint">{new Date(m.receivedAt).toLocaleString()}</span>
            </button>
            {open === m.id && <pre className="mt-2 whitespace-pre-wrap rounded bg-paper p-3 text-xs">{linkify(m.text)}</pre>}
          </li>
        ))}
      </ul>
    </div>
  );
}

function linkify(text: string) {
  return text.split(/(https?:\/\/\S+)/g).map((part, i) =>
    /^https?:\/\//.test(part) ? (
      <a key={i} href={part} className="text-glued underline">
        {part}
      </a>
    ) : (
      part
    ),
  );
}
