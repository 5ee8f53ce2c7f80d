import { EntitySchema } from 'typeorm';

/** A compressed (gzip) or JSON model payload. Kept in the database, the servers' only shared state. */
export interface UploadRow {
  id: string;
  projectId: string;
  filename: string;
  mediaType: 'application/gzip' | 'application/json';
  bytes: number;
  sha256: string;
  data: Buffer;
  createdBy: string;
  createdAt: string;
}

export const UPLOAD_ENTITY = 'Upload';

/** Binary columns are `blob` in SQLite and `bytea` in PostgreSQL, so this schema is built per driver. */
export function uploadSchema(binaryType: 'blob' | 'bytea'): EntitySchema<UploadRow> {
  return new EntitySchema<UploadRow>({
    name: UPLOAD_ENTITY,
    tableName: 'uploads',
    columns: {
      id: { type: 'varchar', length: 36, primary: true },
      projectId: { type: 'varchar', length: 36 },
      filename: { type: 'varchar', length: 200 },
      mediaType: { type: 'varchar', length: 32 },
      bytes: { type: 'integer' },
      sha256: { type: 'varchar', length: 64 },
      data: { type: binaryType },
      createdBy: { type: 'varchar', length: 36 },
      createdAt: { type: 'varchar', length: 32 },
    },
  });
}
