import { afterEach, describe, expect, it, vi } from 'vitest';
import { RowCache } from '../../server/db/row-cache';

afterEach(() => {
  vi.useRealTimers();
});

describe('RowCache', () => {
  it('loads a row once and serves it until its owner changes or drops it', () => {
    const cache = new RowCache<number, string>(() => 1);
    const load = vi.fn((): string | undefined => 'Ada');
    expect(cache.get(7, load)).toBe('Ada');
    expect(cache.get(7, load)).toBe('Ada');
    expect(load).toHaveBeenCalledTimes(1);
    cache.set(7, 'Ada L.');
    expect(cache.get(7, load)).toBe('Ada L.');
    cache.delete(7);
    expect(cache.get(7, load)).toBe('Ada');
    expect(load).toHaveBeenCalledTimes(2);
  });

  it('does not keep misses', () => {
    const cache = new RowCache<string, string>(() => 1);
    const load = vi.fn((): string | undefined => undefined);
    expect(cache.get('nobody', load)).toBeUndefined();
    expect(cache.get('nobody', load)).toBeUndefined();
    expect(load).toHaveBeenCalledTimes(2);
  });

  it('drops everything when another connection has committed, noticed within the recheck interval', () => {
    vi.useFakeTimers();
    let version = 1;
    const cache = new RowCache<number, string>(() => version, 1000);
    const load = vi.fn((): string | undefined => `v${version}`);
    expect(cache.get(1, load)).toBe('v1');
    version = 2;
    vi.advanceTimersByTime(999);
    expect(cache.get(1, load)).toBe('v1');
    vi.advanceTimersByTime(1);
    expect(cache.get(1, load)).toBe('v2');
    expect(load).toHaveBeenCalledTimes(2);
  });

  it('clears the entries that match, and evicts the oldest beyond its capacity', () => {
    const cache = new RowCache<number, number>(() => 1, 1000, 3);
    const load = vi.fn((k: number) => k * 10);
    for (const k of [1, 2, 3]) cache.get(k, () => load(k));
    cache.clear((v) => v === 20);
    cache.get(2, () => load(2));
    expect(load).toHaveBeenCalledTimes(4);
    cache.get(4, () => load(4)); // capacity 3: 1 goes
    cache.get(3, () => load(3));
    cache.get(1, () => load(1));
    expect(load.mock.calls.map(([k]) => k)).toEqual([1, 2, 3, 2, 4, 1]);
  });
});
