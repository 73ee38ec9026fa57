import { mkdirSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import Database from 'better-sqlite3';
import { drizzle, type BetterSQLite3Database } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import type { BaseSQLiteDatabase } from 'drizzle-orm/sqlite-core';
import type { RunResult } from 'better-sqlite3';
import { projectRoot } from '../project-root';
import * as schema from './schema';

type Schema = typeof schema;
export type Db = BetterSQLite3Database<Schema>;
/** The database or an open transaction: what repositories work on. */
export type DbLike = BaseSQLiteDatabase<'sync', RunResult, Schema>;

export interface Connection {
  db: Db;
  sqlite: Database.Database;
  /** SQLite's `PRAGMA data_version`: changes when another connection commits. */
  dataVersion(): number;
  close(): void;
}

const MIGRATIONS = join(projectRoot(import.meta.url), 'drizzle');

/** Opens (creating if needed) the SQLite file, sets WAL and foreign keys, applies the migrations. */
export function openDatabase(file: string): Connection {
  if (file !== ':memory:') mkdirSync(dirname(resolve(file)), { recursive: true });
  const sqlite = new Database(file);
  sqlite.pragma('journal_mode = WAL');
  sqlite.pragma('synchronous = FULL');
  sqlite.pragma('foreign_keys = ON');
  sqlite.pragma('busy_timeout = 5000');
  const db = drizzle({ client: sqlite, schema });
  migrate(db, { migrationsFolder: MIGRATIONS });
  const dataVersion = sqlite.prepare('PRAGMA data_version').pluck();
  return {
    db,
    sqlite,
    dataVersion: () => dataVersion.get() as number,
    close: () => {
      if (sqlite.open) sqlite.close();
    },
  };
}

/** Runs `fn` in one IMMEDIATE transaction: everything it writes commits together or not at all. */
export function inTransaction<T>(db: Db, fn: (tx: DbLike) => T): T {
  return db.transaction((tx) => fn(tx), { behavior: 'immediate' });
}
