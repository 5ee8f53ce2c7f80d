import { randomUUID } from 'node:crypto';
import type { AuthResponse, InvitationPreview, MemberView } from '../../shared/api/types';
import { hashToken } from '../auth/secrets';
import type { InvitationRow, UserRow } from '../db/entities';
import type { Repos } from '../db/Repos';
import type { Transactor } from '../db/Transactor';
import { badRequest, conflict, forbidden, HttpError, notFound } from '../http/HttpError';
import type { AuthService } from './AuthService';
import { iso, type Clock } from './clock';
import { projectView } from './ProjectService';
import { recordAudit } from './recordAudit';
import { memberView } from './views';

export interface AcceptResult {
  project: ReturnType<typeof projectView>;
  member: MemberView;
  /** Present when accepting created the account: the new session. */
  session?: AuthResponse;
}

/**
 * The invitation link's side: look at an invitation, and accept it, either
 * signed in with the invited address or by creating that account on the
 * spot (receiving the link proves the address). Each token works once.
 */
export class InvitationService {
  constructor(private readonly tx: Transactor, private readonly auth: AuthService, private readonly clock: Clock) {}

  preview(token: string): Promise<InvitationPreview> {
    return this.tx.read(async (repos) => {
      const invitation = await this.usable(repos, token);
      const project = await repos.projects.findOneByOrFail({ id: invitation.projectId });
      const inviter = await repos.users.findOneBy({ id: invitation.invitedBy });
      return {
        projectName: project.name,
        email: invitation.email,
        role: invitation.role,
        invitedBy: inviter?.name ?? 'a former member',
        expiresAt: invitation.expiresAt,
        hasAccount: await repos.users.existsBy({ email: invitation.email }),
      };
    });
  }

  async accept(token: string, user: UserRow | null, signUp: { name: string; password: string } | null): Promise<AcceptResult> {
    if (!user && !signUp) throw badRequest('sign in, or give a name and a password to create the invited account');
    const passwordHash = !user && signUp ? await this.auth.hash(signUp.password) : null;
    return this.tx.write(async (repos) => {
      const invitation = await this.usable(repos, token);
      let member: UserRow;
      if (user) {
        if (user.email !== invitation.email) throw forbidden('this invitation is for another e-mail address');
        member = user;
      } else {
        if (await repos.users.existsBy({ email: invitation.email })) throw conflict('an account with this e-mail exists; sign in to accept');
        member = await this.auth.createUser(repos, { email: invitation.email, name: signUp!.name, passwordHash: passwordHash!, siteRole: 'member' });
      }
      const now = iso(this.clock());
      await repos.invitations.update({ id: invitation.id }, { acceptedAt: now, acceptedBy: member.id });
      let membership = await repos.memberships.findOneBy({ projectId: invitation.projectId, userId: member.id });
      if (!membership) {
        membership = { id: randomUUID(), projectId: invitation.projectId, userId: member.id, role: invitation.role, createdAt: now };
        await repos.memberships.insert(membership);
      }
      await recordAudit(repos, now, { projectId: invitation.projectId, actorId: member.id, action: 'invitation.accept', target: member.email, detail: { role: membership.role } });
      const project = await repos.projects.findOneByOrFail({ id: invitation.projectId });
      return {
        project: projectView(project, membership.role),
        member: memberView(membership, member),
        session: user ? undefined : await this.auth.startSession(repos, member),
      };
    });
  }

  /** The invitation a token names, if it can still be used: 404 unknown, 410 used, revoked or expired. */
  private async usable(repos: Repos, token: string): Promise<InvitationRow> {
    const invitation = await repos.invitations.findOneBy({ tokenHash: hashToken(token) });
    if (!invitation) throw notFound('no such invitation');
    if (invitation.acceptedAt) throw new HttpError(410, 'this invitation has already been used');
    if (invitation.revokedAt) throw new HttpError(410, 'this invitation was withdrawn');
    if (invitation.expiresAt <= iso(this.clock())) throw new HttpError(410, 'this invitation has expired');
    return invitation;
  }
}
