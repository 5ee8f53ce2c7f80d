import { EntitySchema } from 'typeorm';
import type { ConflictReason, DocKind } from '../../../shared/sync/types';

/** The recorded outcome of one pushed change, so a replayed changeId answers the same. */
export interface ChangeRow {
  id: string;
  projectId: string;
  changeId: string;
  docId: string;
  kind: DocKind;
  baseVersion: number;
  outcome: 'accepted' | 'conflict';
  reason: ConflictReason | null;
  /** The document's version after the change (accepted only). */
  version: number | null;
  /** The project revision the change was recorded at (accepted and changed content only). */
  revision: number | null;
  userId: string;
  createdAt: string;
}

export const ChangeSchema = new EntitySchema<ChangeRow>({
  name: 'Change',
  tableName: 'changes',
  columns: {
    id: { type: 'varchar', length: 36, primary: true },
    projectId: { type: 'varchar', length: 36 },
    changeId: { type: 'varchar', length: 128 },
    docId: { type: 'varchar', length: 128 },
    kind: { type: 'varchar', length: 16 },
    baseVersion: { type: 'integer' },
    outcome: { type: 'varchar', length: 16 },
    reason: { type: 'varchar', length: 32, nullable: true },
    version: { type: 'integer', nullable: true },
    revision: { type: 'integer', nullable: true },
    userId: { type: 'varchar', length: 36 },
    createdAt: { type: 'varchar', length: 32 },
  },
});
