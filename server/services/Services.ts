import type { AccessTokens } from '../auth/AccessTokens';
import type { AdminService } from './AdminService';
import type { AuditService } from './AuditService';
import type { AuthService } from './AuthService';
import type { InvitationService } from './InvitationService';
import type { MemberService } from './MemberService';
import type { PasswordResetService } from './PasswordResetService';
import type { ProjectAccess } from './ProjectAccess';
import type { ProjectService } from './ProjectService';
import type { SyncService } from './SyncService';
import type { UploadService } from './UploadService';

/** Everything the routes call. */
export interface Services {
  tokens: AccessTokens;
  auth: AuthService;
  resets: PasswordResetService;
  access: ProjectAccess;
  projects: ProjectService;
  members: MemberService;
  invitations: InvitationService;
  sync: SyncService;
  uploads: UploadService;
  audit: AuditService;
  admin: AdminService;
}
