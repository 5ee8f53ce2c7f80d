import { EntitySchema } from 'typeorm';
import type { ProjectRole } from '../../../shared/api/types';

/** An e-mailed invitation to a project; the one-time token is stored as its SHA-256 only. */
export interface InvitationRow {
  id: string;
  projectId: string;
  email: string;
  role: ProjectRole;
  tokenHash: string;
  invitedBy: string;
  expiresAt: string;
  createdAt: string;
  acceptedAt: string | null;
  acceptedBy: string | null;
  revokedAt: string | null;
}

export const InvitationSchema = new EntitySchema<InvitationRow>({
  name: 'Invitation',
  tableName: 'invitations',
  columns: {
    id: { type: 'varchar', length: 36, primary: true },
    projectId: { type: 'varchar', length: 36 },
    email: { type: 'varchar', length: 254 },
    role: { type: 'varchar', length: 16 },
    tokenHash: { type: 'varchar', length: 64, unique: true },
    invitedBy: { type: 'varchar', length: 36 },
    expiresAt: { type: 'varchar', length: 32 },
    createdAt: { type: 'varchar', length: 32 },
    acceptedAt: { type: 'varchar', length: 32, nullable: true },
    acceptedBy: { type: 'varchar', length: 36, nullable: true },
    revokedAt: { type: 'varchar', length: 32, nullable: true },
  },
});
