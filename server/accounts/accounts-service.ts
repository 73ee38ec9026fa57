import type { InvitationResponse, TokenInfo, UserAccount } from '../../shared/api/accounts';
import type { Role } from '../../shared/policy/policy';
import type { AuditService } from '../audit/audit-service';
import { inTransaction, type Db } from '../db/connection';
import { RowCache } from '../db/row-cache';
import { ConflictError, NotFoundError, ValidationError } from '../http/errors';
import type { SessionUser } from '../http/request-user';
import type { MailService } from '../mail/mail-service';
import {
  countUsers,
  pageUsers,
  type UserFilter,
  activeUsersWithRole,
  findUnusedToken,
  findUserByEmail,
  findUserById,
  insertToken,
  insertUser,
  listUsers,
  markTokenUsed,
  retireTokens,
  updateUser,
  type UserRow,
} from './accounts-repository';
import { AttemptThrottle, type ThrottleSettings } from './attempt-throttle';
import { hashPassword, hashToken, newToken, verifyPassword } from './password';
import { passwordProblem } from './password-strength';

const HOUR = 60 * 60 * 1000;

type PublicUser = UserAccount;

function toSessionUser(u: UserRow): SessionUser {
  return { id: u.id, email: u.email, name: u.name, role: u.role };
}

function toPublic(u: UserRow): PublicUser {
  return { ...toSessionUser(u), active: u.active, hasPassword: !!u.passwordHash, createdAt: u.createdAt };
}

function checkPassword(password: string, person?: { email: string; name: string }): void {
  const problem = passwordProblem(password, person);
  if (problem) throw new ValidationError(problem, 'password', 'weak_password');
}

/** Where an approval signature was asked for, for the audit trail of a rejected one. */
export interface SignatureContext {
  budgetId?: number;
  versionNumber?: number;
}

export interface AccountsDeps {
  db: Db;
  audit: AuditService;
  mail: MailService;
  publicUrl: string;
  endSessionsOf(userId: number): void;
  /** See Connection.dataVersion: lets the session-user cache notice changes made elsewhere. */
  dataVersion(): number;
  invitationHours: number;
  resetHours: number;
  /** Growing delays after failed sign-ins (per account and address) and failed signatures (per account). */
  passwordAttempts: ThrottleSettings;
  log: (msg: string, err?: unknown) => void;
}

export class AccountsService {
  /** The user behind each session id, read on every request; emptied whenever this service writes a user. */
  private readonly sessionUsers: RowCache<number, SessionUser | null>;

  /** Failed password checks, keyed by what they try to open (see passwordAttempts). */
  private readonly attempts: AttemptThrottle;

  constructor(private readonly d: AccountsDeps) {
    this.sessionUsers = new RowCache(d.dataVersion);
    this.attempts = new AttemptThrottle(d.passwordAttempts);
  }

  /**
   * The same answer (null) for an unknown address, a wrong password, an inactive account.
   * Failures slow down the next attempt on the same account from the same client address only,
   * so failures elsewhere never keep the owner out.
   */
  async authenticate(email: string, password: string, clientAddress: string): Promise<SessionUser | null> {
    const key = `sign-in:${email.trim().toLowerCase()}|${clientAddress}`;
    this.attempts.begin(key, 'sign-ins for this account from your address');
    const user = findUserByEmail(this.d.db, email);
    const ok = await verifyPassword(password, user?.passwordHash);
    if (!user || !ok || !user.active) {
      inTransaction(this.d.db, (tx) => this.d.audit.record(tx, { actorId: user?.id ?? null, action: 'auth.sign_in_refused', detail: { email: email.toLowerCase(), address: clientAddress } }));
      return null;
    }
    this.attempts.succeeded(key);
    inTransaction(this.d.db, (tx) => this.d.audit.record(tx, { actorId: user.id, action: 'auth.signed_in', detail: { address: clientAddress } }));
    return toSessionUser(user);
  }

  recordSignOut(userId: number): void {
    inTransaction(this.d.db, (tx) => this.d.audit.record(tx, { actorId: userId, action: 'auth.signed_out' }));
  }

