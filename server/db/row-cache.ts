/**
 * Rows kept in memory between reads of a hot path (the session and the user
 * behind it are read on every request). The owner of the rows updates or
 * deletes entries when it writes them; everything is dropped when another
 * connection has committed to the database (SQLite's `PRAGMA data_version`
 * moved, looked at once a second), so a change made by another process or by
 * hand is served stale for a second at most.
 */
export class RowCache<K, V> {
  private readonly rows = new Map<K, V>();
  private seen: number;
  private checkedAt = Date.now();

  constructor(
    private readonly dataVersion: () => number,
    /** How long a change committed elsewhere may go unnoticed. */
    private readonly recheckMs = 1000,
    private readonly capacity = 10_000,
  ) {
    this.seen = dataVersion();
  }

  /** The cached value, or `load()`'s (kept unless it is undefined). */
  get(key: K, load: () => V | undefined): V | undefined {
    const now = Date.now();
    if (now - this.checkedAt >= this.recheckMs) {
      this.checkedAt = now;
      const version = this.dataVersion();
      if (version !== this.seen) {
        this.rows.clear();
        this.seen = version;
      }
    }
    if (this.rows.has(key)) return this.rows.get(key);
    const value = load();
    if (value !== undefined) this.set(key, value);
    return value;
  }

  set(key: K, value: V): void {
    this.rows.delete(key);
    // Oldest first out: Map keeps insertion order.
    if (this.rows.size >= this.capacity) this.rows.delete(this.rows.keys().next().value as K);
    this.rows.set(key, value);
  }

  delete(key: K): void {
    this.rows.delete(key);
  }

  /** Drops every entry that matches (or all of them). */
  clear(matches?: (value: V, key: K) => boolean): void {
    if (!matches) return this.rows.clear();
    for (const [k, v] of this.rows) if (matches(v, k)) this.rows.delete(k);
  }
}
