import { EntitySchema } from 'typeorm';

/**
 * One refresh token, stored as its SHA-256 only. Tokens rotate: each use
 * marks the row used and issues a successor in the same family, so a used
 * token presented again means it was stolen, and the whole family is revoked.
 */
export interface RefreshTokenRow {
  id: string;
  userId: string;
  familyId: string;
  tokenHash: string;
  expiresAt: string;
  createdAt: string;
  usedAt: string | null;
  revokedAt: string | null;
}

export const RefreshTokenSchema = new EntitySchema<RefreshTokenRow>({
  name: 'RefreshToken',
  tableName: 'refresh_tokens',
  columns: {
    id: { type: 'varchar', length: 36, primary: true },
    userId: { type: 'varchar', length: 36 },
    familyId: { type: 'varchar', length: 36 },
    tokenHash: { type: 'varchar', length: 64, unique: true },
    expiresAt: { type: 'varchar', length: 32 },
    createdAt: { type: 'varchar', length: 32 },
    usedAt: { type: 'varchar', length: 32, nullable: true },
    revokedAt: { type: 'varchar', length: 32, nullable: true },
  },
});
