import { EntitySchema } from 'typeorm';
import type { ProjectRole } from '../../../shared/api/types';

export interface MembershipRow {
  id: string;
  projectId: string;
  userId: string;
  role: ProjectRole;
  createdAt: string;
}

export const MembershipSchema = new EntitySchema<MembershipRow>({
  name: 'Membership',
  tableName: 'memberships',
  columns: {
    id: { type: 'varchar', length: 36, primary: true },
    projectId: { type: 'varchar', length: 36 },
    userId: { type: 'varchar', length: 36 },
    role: { type: 'varchar', length: 16 },
    createdAt: { type: 'varchar', length: 32 },
  },
});
