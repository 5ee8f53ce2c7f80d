import { EntitySchema } from 'typeorm';
import type { SiteRole } from '../../../shared/api/types';

export interface UserRow {
  id: string;
  /** Lower-cased and trimmed; unique. */
  email: string;
  name: string;
  passwordHash: string;
  siteRole: SiteRole;
  disabled: boolean;
  createdAt: string;
  updatedAt: string;
}

export const UserSchema = new EntitySchema<UserRow>({
  name: 'User',
  tableName: 'users',
  columns: {
    id: { type: 'varchar', length: 36, primary: true },
    email: { type: 'varchar', length: 254, unique: true },
    name: { type: 'varchar', length: 100 },
    passwordHash: { type: 'varchar', length: 100 },
    siteRole: { type: 'varchar', length: 16 },
    disabled: { type: 'boolean', default: false },
    createdAt: { type: 'varchar', length: 32 },
    updatedAt: { type: 'varchar', length: 32 },
  },
});
