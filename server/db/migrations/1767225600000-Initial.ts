import { Table, type MigrationInterface, type QueryRunner, type TableColumnOptions } from 'typeorm';

const str = (name: string, length: number, extra: Partial<TableColumnOptions> = {}): TableColumnOptions => ({ name, type: 'varchar', length: String(length), ...extra });
const id = (name = 'id'): TableColumnOptions => str(name, 36, { isPrimary: true });
const ref = (name: string, nullable = false): TableColumnOptions => str(name, 36, { isNullable: nullable });
const stamp = (name: string, nullable = false): TableColumnOptions => str(name, 32, { isNullable: nullable });
const int = (name: string, extra: Partial<TableColumnOptions> = {}): TableColumnOptions => ({ name, type: 'integer', ...extra });
const fk = (column: string, table: string) => ({ columnNames: [column], referencedTableName: table, referencedColumnNames: ['id'], onDelete: 'CASCADE' });

/**
 * The first schema: accounts, projects and access, sync, uploads and the
 * audit trail. Written with the QueryRunner's table API so the same
 * migration runs on SQLite and PostgreSQL.
 */
export class Initial1767225600000 implements MigrationInterface {
  name = 'Initial1767225600000';

  async up(q: QueryRunner): Promise<void> {
    const binary = q.connection.driver.options.type === 'postgres' ? 'bytea' : 'blob';
    await q.createTable(new Table({
      name: 'users',
      columns: [id(), str('email', 254, { isUnique: true }), str('name', 100), str('passwordHash', 100), str('siteRole', 16),
        { name: 'disabled', type: 'boolean', default: false }, stamp('createdAt'), stamp('updatedAt')],
    }));
    await q.createTable(new Table({
      name: 'refresh_tokens',
      columns: [id(), ref('userId'), ref('familyId'), str('tokenHash', 64, { isUnique: true }), stamp('expiresAt'), stamp('createdAt'), stamp('usedAt', true), stamp('revokedAt', true)],
      foreignKeys: [fk('userId', 'users')],
      indices: [{ name: 'IDX_refresh_family', columnNames: ['familyId'] }, { name: 'IDX_refresh_user', columnNames: ['userId'] }],
    }));
    await q.createTable(new Table({
      name: 'password_resets',
      columns: [id(), ref('userId'), str('tokenHash', 64, { isUnique: true }), stamp('expiresAt'), stamp('createdAt'), stamp('usedAt', true)],
      foreignKeys: [fk('userId', 'users')],
      indices: [{ name: 'IDX_reset_user', columnNames: ['userId'] }],
    }));
    await q.createTable(new Table({
      name: 'projects',
      columns: [id(), str('name', 200), int('revision', { default: 0 }), ref('createdBy'), stamp('createdAt'), stamp('updatedAt')],
    }));
    await q.createTable(new Table({
      name: 'memberships',
      columns: [id(), ref('projectId'), ref('userId'), str('role', 16), stamp('createdAt')],
      foreignKeys: [fk('projectId', 'projects'), fk('userId', 'users')],
      indices: [{ name: 'IDX_membership_project_user', columnNames: ['projectId', 'userId'], isUnique: true }, { name: 'IDX_membership_user', columnNames: ['userId'] }],
    }));
    await q.createTable(new Table({
      name: 'invitations',
      columns: [id(), ref('projectId'), str('email', 254), str('role', 16), str('tokenHash', 64, { isUnique: true }), ref('invitedBy'),
        stamp('expiresAt'), stamp('createdAt'), stamp('acceptedAt', true), ref('acceptedBy', true), stamp('revokedAt', true)],
      foreignKeys: [fk('projectId', 'projects')],
      indices: [{ name: 'IDX_invitation_project', columnNames: ['projectId'] }],
    }));
    await q.createTable(new Table({
      name: 'uploads',
      columns: [id(), ref('projectId'), str('filename', 200), str('mediaType', 32), int('bytes'), str('sha256', 64), { name: 'data', type: binary }, ref('createdBy'), stamp('createdAt')],
      foreignKeys: [fk('projectId', 'projects')],
      indices: [{ name: 'IDX_upload_project', columnNames: ['projectId'] }],
    }));
    await q.createTable(new Table({
      name: 'documents',
      columns: [id(), ref('projectId'), str('docId', 128), str('kind', 16), int('version'), int('revision'), { name: 'body', type: 'text', isNullable: true },
        ref('uploadId', true), { name: 'deleted', type: 'boolean', default: false }, str('contentHash', 64), ref('createdBy'), ref('updatedBy'), stamp('createdAt'), stamp('updatedAt')],
      foreignKeys: [fk('projectId', 'projects')],
      indices: [{ name: 'IDX_document_project_doc', columnNames: ['projectId', 'docId'], isUnique: true }, { name: 'IDX_document_project_revision', columnNames: ['projectId', 'revision'] }],
    }));
    await q.createTable(new Table({
      name: 'changes',
      columns: [id(), ref('projectId'), str('changeId', 128), str('docId', 128), str('kind', 16), int('baseVersion'), str('outcome', 16), str('reason', 32, { isNullable: true }),
        int('version', { isNullable: true }), int('revision', { isNullable: true }), ref('userId'), stamp('createdAt')],
      foreignKeys: [fk('projectId', 'projects')],
      indices: [{ name: 'IDX_change_project_change', columnNames: ['projectId', 'changeId'], isUnique: true }],
    }));
    await q.createTable(new Table({
      name: 'audit_entries',
      columns: [int('seq', { isPrimary: true, isGenerated: true, generationStrategy: 'increment' }), ref('projectId'), ref('actorId', true), str('action', 40),
        str('target', 200, { isNullable: true }), { name: 'detail', type: 'text', isNullable: true }, stamp('at')],
      foreignKeys: [fk('projectId', 'projects')],
      indices: [{ name: 'IDX_audit_project_seq', columnNames: ['projectId', 'seq'] }],
    }));
    await q.createTable(new Table({ name: 'meta', columns: [str('key', 64, { isPrimary: true }), { name: 'value', type: 'text' }] }));
  }

  async down(q: QueryRunner): Promise<void> {
    for (const table of ['meta', 'audit_entries', 'changes', 'documents', 'uploads', 'invitations', 'memberships', 'projects', 'password_resets', 'refresh_tokens', 'users']) {
      await q.dropTable(table);
    }
  }
}
