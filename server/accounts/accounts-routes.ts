import type { Request, RequestHandler } from 'express';
import { z } from 'zod';
import { completeTokenBody, linkToken, passwordResetBody, signInBody } from '../../shared/api/accounts';
import { inviteBody, newUserBody, patchUserBody, roleField, USER_SORTS } from '../../shared/api/user-admin';
import { PLAIN_HTTP_SIGN_IN } from '../config';
import { UnauthenticatedError, ValidationError } from '../http/errors';
import type { SessionUser } from '../http/request-user';
import { userOf, type RouteTable } from '../http/routes';
import { pageQuery, sortQuery, userParams } from '../http/params';
import { parse } from '../http/validate';
import type { AccountsService } from './accounts-service';
import type { createPassport } from './auth-setup';

const tokenQuery = z.strictObject({ token: linkToken });
const usersQuery = z.strictObject({
  q: z.string().max(200).optional(),
  role: roleField.optional(),
  ...sortQuery(USER_SORTS, 'created', 'asc'),
  ...pageQuery(1000, 200),
});

function logIn(req: Request, user: SessionUser): Promise<void> {
  // passport regenerates the session here, so a session id from before sign-in is never reused.
  return new Promise((resolve, reject) => req.logIn(user, (err) => (err ? reject(err) : resolve())));
}

export function accountsRoutes(
  t: RouteTable,
  deps: {
    accounts: AccountsService;
    passport: ReturnType<typeof createPassport>;
    signInLimiters: RequestHandler[];
    resetLimiter: RequestHandler;
    /** Session cookies are Secure: a sign-in that did not come over HTTPS could never keep its session. */
    cookieSecure: boolean;
  },
): void {
  const { accounts, passport } = deps;

  t.add('post', '/api/auth/login', 'public', ...deps.signInLimiters, async (req, res, next) => {
    parse(signInBody, req.body);
    if (deps.cookieSecure && !req.secure) throw new ValidationError(PLAIN_HTTP_SIGN_IN, undefined, 'https_required');
    const user = await new Promise<SessionUser | false>((resolve, reject) =>
      passport.authenticate('local', { session: false }, (err: unknown, u: SessionUser | false) => (err ? reject(err) : resolve(u)))(req, res, next),
    );
    if (!user) throw new UnauthenticatedError('e-mail or password is not correct', 'invalid_credentials');
    await logIn(req, user);
    res.json({ user });
  });

  t.add('post', '/api/auth/logout', 'public', async (req, res) => {
    const user = req.user;
    if (user) accounts.recordSignOut(user.id);
    await new Promise<void>((resolve, reject) => req.logOut((err) => (err ? reject(err) : resolve())));
    await new Promise<void>((resolve) => (req.session ? req.session.destroy(() => resolve()) : resolve()));
    res.clearCookie('dubito.sid', { path: '/' });
    res.status(204).end();
  });

  t.add('get', '/api/me', 'signed-in', (req, res) => {
    res.json(userOf(req));
  });

  t.add('post', '/api/auth/password-reset', 'public', deps.resetLimiter, async (req, res) => {
    const b = parse(passwordResetBody, req.body);
    res.status(202).json({ message: 'if the address belongs to an account, a link is on its way' });
    accounts.requestPasswordReset(b.email);
  });

  t.add('get', '/api/auth/token', 'public', deps.resetLimiter, (req, res) => {
    const q = parse(tokenQuery, req.query);
    res.json(accounts.inspectToken(q.token));
  });

  t.add('post', '/api/auth/password-reset/complete', 'public', deps.resetLimiter, async (req, res) => {
    const b = parse(completeTokenBody, req.body);
    const user = await accounts.completeToken(b.token, b.password);
    res.json({ user });
  });

  t.add('get', '/api/users', 'user.manage', (req, res) => {
    const q = parse(usersQuery, req.query);
    const { rows, total } = accounts.page(q);
    res.set('X-Total-Count', String(total)).json(rows);
  });

  t.add('post', '/api/users', 'user.manage', async (req, res) => {
    const b = parse(newUserBody, req.body);
    res.status(201).json(await accounts.create(userOf(req), b));
  });

  t.add('patch', '/api/users/:id', 'user.manage', (req, res) => {
    const { id } = parse(userParams, req.params);
    const { reason, ...patch } = parse(patchUserBody, req.body);
    res.json(accounts.update(userOf(req), id, patch, reason));
  });

  t.add('post', '/api/invitations', 'user.manage', async (req, res) => {
    const b = parse(inviteBody, req.body);
    res.status(201).json(await accounts.invite(userOf(req), b));
  });
}