  /** The user behind a session, or null when gone or deactivated. */
  sessionUser(id: number): SessionUser | null {
    return (
      this.sessionUsers.get(id, () => {
        const u = findUserById(this.d.db, id);
        return u && u.active ? Object.freeze(toSessionUser(u)) : null;
      }) ?? null
    );
  }

  /**
   * Re-entered password as an electronic signature. Failures slow down the account's next
   * signatures like failed sign-ins, and every rejected signature is written to the audit trail.
   */
  async verifySignature(userId: number, password: string, context: SignatureContext = {}): Promise<boolean> {
    const key = `signature:${userId}`;
    this.attempts.begin(key, 'signatures');
    const u = findUserById(this.d.db, userId);
    const ok = (await verifyPassword(password, u?.passwordHash)) && !!u?.active;
    if (ok) {
      this.attempts.succeeded(key);
      return true;
    }
    inTransaction(this.d.db, (tx) =>
      this.d.audit.record(tx, {
        actorId: userId,
        action: 'auth.signature_rejected',
        budgetId: context.budgetId ?? null,
        versionNumber: context.versionNumber ?? null,
        detail: { reason: 'the password did not match' },
      }),
    );
    return false;
  }

  list(): PublicUser[] {
    return listUsers(this.d.db).map(toPublic);
  }

  /** One page of the users, sorted and filtered by the database, and how many match in all. */
  page(filter: UserFilter): { rows: PublicUser[]; total: number } {
    return { rows: pageUsers(this.d.db, filter).map(toPublic), total: countUsers(this.d.db, filter) };
  }

  reviewersExcept(userId: number): SessionUser[] {
    return activeUsersWithRole(this.d.db, ['reviewer'])
      .filter((u) => u.id !== userId)
      .map(toSessionUser);
  }

  userById(id: number): SessionUser | null {
    const u = findUserById(this.d.db, id);
    return u ? toSessionUser(u) : null;
  }

  /**
   * Creates an account. A password chosen through the API (an actor is given) must pass
   * passwordProblem; accounts the system seeds itself (actor null: the demo lab) are taken as given.
   */
  async create(actor: SessionUser | null, input: { email: string; name: string; role: Role; password?: string }): Promise<PublicUser> {
    if (input.password !== undefined && actor) checkPassword(input.password, input);
    const hash = input.password !== undefined ? await hashPassword(input.password) : null;
    return inTransaction(this.d.db, (tx) => {
      if (findUserByEmail(tx, input.email)) throw new ConflictError('a user with this e-mail address exists', 'email_taken');
      const u = insertUser(tx, { email: input.email, name: input.name, role: input.role, passwordHash: hash });
      this.d.audit.record(tx, { actorId: actor?.id ?? null, action: 'user.created', detail: { userId: u.id, email: u.email, role: u.role } });
      this.sessionUsers.delete(u.id);
      return toPublic(u);
    });
  }

  /** Changes a user; the reason (required by the route for a role change or a deactivation) goes into the audit trail with the change. */
  update(actor: SessionUser, id: number, patch: { name?: string; role?: Role; active?: boolean }, reason?: string): PublicUser {
    const updated = inTransaction(this.d.db, (tx) => {
      const before = findUserById(tx, id);
      if (!before) throw new NotFoundError('no such user');
      if (id === actor.id && ((patch.role && patch.role !== 'admin') || patch.active === false)) {
        throw new ConflictError('you cannot demote or deactivate your own account', 'self_lockout');
      }
      const fields = Object.fromEntries(Object.entries(patch).filter(([, v]) => v !== undefined));
      const after = Object.keys(fields).length ? updateUser(tx, id, fields)! : before;
      const changes: Record<string, { from: unknown; to: unknown }> = {};
      for (const k of ['name', 'role', 'active'] as const) {
        if (patch[k] !== undefined && before[k] !== after[k]) changes[k] = { from: before[k], to: after[k] };
      }
      this.d.audit.record(tx, { actorId: actor.id, action: 'user.updated', detail: { userId: id, changes, ...(reason ? { reason } : {}) } });
      return after;
    });
    this.sessionUsers.delete(id);
    if (patch.active === false || patch.role !== undefined) this.d.endSessionsOf(id);
    return toPublic(updated);
  }

