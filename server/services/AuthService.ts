import { randomUUID } from 'node:crypto';
import { IsNull } from 'typeorm';
import type { AuthResponse } from '../../shared/api/types';
import type { AccessTokens } from '../auth/AccessTokens';
import { checkPassword, hashPassword, NO_SUCH_USER_HASH } from '../auth/passwords';
import { hashToken, newToken } from '../auth/secrets';
import type { UserRow } from '../db/entities';
import type { Repos } from '../db/Repos';
import type { Transactor } from '../db/Transactor';
import { conflict, forbidden, unauthorized } from '../http/HttpError';
import { iso, type Clock } from './clock';
import { isUniqueViolation } from './isUniqueViolation';
import { userView } from './views';

export interface AuthSettings {
  bcryptRounds: number;
  refreshTtlDays: number;
}

/**
 * Accounts and sessions: register, sign in, rotate refresh tokens, sign out.
 * A session is a family of refresh tokens; each refresh retires the token
 * used and issues its successor. Presenting a retired token again means
 * someone else holds a copy, so the whole family is revoked.
 */
export class AuthService {
  constructor(
    private readonly tx: Transactor,
    private readonly access: AccessTokens,
    private readonly settings: AuthSettings,
    private readonly clock: Clock,
  ) {}

  async register(input: { email: string; password: string; name: string }): Promise<AuthResponse> {
    const passwordHash = await hashPassword(input.password, this.settings.bcryptRounds);
    try {
      return await this.tx.write(async (repos) => {
        if (await repos.users.existsBy({ email: input.email })) throw conflict('an account with this e-mail already exists');
        const user = await this.createUser(repos, { email: input.email, name: input.name, passwordHash, siteRole: 'member' });
        return this.startSession(repos, user);
      });
    } catch (error) {
      if (isUniqueViolation(error)) throw conflict('an account with this e-mail already exists');
      throw error;
    }
  }

  async login(input: { email: string; password: string }): Promise<AuthResponse> {
    const user = await this.tx.read((repos) => repos.users.findOneBy({ email: input.email }));
    const ok = await checkPassword(input.password, user?.passwordHash ?? NO_SUCH_USER_HASH);
    if (!user || !ok) throw unauthorized('wrong e-mail or password');
    if (user.disabled) throw forbidden('this account is disabled');
    return this.tx.write((repos) => this.startSession(repos, user));
  }

  async refresh(refreshToken: string): Promise<AuthResponse> {
    const outcome = await this.tx.write(async (repos) => {
      const row = await repos.refreshTokens.findOneBy({ tokenHash: hashToken(refreshToken) });
      if (!row || row.revokedAt) return { error: 'the refresh token is not valid' } as const;
      const now = iso(this.clock());
      if (row.usedAt) {
        await this.revokeFamily(repos, row.familyId, now);
        return { error: 'the refresh token was already used; every session it belongs to is now signed out' } as const;
      }
      if (row.expiresAt <= now) return { error: 'the refresh token has expired' } as const;
      const user = await repos.users.findOneBy({ id: row.userId });
      if (!user || user.disabled) return { error: 'the account is not available' } as const;
      await repos.refreshTokens.update({ id: row.id }, { usedAt: now });
      return { session: await this.issue(repos, user, row.familyId) } as const;
    });
    // The revocation above must commit, so the 401 is thrown only after the transaction.
    if ('error' in outcome) throw unauthorized(outcome.error);
    return outcome.session;
  }

  /** Revoke the session the refresh token belongs to. Unknown tokens are ignored (signing out twice is fine). */
  async logout(refreshToken: string): Promise<void> {
    await this.tx.write(async (repos) => {
      const row = await repos.refreshTokens.findOneBy({ tokenHash: hashToken(refreshToken) });
      if (row) await this.revokeFamily(repos, row.familyId, iso(this.clock()));
    });
  }

  /** The signed-in user behind an access token; 401 when the token or the account is not valid. */
  async authenticate(accessToken: string): Promise<UserRow> {
    const userId = this.access.verify(accessToken);
    const user = await this.tx.read((repos) => repos.users.findOneBy({ id: userId }));
    if (!user || user.disabled) throw unauthorized('the account is not available');
    return user;
  }

  /** Sign every session of a user out (password change, disabled account). Runs inside the caller's transaction. */
  async revokeAllSessions(repos: Repos, userId: string): Promise<void> {
    await repos.refreshTokens.update({ userId, revokedAt: IsNull() }, { revokedAt: iso(this.clock()) });
  }

  hash(password: string): Promise<string> {
    return hashPassword(password, this.settings.bcryptRounds);
  }

  async createUser(repos: Repos, fields: Pick<UserRow, 'email' | 'name' | 'passwordHash' | 'siteRole'>): Promise<UserRow> {
    const now = iso(this.clock());
    const user: UserRow = { id: randomUUID(), ...fields, disabled: false, createdAt: now, updatedAt: now };
    await repos.users.insert(user);
    return user;
  }

  /** A new session (a new refresh-token family) inside the caller's transaction. */
  startSession(repos: Repos, user: UserRow): Promise<AuthResponse> {
    return this.issue(repos, user, randomUUID());
  }

  private async issue(repos: Repos, user: UserRow, familyId: string): Promise<AuthResponse> {
    const refreshToken = newToken();
    const now = this.clock();
    await repos.refreshTokens.insert({
      id: randomUUID(),
      userId: user.id,
      familyId,
      tokenHash: hashToken(refreshToken),
      expiresAt: iso(new Date(now.getTime() + this.settings.refreshTtlDays * 86_400_000)),
      createdAt: iso(now),
      usedAt: null,
      revokedAt: null,
    });
    return { user: userView(user), accessToken: this.access.sign(user.id), refreshToken, expiresIn: this.access.ttlSeconds };
  }

  private async revokeFamily(repos: Repos, familyId: string, now: string): Promise<void> {
    await repos.refreshTokens.update({ familyId, revokedAt: IsNull() }, { revokedAt: now });
  }
}
