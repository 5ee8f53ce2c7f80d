import { randomUUID } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { MailroomMessage } from '../../shared/api/types';

export interface SmtpSink {
  /** The port it listens on (useful when started on port 0). */
  port: number;
  /** Captured messages, newest first. */
  messages(): MailroomMessage[];
  clear(): void;
  close(): Promise<void>;
}

const MAX_MESSAGES = 500;
const MAX_BYTES = 5 * 1024 * 1024;

/**
 * A local SMTP server that accepts every message and keeps it in memory
 * for the Mailroom, so invitations and password resets can be followed in
 * development and demos without a real relay. Listens on loopback only;
 * no authentication, no STARTTLS.
 */
export async function startSmtpSink(port: number, host = '127.0.0.1'): Promise<SmtpSink> {
  let kept: MailroomMessage[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    allowInsecureAuth: true,
    // Any credentials are welcome: the sink is a catcher, not a relay.
    onAuth(_auth, _session, callback) {
      callback(null, { user: 'sink' });
    },
    banner: 'Gluefield mail sink',
    size: MAX_BYTES,
    logger: false,
    onData(stream, _session, callback) {
      // Answer 250 only once the message is parsed and kept, so a sender that got its reply finds the message here.
      simpleParser(stream)
        .then((parsed) => {
          kept.unshift({
            id: randomUUID(),
            from: addresses(parsed.from).join(', '),
            to: addresses(parsed.to),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : null,
            receivedAt: new Date().toISOString(),
          });
          if (kept.length > MAX_MESSAGES) kept.length = MAX_MESSAGES;
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => {
      server.off('error', reject);
      resolve();
    });
  });
  server.on('error', (error) => console.error('mail sink:', error));
  return {
    port: (server.server.address() as AddressInfo).port,
    messages: () => kept.slice(),
    clear: () => {
      kept = [];
    },
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

function addresses(field: AddressObject | AddressObject[] | undefined): string[] {
  if (!field) return [];
  const list = Array.isArray(field) ? field : [field];
  return list.flatMap((a) => a.value.map((v) => v.address ?? v.name ?? '')).filter(Boolean);
}
