import { insertRow } from '../db/insertRow';
import type { Repos } from '../db/Repos';

/** Actions written to a project's Logbook. */
export type AuditAction =
  | 'project.create' | 'project.rename'
  | 'member.add' | 'member.role' | 'member.remove'
  | 'invitation.create' | 'invitation.accept' | 'invitation.revoke'
  | 'document.create' | 'document.update' | 'document.delete' | 'run.record'
  | 'change.conflict' | 'upload.create';

export interface AuditInput {
  projectId: string;
  actorId: string | null;
  action: AuditAction;
  target?: string | null;
  detail?: unknown;
}

/** Append one entry inside the caller's transaction, so the log and the change commit together. */
export async function recordAudit(repos: Repos, at: string, entry: AuditInput): Promise<void> {
  await recordAudits(repos, at, [entry]);
}

/** Append several entries inside the caller's transaction with one statement, listed in the order given. */
export async function recordAudits(repos: Repos, at: string, entries: AuditInput[]): Promise<void> {
  await insertRow(repos.audit, entries.map((entry) => ({
    projectId: entry.projectId,
    actorId: entry.actorId,
    action: entry.action,
    target: entry.target ?? null,
    detail: entry.detail === undefined ? null : JSON.stringify(entry.detail),
    at,
  })));
}
