import { randomUUID } from 'node:crypto';
import { In, IsNull, MoreThan } from 'typeorm';
import type { AddMemberResponse, InvitationView, MembersResponse, ProjectRole } from '../../shared/api/types';
import { hashToken, newToken } from '../auth/secrets';
import type { InvitationRow, ProjectRow, UserRow } from '../db/entities';
import type { Repos } from '../db/Repos';
import type { Transactor } from '../db/Transactor';
import { conflict, notFound } from '../http/HttpError';
import type { Mailer } from '../mail/Mailer';
import { invitationMail } from '../mail/templates';
import { iso, type Clock } from './clock';
import { recordAudit } from './recordAudit';
import { memberView } from './views';

/** The path of the app's page that takes an invitation token (the link in the e-mail). */
export const INVITATION_PATH = '/invitations/';

const ROLE_ORDER: Record<ProjectRole, number> = { owner: 0, editor: 1, viewer: 2 };

export function invitationView(i: InvitationRow): InvitationView {
  return { id: i.id, email: i.email, role: i.role, expiresAt: i.expiresAt, invitedBy: i.invitedBy };
}

/**
 * A project's crew: members with their roles and pending invitations.
 * Granting access to an existing account adds it at once; anyone else is
 * invited by e-mail with a one-time link. A project always keeps an owner.
 */
export class MemberService {
  constructor(
    private readonly tx: Transactor,
    private readonly mailer: Mailer,
    private readonly settings: { appOrigin: string; invitationTtlDays: number },
    private readonly clock: Clock,
  ) {}

  list(projectId: string, withInvitations: boolean): Promise<MembersResponse> {
    return this.tx.read(async (repos) => {
      const memberships = await repos.memberships.findBy({ projectId });
      const ids = memberships.map((m) => m.userId);
      const users = new Map((ids.length ? await repos.users.findBy({ id: In(ids) }) : []).map((u) => [u.id, u]));
      const members = memberships
        .filter((m) => users.has(m.userId))
        .map((m) => memberView(m, users.get(m.userId)!))
        .sort((a, b) => ROLE_ORDER[a.role] - ROLE_ORDER[b.role] || a.name.localeCompare(b.name));
      const invitations = withInvitations
        ? (await repos.invitations.find({
            where: { projectId, acceptedAt: IsNull(), revokedAt: IsNull(), expiresAt: MoreThan(iso(this.clock())) },
            order: { createdAt: 'ASC' },
          })).map(invitationView)
        : [];
      return { members, invitations };
    });
  }

  async add(actor: UserRow, project: ProjectRow, email: string, role: ProjectRole): Promise<{ status: 201 | 202; body: AddMemberResponse }> {
    const token = newToken();
    const outcome = await this.tx.write(async (repos) => {
      const now = iso(this.clock());
      const user = await repos.users.findOneBy({ email });
      if (user) {
        if (await repos.memberships.existsBy({ projectId: project.id, userId: user.id })) throw conflict('already a member; change the role instead');
        const membership = { id: randomUUID(), projectId: project.id, userId: user.id, role, createdAt: now };
        await repos.memberships.insert(membership);
        await recordAudit(repos, now, { projectId: project.id, actorId: actor.id, action: 'member.add', target: user.email, detail: { role } });
        return { member: memberView(membership, user) };
      }
      // A new invitation replaces any pending one for the same address.
      await repos.invitations.update({ projectId: project.id, email, acceptedAt: IsNull(), revokedAt: IsNull() }, { revokedAt: now });
      const invitation: InvitationRow = {
        id: randomUUID(), projectId: project.id, email, role, tokenHash: hashToken(token), invitedBy: actor.id,
        expiresAt: iso(new Date(this.clock().getTime() + this.settings.invitationTtlDays * 86_400_000)),
        createdAt: now, acceptedAt: null, acceptedBy: null, revokedAt: null,
      };
      await repos.invitations.insert(invitation);
      await recordAudit(repos, now, { projectId: project.id, actorId: actor.id, action: 'invitation.create', target: email, detail: { role } });
      return { invitation };
    });
    if ('member' in outcome) return { status: 201, body: { member: outcome.member } };
    const link = `${this.settings.appOrigin}${INVITATION_PATH}${token}`;
    const mailed = await this.mailer.send(invitationMail({
      to: email, inviter: actor.name, projectName: project.name, role, link, expiresAt: outcome.invitation.expiresAt,
    }));
    return { status: 202, body: { invitation: invitationView(outcome.invitation), mailed } };
  }

  changeRole(actor: UserRow, projectId: string, userId: string, role: ProjectRole) {
    return this.tx.write(async (repos) => {
      const membership = await repos.memberships.findOneBy({ projectId, userId });
      const user = await repos.users.findOneBy({ id: userId });
      if (!membership || !user) throw notFound('no such member');
      if (membership.role === role) return memberView(membership, user);
      if (membership.role === 'owner') await this.keepAnOwner(repos, projectId);
      const now = iso(this.clock());
      await repos.memberships.update({ id: membership.id }, { role });
      await recordAudit(repos, now, { projectId, actorId: actor.id, action: 'member.role', target: user.email, detail: { from: membership.role, to: role } });
      return memberView({ ...membership, role }, user);
    });
  }

  remove(actor: UserRow, projectId: string, userId: string): Promise<void> {
    return this.tx.write(async (repos) => {
      const membership = await repos.memberships.findOneBy({ projectId, userId });
      const user = await repos.users.findOneBy({ id: userId });
      if (!membership || !user) throw notFound('no such member');
      if (membership.role === 'owner') await this.keepAnOwner(repos, projectId);
      await repos.memberships.delete({ id: membership.id });
      await recordAudit(repos, iso(this.clock()), { projectId, actorId: actor.id, action: 'member.remove', target: user.email, detail: { role: membership.role } });
    });
  }

  revokeInvitation(actor: UserRow, projectId: string, invitationId: string): Promise<void> {
    return this.tx.write(async (repos) => {
      const invitation = await repos.invitations.findOneBy({ id: invitationId, projectId, acceptedAt: IsNull(), revokedAt: IsNull() });
      if (!invitation) throw notFound('no such pending invitation');
      const now = iso(this.clock());
      await repos.invitations.update({ id: invitation.id }, { revokedAt: now });
      await recordAudit(repos, now, { projectId, actorId: actor.id, action: 'invitation.revoke', target: invitation.email });
    });
  }

  /** Refuse to take away the last owner (called before demoting or removing an owner). */
  private async keepAnOwner(repos: Repos, projectId: string): Promise<void> {
    const owners = await repos.memberships.countBy({ projectId, role: 'owner' });
    if (owners <= 1) throw conflict('a project must keep at least one owner');
  }
}
