/**
 * Request and response bodies of the team server's API (besides sync,
 * which lives in `shared/sync`). Every error answers `{error: string}`.
 */

export type SiteRole = 'admin' | 'member';
export type ProjectRole = 'owner' | 'editor' | 'viewer';
export const PROJECT_ROLES: readonly ProjectRole[] = ['owner', 'editor', 'viewer'];

export interface ApiError {
  error: string;
}

export interface UserView {
  id: string;
  email: string;
  name: string;
  siteRole: SiteRole;
  disabled: boolean;
  createdAt: string;
}

/** register, login, refresh and accepting an invitation as a new user answer this. */
export interface AuthResponse {
  user: UserView;
  /** Short-lived JWT for `Authorization: Bearer …`. */
  accessToken: string;
  /** One-time: `POST /api/auth/refresh` with it returns a new pair and retires it. */
  refreshToken: string;
  /** Seconds until the access token expires. */
  expiresIn: number;
}

export interface ProjectView {
  id: string;
  name: string;
  /** Your role; `admin` where a site admin sees a project without being a member. */
  role: ProjectRole | 'admin';
  revision: number;
  createdAt: string;
}

export interface MemberView {
  userId: string;
  email: string;
  name: string;
  role: ProjectRole;
  since: string;
}

export interface InvitationView {
  id: string;
  email: string;
  role: ProjectRole;
  expiresAt: string;
  invitedBy: string;
}

export interface MembersResponse {
  members: MemberView[];
  /** Pending invitations; only owners and admins see them. */
  invitations: InvitationView[];
}

/** `POST /api/projects/:id/members`: 201 `{member}` for an existing account, 202 `{invitation, mailed}` otherwise. */
export interface AddMemberResponse {
  member?: MemberView;
  invitation?: InvitationView;
  mailed?: boolean;
}

/** What the invitation link's page shows before accepting. */
export interface InvitationPreview {
  projectName: string;
  email: string;
  role: ProjectRole;
  invitedBy: string;
  expiresAt: string;
  /** Whether an account with the invited e-mail exists (then sign in and accept). */
  hasAccount: boolean;
}

export interface AuditEntryView {
  id: string;
  projectId: string;
  actorId: string | null;
  actorName: string | null;
  action: string;
  target: string | null;
  detail: unknown;
  at: string;
}

export interface UploadView {
  id: string;
  projectId: string;
  filename: string;
  mediaType: 'application/gzip' | 'application/json';
  bytes: number;
  sha256: string;
  createdAt: string;
}

export interface MailroomMessage {
  id: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  receivedAt: string;
}
