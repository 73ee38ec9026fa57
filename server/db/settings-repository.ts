import { eq } from 'drizzle-orm';
import type { DbLike } from './connection';
import { appSettings } from './schema';

function getSetting(db: DbLike, key: string): string | undefined {
  return db.select().from(appSettings).where(eq(appSettings.key, key)).get()?.value;
}

export function putSettingIfAbsent(db: DbLike, key: string, value: string): string {
  db.insert(appSettings).values({ key, value }).onConflictDoNothing().run();
  return getSetting(db, key)!;
}
