import { mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import { DataSource, type DataSourceOptions } from 'typeorm';
import type { ServerConfig } from '../config';
import {
  AuditEntrySchema, ChangeSchema, DocumentSchema, InvitationSchema, MembershipSchema, MetaSchema,
  PasswordResetSchema, ProjectSchema, RefreshTokenSchema, UserSchema, uploadSchema,
} from './entities';
import { migrations } from './migrations';

/**
 * Open the database and bring its schema up to date through the migrations
 * (never `synchronize`). SQLite runs in WAL mode with a busy timeout, so a
 * second process (a backup, the command line) can read while the server writes.
 */
export async function createDataSource(db: ServerConfig['db']): Promise<DataSource> {
  const entities = [
    UserSchema, RefreshTokenSchema, PasswordResetSchema, ProjectSchema, MembershipSchema, InvitationSchema,
    DocumentSchema, ChangeSchema, AuditEntrySchema, MetaSchema, uploadSchema(db.kind === 'postgres' ? 'bytea' : 'blob'),
  ];
  const common = { entities, migrations, migrationsRun: true, synchronize: false, logging: false } as const;
  let options: DataSourceOptions;
  if (db.kind === 'postgres') {
    // Several instances share the database's max_connections (100 by default), so the pool is a setting.
    options = { type: 'postgres', url: db.url, poolSize: db.poolSize, ...common };
  } else {
    mkdirSync(dirname(db.file), { recursive: true });
    options = {
      type: 'better-sqlite3',
      database: db.file,
      enableWAL: true,
      prepareDatabase: (sqlite: { pragma(source: string): unknown }) => {
        sqlite.pragma('busy_timeout = 5000');
      },
      ...common,
    };
  }
  return new DataSource(options).initialize();
}
