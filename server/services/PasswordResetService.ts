import { randomUUID } from 'node:crypto';
import { IsNull } from 'typeorm';
import { hashToken, newToken } from '../auth/secrets';
import type { Transactor } from '../db/Transactor';
import { badRequest } from '../http/HttpError';
import type { Mailer } from '../mail/Mailer';
import { passwordResetMail } from '../mail/templates';
import type { AuthService } from './AuthService';
import { addMinutes, iso, type Clock } from './clock';

/** The path of the app's page that takes a reset token (the link in the e-mail). */
export const RESET_PATH = '/reset-password/';

/**
 * Password reset by e-mailed link. Requests answer the same whether or not
 * the account exists; tokens are one-time, expire, are stored hashed, and
 * using one signs every session of the account out.
 */
export class PasswordResetService {
  constructor(
    private readonly tx: Transactor,
    private readonly auth: AuthService,
    private readonly mailer: Mailer,
    private readonly settings: { appOrigin: string; resetTtlMinutes: number },
    private readonly clock: Clock,
  ) {}

  async request(email: string): Promise<void> {
    const token = newToken();
    const user = await this.tx.write(async (repos) => {
      const found = await repos.users.findOneBy({ email });
      if (!found || found.disabled) return null;
      const now = this.clock();
      await repos.passwordResets.insert({
        id: randomUUID(),
        userId: found.id,
        tokenHash: hashToken(token),
        expiresAt: iso(addMinutes(now, this.settings.resetTtlMinutes)),
        createdAt: iso(now),
        usedAt: null,
      });
      return found;
    });
    if (!user) return;
    const link = `${this.settings.appOrigin}${RESET_PATH}${token}`;
    await this.mailer.send(passwordResetMail({ to: user.email, name: user.name, link, minutes: this.settings.resetTtlMinutes }));
  }

  async confirm(token: string, password: string): Promise<void> {
    const passwordHash = await this.auth.hash(password);
    await this.tx.write(async (repos) => {
      const row = await repos.passwordResets.findOneBy({ tokenHash: hashToken(token) });
      const now = iso(this.clock());
      if (!row || row.usedAt || row.expiresAt <= now) throw badRequest('the reset link is not valid or has expired; ask for a new one');
      const user = await repos.users.findOneBy({ id: row.userId });
      if (!user || user.disabled) throw badRequest('the reset link is not valid or has expired; ask for a new one');
      // Retire every outstanding link of the account, not just this one.
      await repos.passwordResets.update({ userId: user.id, usedAt: IsNull() }, { usedAt: now });
      await repos.users.update({ id: user.id }, { passwordHash, updatedAt: now });
      await this.auth.revokeAllSessions(repos, user.id);
    });
  }
}
