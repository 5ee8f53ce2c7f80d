import type { ProjectRole } from '../../shared/api/types';
import type { ProjectRow, UserRow } from '../db/entities';
import type { Transactor } from '../db/Transactor';
import { forbidden, notFound } from '../http/HttpError';

/** What a route needs to do with a project. */
export type Need = 'read' | 'write' | 'manage';

/** Your standing in a project: a membership role, or `admin` for a site admin who is not a member. */
export type Standing = ProjectRole | 'admin';

const RANK: Record<Standing, number> = { viewer: 1, editor: 2, owner: 3, admin: 3 };
const NEEDED: Record<Need, number> = { read: 1, write: 2, manage: 3 };

export interface Access {
  project: ProjectRow;
  standing: Standing;
}

/**
 * Who may do what in a project. Viewers read, editors also write, owners
 * also manage the crew; a site admin may do everything an owner may. To
 * anyone else a project does not exist: 404, never 403, so ids leak nothing.
 */
export class ProjectAccess {
  constructor(private readonly tx: Transactor) {}

  async require(user: UserRow, projectId: string, need: Need): Promise<Access> {
    const access = await this.tx.read(async (repos) => {
      const project = await repos.projects.findOneBy({ id: projectId });
      if (!project) return null;
      const membership = await repos.memberships.findOneBy({ projectId, userId: user.id });
      const standing: Standing | null = membership?.role ?? (user.siteRole === 'admin' ? 'admin' : null);
      return standing ? { project, standing } : null;
    });
    if (!access) throw notFound('no such project');
    if (RANK[access.standing] < NEEDED[need]) throw forbidden(need === 'write' ? 'viewers cannot change this project' : 'only owners and admins manage the crew');
    return access;
  }
}

export function canManage(standing: Standing): boolean {
  return RANK[standing] >= NEEDED.manage;
}
