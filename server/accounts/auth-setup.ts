import type { RequestHandler } from 'express';
import { rateLimit } from 'express-rate-limit';
import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { AppError } from '../http/errors';
import type { AccountsService } from './accounts-service';
import type { ThrottleSettings } from './attempt-throttle';

/** One passport instance per app, so two apps in one process never share state. */
export function createPassport(accounts: AccountsService) {
  const p = new passport.Authenticator();
  p.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password', session: true, passReqToCallback: true }, (req, email, password, done) => {
      accounts.authenticate(email, password, req.ip ?? 'unknown').then(
        (user) => done(null, user ?? false),
        (err) => done(err),
      );
    }),
  );
  p.serializeUser((user, done) => done(null, user.id));
  p.deserializeUser((id: number, done) => {
    try {
      done(null, (typeof id === 'number' && accounts.sessionUser(id)) || false);
    } catch (e) {
      done(e);
    }
  });
  return p;
}

/**
 * Sign-in and signature limits (documented in the README under "Production"). Failed password
 * checks of one account from one client address get growing delays (AttemptThrottle); the
 * address as a whole gets a hard limit on failures across all accounts, against guessing many
 * accounts from one place. The owner at another address is never slowed by either.
 */
export interface SignInLimits {
  windowMs: number;
  /** Failed sign-ins allowed per client address in the window, whatever the account. */
  perAddress: number;
  /** Failures of one account from one address (or of one account's signatures) before delays begin. */
  freeFailures: number;
  /** First delay, doubled at each further failure. */
  firstDelayMs: number;
  maxDelayMs: number;
  /** Clock of the delays (tests pass their own). */
  now?: () => number;
}

export function throttleSettings(l: SignInLimits): ThrottleSettings {
  return { freeFailures: l.freeFailures, firstDelayMs: l.firstDelayMs, maxDelayMs: l.maxDelayMs, forgetAfterMs: l.windowMs, now: l.now };
}

/** `perAddress` requests per client address in the window, then 429 `rate_limited` with `message`. */
function addressLimiter(l: SignInLimits, message: string, extra: { skipSuccessfulRequests?: boolean; identifier?: string } = {}): RequestHandler {
  return rateLimit({
    windowMs: l.windowMs,
    limit: l.perAddress,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    ...extra,
    handler: (_req, _res, next) => next(new AppError(429, 'rate_limited', message)),
  });
}

/** Limits failed sign-ins per client address, whatever the account. */
export function signInLimiters(l: SignInLimits): RequestHandler[] {
  return [addressLimiter(l, 'too many failed sign-ins from your address; wait a few minutes and try again', { skipSuccessfulRequests: true, identifier: 'address' })];
}

/** Password-reset requests: a plain per-address limit. */
export function resetLimiter(l: SignInLimits): RequestHandler {
  return addressLimiter(l, 'too many requests; wait a few minutes');
}
