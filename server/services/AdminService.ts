import type { SiteRole, UserView } from '../../shared/api/types';
import type { Transactor } from '../db/Transactor';
import { conflict, notFound } from '../http/HttpError';
import type { AuthService } from './AuthService';
import { iso, type Clock } from './clock';
import { userView } from './views';

export interface UserPatch {
  name?: string;
  siteRole?: SiteRole;
  disabled?: boolean;
}

/** Account management for site admins. The site always keeps one enabled admin. */
export class AdminService {
  constructor(private readonly tx: Transactor, private readonly auth: AuthService, private readonly clock: Clock) {}

  listUsers(): Promise<UserView[]> {
    return this.tx.read(async (repos) => (await repos.users.find({ order: { email: 'ASC' } })).map(userView));
  }

  patchUser(userId: string, patch: UserPatch): Promise<UserView> {
    return this.tx.write(async (repos) => {
      const user = await repos.users.findOneBy({ id: userId });
      if (!user) throw notFound('no such user');
      const next = { ...user, ...patch, updatedAt: iso(this.clock()) };
      const losesAdmin = user.siteRole === 'admin' && !user.disabled && (next.siteRole !== 'admin' || next.disabled);
      if (losesAdmin && (await repos.users.countBy({ siteRole: 'admin', disabled: false })) <= 1) {
        throw conflict('the site must keep at least one enabled admin');
      }
      await repos.users.update({ id: userId }, { name: next.name, siteRole: next.siteRole, disabled: next.disabled, updatedAt: next.updatedAt });
      if (next.disabled && !user.disabled) await this.auth.revokeAllSessions(repos, userId);
      return userView(next);
    });
  }
}
