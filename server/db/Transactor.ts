import type { DataSource } from 'typeorm';
import { reposOf, type Repos } from './Repos';

/** How services reach the database: every write in one transaction, every read consistent. */
export interface Transactor {
  read<T>(work: (repos: Repos) => Promise<T>): Promise<T>;
  write<T>(work: (repos: Repos) => Promise<T>): Promise<T>;
}

/**
 * TypeORM's better-sqlite3 driver has one connection and one query runner
 * for everything, so two transactions started from concurrent requests
 * would interleave on it (the second becoming a savepoint inside the first,
 * a rollback of either taking the other's work along). On SQLite every unit
 * of work therefore takes its turn through one queue; the statements are
 * synchronous and fast, and slow work (bcrypt, mail) stays outside. On
 * PostgreSQL the pool gives each transaction its own connection and the
 * database does the isolating, so no queue is used.
 */
export class DataSourceTransactor implements Transactor {
  private tail: Promise<unknown> = Promise.resolve();
  private readonly serial: boolean;

  constructor(private readonly dataSource: DataSource) {
    this.serial = dataSource.options.type === 'better-sqlite3';
  }

  read<T>(work: (repos: Repos) => Promise<T>): Promise<T> {
    return this.turn(() => work(reposOf(this.dataSource.manager)));
  }

  write<T>(work: (repos: Repos) => Promise<T>): Promise<T> {
    return this.turn(() => this.dataSource.transaction((manager) => work(reposOf(manager))));
  }

  /** Wait for every unit of work already queued. */
  async drain(): Promise<void> {
    await this.turn(async () => undefined);
  }

  private turn<T>(work: () => Promise<T>): Promise<T> {
    if (!this.serial) return work();
    const result = this.tail.then(work);
    this.tail = result.catch(() => undefined);
    return result;
  }
}
