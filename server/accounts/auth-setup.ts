import type { RequestHandler } from 'express';
import { rateLimit } from 'express-rate-limit';
import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { AppError } from '../http/errors';
import type { AccountsService } from './accounts-service';

/** One passport instance per app, so two apps in one process never share state. */
export function createPassport(accounts: AccountsService) {
  const p = new passport.Authenticator();
  p.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password', session: true }, (email, password, done) => {
      accounts.authenticate(email, password).then(
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

export interface SignInLimits {
  windowMs: number;
  /** Failed sign-ins allowed per client address in the window. */
  perAddress: number;
  /** Failed sign-ins allowed per account (e-mail) in the window. */
  perAccount: number;
}

function limited(): AppError {
  return new AppError(429, 'rate_limited', 'too many sign-in attempts; wait a few minutes and try again');
}

/** Limits failed sign-ins per client address and per account. */
export function signInLimiters(l: SignInLimits): RequestHandler[] {
  const common = {
    windowMs: l.windowMs,
    standardHeaders: 'draft-8' as const,
    legacyHeaders: false,
    skipSuccessfulRequests: true,
    handler: (_req: unknown, _res: unknown, next: (e: unknown) => void) => next(limited()),
  };
  return [
    rateLimit({ ...common, limit: l.perAddress, identifier: 'address' }),
    rateLimit({
      ...common,
      limit: l.perAccount,
      identifier: 'account',
      keyGenerator: (req) => {
        const email = (req.body as { email?: unknown } | undefined)?.email;
        return `account:${typeof email === 'string' ? email.trim().toLowerCase() : ''}`;
      },
    }),
  ];
}

/** Password-reset requests: a plain per-address limit. */
export function resetLimiter(l: SignInLimits): RequestHandler {
  return rateLimit({
    windowMs: l.windowMs,
    limit: l.perAddress,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) => next(new AppError(429, 'rate_limited', 'too many requests; wait a few minutes')),
  });
}
