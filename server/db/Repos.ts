import type { EntityManager, Repository } from 'typeorm';
import {
  AuditEntrySchema, ChangeSchema, DocumentSchema, InvitationSchema, MembershipSchema, MetaSchema,
  PasswordResetSchema, ProjectSchema, RefreshTokenSchema, UPLOAD_ENTITY, UserSchema,
  type AuditEntryRow, type ChangeRow, type DocumentRow, type InvitationRow, type MembershipRow, type MetaRow,
  type PasswordResetRow, type ProjectRow, type RefreshTokenRow, type UploadRow, type UserRow,
} from './entities';

/** The repositories of one unit of work, all bound to the same entity manager (and so the same transaction). */
export interface Repos {
  users: Repository<UserRow>;
  refreshTokens: Repository<RefreshTokenRow>;
  passwordResets: Repository<PasswordResetRow>;
  projects: Repository<ProjectRow>;
  memberships: Repository<MembershipRow>;
  invitations: Repository<InvitationRow>;
  documents: Repository<DocumentRow>;
  changes: Repository<ChangeRow>;
  uploads: Repository<UploadRow>;
  audit: Repository<AuditEntryRow>;
  meta: Repository<MetaRow>;
}

export function reposOf(manager: EntityManager): Repos {
  return {
    users: manager.getRepository(UserSchema),
    refreshTokens: manager.getRepository(RefreshTokenSchema),
    passwordResets: manager.getRepository(PasswordResetSchema),
    projects: manager.getRepository(ProjectSchema),
    memberships: manager.getRepository(MembershipSchema),
    invitations: manager.getRepository(InvitationSchema),
    documents: manager.getRepository(DocumentSchema),
    changes: manager.getRepository(ChangeSchema),
    uploads: manager.getRepository<UploadRow>(UPLOAD_ENTITY),
    audit: manager.getRepository(AuditEntrySchema),
    meta: manager.getRepository(MetaSchema),
  };
}
