import { EntitySchema } from 'typeorm';
import type { DocKind } from '../../../shared/sync/types';

/** The server's current copy of one synced document (older versions live on in the clients). */
export interface DocumentRow {
  id: string;
  projectId: string;
  docId: string;
  kind: DocKind;
  version: number;
  revision: number;
  /** JSON text of the body, or null when the content is an upload (or the document is deleted). */
  body: string | null;
  uploadId: string | null;
  deleted: boolean;
  /** SHA-256 of the canonical content, to recognise an identical edit. */
  contentHash: string;
  createdBy: string;
  updatedBy: string;
  createdAt: string;
  updatedAt: string;
}

export const DocumentSchema = new EntitySchema<DocumentRow>({
  name: 'Document',
  tableName: 'documents',
  columns: {
    id: { type: 'varchar', length: 36, primary: true },
    projectId: { type: 'varchar', length: 36 },
    docId: { type: 'varchar', length: 128 },
    kind: { type: 'varchar', length: 16 },
    version: { type: 'integer' },
    revision: { type: 'integer' },
    body: { type: 'text', nullable: true },
    uploadId: { type: 'varchar', length: 36, nullable: true },
    deleted: { type: 'boolean', default: false },
    contentHash: { type: 'varchar', length: 64 },
    createdBy: { type: 'varchar', length: 36 },
    updatedBy: { type: 'varchar', length: 36 },
    createdAt: { type: 'varchar', length: 32 },
    updatedAt: { type: 'varchar', length: 32 },
  },
});
