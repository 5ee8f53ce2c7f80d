import { In, LessThan } from 'typeorm';
import type { AuditEntryView } from '../../shared/api/types';
import type { Transactor } from '../db/Transactor';
import { auditView } from './views';

/** A project's Logbook, newest first, paged by `before` (an entry id). */
export class AuditService {
  constructor(private readonly tx: Transactor) {}

  list(projectId: string, options: { before?: number; limit: number }): Promise<{ entries: AuditEntryView[]; more: boolean }> {
    return this.tx.read(async (repos) => {
      const rows = await repos.audit.find({
        where: options.before === undefined ? { projectId } : { projectId, seq: LessThan(options.before) },
        order: { seq: 'DESC' },
        take: options.limit + 1,
      });
      const more = rows.length > options.limit;
      const page = more ? rows.slice(0, options.limit) : rows;
      const actorIds = [...new Set(page.flatMap((r) => (r.actorId ? [r.actorId] : [])))];
      const actors = new Map((actorIds.length ? await repos.users.findBy({ id: In(actorIds) }) : []).map((u) => [u.id, u.name]));
      return { entries: page.map((r) => auditView(r, r.actorId ? actors.get(r.actorId) ?? null : null)), more };
    });
  }
}
