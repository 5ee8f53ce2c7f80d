import { EntitySchema } from 'typeorm';

/** One line of a project's Logbook. `seq` orders entries and pages through them. */
export interface AuditEntryRow {
  seq: number;
  projectId: string;
  actorId: string | null;
  action: string;
  target: string | null;
  /** JSON text */
  detail: string | null;
  at: string;
}

export const AuditEntrySchema = new EntitySchema<AuditEntryRow>({
  name: 'AuditEntry',
  tableName: 'audit_entries',
  columns: {
    seq: { type: 'integer', primary: true, generated: 'increment' },
    projectId: { type: 'varchar', length: 36 },
    actorId: { type: 'varchar', length: 36, nullable: true },
    action: { type: 'varchar', length: 40 },
    target: { type: 'varchar', length: 200, nullable: true },
    detail: { type: 'text', nullable: true },
    at: { type: 'varchar', length: 32 },
  },
});
