import type { OutgoingMail } from './Mailer';

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

function mail(to: string, subject: string, lines: string[], link: string, action: string): OutgoingMail {
  const text = [...lines, '', `${action}: ${link}`, '', '— Gluefield'].join('\n');
  const html = `${lines.map((l) => `<p>${escape(l)}</p>`).join('')}<p><a href="${escape(link)}">${escape(action)}</a></p><p>— Gluefield</p>`;
  return { to, subject, text, html };
}

export function invitationMail(input: { to: string; inviter: string; projectName: string; role: string; link: string; expiresAt: string }): OutgoingMail {
  return mail(
    input.to,
    `${input.inviter} invites you to "${input.projectName}" on Gluefield`,
    [
      `${input.inviter} has invited you to join the project "${input.projectName}" as ${input.role}.`,
      `The link works once and until ${input.expiresAt}.`,
    ],
    input.link,
    'Join the project',
  );
}

export function passwordResetMail(input: { to: string; name: string; link: string; minutes: number }): OutgoingMail {
  return mail(
    input.to,
    'Reset your Gluefield password',
    [
      `Hello ${input.name},`,
      `someone asked to reset the password of your Gluefield account. If that was you, choose a new one within ${input.minutes} minutes; the link works once.`,
      'If it was not you, ignore this message: your password stays as it is.',
    ],
    input.link,
    'Choose a new password',
  );
}
