import type { AuditEntryView, MemberView, UserView } from '../../shared/api/types';
import type { SyncedDoc } from '../../shared/sync/types';
import type { AuditEntryRow, DocumentRow, MembershipRow, UserRow } from '../db/entities';

/** What the API shows of an account: never the hash. */
export function userView(u: UserRow): UserView {
  return { id: u.id, email: u.email, name: u.name, siteRole: u.siteRole, disabled: u.disabled, createdAt: u.createdAt };
}

export function memberView(m: MembershipRow, u: UserRow): MemberView {
  return { userId: u.id, email: u.email, name: u.name, role: m.role, since: m.createdAt };
}

export function docView(d: DocumentRow): SyncedDoc {
  return {
    docId: d.docId,
    kind: d.kind,
    version: d.version,
    revision: d.revision,
    body: d.body === null ? null : JSON.parse(d.body),
    uploadId: d.uploadId,
    deleted: d.deleted,
    createdBy: d.createdBy,
    updatedBy: d.updatedBy,
    updatedAt: d.updatedAt,
  };
}

export function auditView(a: AuditEntryRow, actorName: string | null): AuditEntryView {
  return {
    id: String(a.seq),
    projectId: a.projectId,
    actorId: a.actorId,
    actorName,
    action: a.action,
    target: a.target,
    detail: a.detail === null ? null : JSON.parse(a.detail),
    at: a.at,
  };
}
