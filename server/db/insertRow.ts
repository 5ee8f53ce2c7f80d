import type { InsertQueryBuilder, ObjectLiteral, Repository } from 'typeorm';

/**
 * Insert without reading the row back. TypeORM's `insert` re-selects
 * columns with defaults after every insert on SQLite; on the sync path that
 * is one query per change spent on values the caller already has.
 */
export async function insertRow<T extends ObjectLiteral>(repo: Repository<T>, row: Parameters<InsertQueryBuilder<T>['values']>[0]): Promise<void> {
  await repo.createQueryBuilder().insert().values(row).updateEntity(false).execute();
}
