import { TooManyAttemptsError } from '../http/errors';

/** How failed password checks slow down the next attempt of the same key. */
export interface ThrottleSettings {
  /** Failures allowed without any wait. */
  freeFailures: number;
  /** Wait after the first failure beyond the free ones; each further failure doubles it. */
  firstDelayMs: number;
  /** The longest wait. */
  maxDelayMs: number;
  /** A key whose last failure is older than this (plus its wait) starts afresh. */
  forgetAfterMs: number;
  /** Clock in milliseconds (tests pass their own). */
  now?: () => number;
}

interface Failures {
  count: number;
  last: number;
}

/**
 * Growing delays for password checks: after `freeFailures` failures of a key, the next attempt is
 * refused until firstDelay·2^(failures − freeFailures) (capped at maxDelay) has passed since the
 * last failure. A correct password is accepted once the wait is over, so a key is slowed, never
 * locked; a success forgets the key. Usage: `begin(key)` before checking the password,
 * `succeeded(key)` when it was right.
 */
export class AttemptThrottle {
  private readonly failures = new Map<string, Failures>();
  private readonly now: () => number;

  constructor(private readonly s: ThrottleSettings) {
    this.now = s.now ?? Date.now;
  }

  /** The wait still due for a key, in milliseconds (0: it may try now). */
  waitMs(key: string): number {
    const now = this.now();
    const f = this.current(key, now);
    return f ? Math.max(0, f.last + this.delayAfter(f.count) - now) : 0;
  }

  /**
   * Throws TooManyAttemptsError while the key must wait; otherwise counts the attempt as a failure
   * until `succeeded` clears it, so attempts sent in parallel cannot all pass before any fails.
   */
  begin(key: string, what: string): void {
    const wait = this.waitMs(key);
    if (wait > 0) {
      const seconds = Math.ceil(wait / 1000);
      throw new TooManyAttemptsError(`too many failed ${what}; try again in ${seconds} s`, seconds);
    }
    const now = this.now();
    this.prune(now);
    const f = this.current(key, now);
    this.failures.set(key, { count: (f?.count ?? 0) + 1, last: now });
  }

  succeeded(key: string): void {
    this.failures.delete(key);
  }

  private delayAfter(count: number): number {
    if (count < this.s.freeFailures) return 0;
    return Math.min(this.s.firstDelayMs * 2 ** (count - this.s.freeFailures), this.s.maxDelayMs);
  }

  /** The failures of a key, unless they are old enough to be forgotten. */
  private current(key: string, now: number): Failures | undefined {
    const f = this.failures.get(key);
    return f && now - f.last <= this.s.forgetAfterMs + this.delayAfter(f.count) ? f : undefined;
  }

  private prune(now: number): void {
    if (this.failures.size < 10_000) return;
    for (const k of [...this.failures.keys()]) if (!this.current(k, now)) this.failures.delete(k);
  }
}