  /** Creates the account without a password and mails a one-time link to set it. */
  async invite(actor: SessionUser, input: { email: string; name: string; role: Role }): Promise<InvitationResponse> {
    const { token, hash } = newToken();
    const expiresAt = Date.now() + this.d.invitationHours * HOUR;
    const user = inTransaction(this.d.db, (tx) => {
      let u = findUserByEmail(tx, input.email);
      if (u?.passwordHash) throw new ConflictError('this person already has an account', 'email_taken');
      if (!u) u = insertUser(tx, { email: input.email, name: input.name, role: input.role, passwordHash: null });
      this.sessionUsers.delete(u.id);
      retireTokens(tx, u.id);
      insertToken(tx, { kind: 'invitation', userId: u.id, tokenHash: hash, expiresAt });
      this.d.audit.record(tx, { actorId: actor.id, action: 'user.invited', detail: { userId: u.id, email: u.email, role: u.role } });
      return u;
    });
    const link = `${this.d.publicUrl}/set-password?token=${token}`;
    await this.d.mail.send({
      to: [user.email],
      subject: 'Your Dubito account',
      text: `Hello ${user.name},\n\n${actor.name} has invited you to Dubito as ${user.role}.\n` + `Choose your password here (the link works once, for ${this.d.invitationHours} hours):\n\n${link}\n`,
    });
    return { user: toPublic(user), expiresAt };
  }

  /**
   * Always succeeds from the caller's view and does its work only after the caller has answered
   * (next turn of the event loop), so neither the answer nor its timing says which addresses exist.
   */
  requestPasswordReset(email: string): void {
    setImmediate(() => {
      try {
        this.issuePasswordReset(email);
      } catch (e) {
        this.d.log('password reset request failed', e);
      }
    });
  }

  private issuePasswordReset(email: string): void {
    const u = findUserByEmail(this.d.db, email);
    if (!u || !u.active || !u.passwordHash) return;
    const { token, hash } = newToken();
    inTransaction(this.d.db, (tx) => {
      retireTokens(tx, u.id);
      insertToken(tx, { kind: 'password_reset', userId: u.id, tokenHash: hash, expiresAt: Date.now() + this.d.resetHours * HOUR });
      this.d.audit.record(tx, { actorId: u.id, action: 'user.password_reset_requested' });
    });
    const link = `${this.d.publicUrl}/reset-password?token=${token}`;
    this.d.mail.notify({
      to: [u.email],
      subject: 'Reset your Dubito password',
      text:
        `Hello ${u.name},\n\nSomeone (hopefully you) asked to reset your Dubito password.\n` +
        `Choose a new one here (the link works once, for ${this.d.resetHours} hours):\n\n${link}\n\n` +
        `If you did not ask for this, ignore this message; your password stays as it is.\n`,
    });
  }

  /** What a link is for, without using it. */
  inspectToken(token: string): TokenInfo {
    const { kind, email, name } = this.tokenHolder(token);
    return { kind, email, name };
  }

  private tokenHolder(token: string): TokenInfo {
    const t = findUnusedToken(this.d.db, hashToken(token));
    const u = t && t.expiresAt > Date.now() ? findUserById(this.d.db, t.userId) : undefined;
    if (!t || !u || !u.active) throw new NotFoundError('this link is invalid, used or expired', 'invalid_token');
    return { kind: t.kind, email: u.email, name: u.name };
  }

  /** Sets the password from an invitation or reset link; the link is then spent. */
  async completeToken(token: string, password: string): Promise<SessionUser> {
    // The rules that need no account first, so a weak password is named even on a spent link.
    checkPassword(password);
    checkPassword(password, this.tokenHolder(token));
    const hash = await hashPassword(password);
    const user = inTransaction(this.d.db, (tx) => {
      const t = findUnusedToken(tx, hashToken(token));
      const u = t && t.expiresAt > Date.now() ? findUserById(tx, t.userId) : undefined;
      if (!t || !u || !u.active) throw new NotFoundError('this link is invalid, used or expired', 'invalid_token');
      markTokenUsed(tx, t.id);
      const after = updateUser(tx, u.id, { passwordHash: hash })!;
      this.d.audit.record(tx, { actorId: u.id, action: 'user.password_set', detail: { via: t.kind } });
      return after;
    });
    this.sessionUsers.delete(user.id);
    this.d.endSessionsOf(user.id);
    return toSessionUser(user);
  }
}
