import type { DbLike } from './connection';

const cache = new WeakMap<object, Map<string, unknown>>();

/** A prepared query built once per database handle (hot read paths skip query building). */
export function prepared<T>(db: DbLike, key: string, build: () => T): T {
  let m = cache.get(db);
  if (!m) cache.set(db, (m = new Map()));
  let q = m.get(key) as T | undefined;
  if (q === undefined) m.set(key, (q = build()));
  return q;
}
