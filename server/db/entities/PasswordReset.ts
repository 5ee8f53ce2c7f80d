import { EntitySchema } from 'typeorm';

/** A one-time, expiring password-reset token, stored as its SHA-256 only. */
export interface PasswordResetRow {
  id: string;
  userId: string;
  tokenHash: string;
  expiresAt: string;
  createdAt: string;
  usedAt: string | null;
}

export const PasswordResetSchema = new EntitySchema<PasswordResetRow>({
  name: 'PasswordReset',
  tableName: 'password_resets',
  columns: {
    id: { type: 'varchar', length: 36, primary: true },
    userId: { type: 'varchar', length: 36 },
    tokenHash: { type: 'varchar', length: 64, unique: true },
    expiresAt: { type: 'varchar', length: 32 },
    createdAt: { type: 'varchar', length: 32 },
    usedAt: { type: 'varchar', length: 32, nullable: true },
  },
});
