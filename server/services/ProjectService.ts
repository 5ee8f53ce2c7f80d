import { randomUUID } from 'node:crypto';
import { In } from 'typeorm';
import type { ProjectView } from '../../shared/api/types';
import type { ProjectRow, UserRow } from '../db/entities';
import type { Transactor } from '../db/Transactor';
import { iso, type Clock } from './clock';
import type { Standing } from './ProjectAccess';
import { recordAudit } from './recordAudit';

export function projectView(p: ProjectRow, role: Standing): ProjectView {
  return { id: p.id, name: p.name, role, revision: p.revision, createdAt: p.createdAt };
}

/** The projects on a user's Desk. */
export class ProjectService {
  constructor(private readonly tx: Transactor, private readonly clock: Clock) {}

  /** Projects the user is a member of; with `all`, a site admin also sees every other project. */
  list(user: UserRow, all: boolean): Promise<ProjectView[]> {
    return this.tx.read(async (repos) => {
      const memberships = await repos.memberships.findBy({ userId: user.id });
      const roles = new Map(memberships.map((m) => [m.projectId, m.role]));
      const projects = all && user.siteRole === 'admin'
        ? await repos.projects.find({ order: { name: 'ASC' } })
        : roles.size
          ? await repos.projects.find({ where: { id: In([...roles.keys()]) }, order: { name: 'ASC' } })
          : [];
      return projects.map((p) => projectView(p, roles.get(p.id) ?? 'admin'));
    });
  }

  /** A new project with its creator as owner. */
  create(user: UserRow, name: string): Promise<ProjectView> {
    return this.tx.write(async (repos) => {
      const now = iso(this.clock());
      const project: ProjectRow = { id: randomUUID(), name, revision: 0, createdBy: user.id, createdAt: now, updatedAt: now };
      await repos.projects.insert(project);
      await repos.memberships.insert({ id: randomUUID(), projectId: project.id, userId: user.id, role: 'owner', createdAt: now });
      await recordAudit(repos, now, { projectId: project.id, actorId: user.id, action: 'project.create', target: name });
      return projectView(project, 'owner');
    });
  }

  rename(user: UserRow, project: ProjectRow, standing: Standing, name: string): Promise<ProjectView> {
    return this.tx.write(async (repos) => {
      const now = iso(this.clock());
      await repos.projects.update({ id: project.id }, { name, updatedAt: now });
      await recordAudit(repos, now, { projectId: project.id, actorId: user.id, action: 'project.rename', target: name, detail: { from: project.name } });
      return projectView({ ...project, name, updatedAt: now }, standing);
    });
  }
}
