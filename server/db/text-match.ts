import { sql, type SQL } from 'drizzle-orm';
import type { AnySQLiteColumn } from 'drizzle-orm/sqlite-core';

/** The text as LIKE reads it literally: `%`, `_` and the escape character itself behind a backslash. */
function literal(text: string): string {
  return text.replace(/[\\%_]/g, (c) => `\\${c}`);
}

/** The column holds `text` anywhere (ASCII letters without regard to case, as SQLite's LIKE does); wildcards typed by a user are plain characters. */
export function containsText(column: AnySQLiteColumn, text: string): SQL {
  return sql`${column} LIKE ${`%${literal(text)}%`} ESCAPE '\\'`;
}

/** The column begins with `prefix`, read literally. */
export function startsWithText(column: AnySQLiteColumn, prefix: string): SQL {
  return sql`${column} LIKE ${`${literal(prefix)}%`} ESCAPE '\\'`;
}
