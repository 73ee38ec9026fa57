import type { InvitationResponse, TokenInfo, UserAccount } from '../../shared/api/accounts';
import type { Role } from '../../shared/policy/policy';
import { recordAudit } from '../audit/audit-repository';
import { inTransaction, type Db } from '../db/connection';
import { RowCache } from '../db/row-cache';
import { ConflictError, NotFoundError, ValidationError } from '../http/errors';
import type { SessionUser } from '../http/request-user';
import type { MailService } from '../mail/mail-service';
import {
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
import { hashPassword, hashToken, newToken, verifyPassword } from './password';

export const MIN_PASSWORD = 10;
const HOUR = 60 * 60 * 1000;

type PublicUser = UserAccount;

export function toSessionUser(u: UserRow): SessionUser {
  return { id: u.id, email: u.email, name: u.name, role: u.role };
}

function toPublic(u: UserRow): PublicUser {
  return { ...toSessionUser(u), active: u.active, hasPassword: !!u.passwordHash, createdAt: u.createdAt };
}

function checkPassword(password: string): void {
  if (password.length < MIN_PASSWORD) {
    throw new ValidationError(`password must have at least ${MIN_PASSWORD} characters`, 'password');
  }
}

export interface AccountsDeps {
  db: Db;
  mail: MailService;
  publicUrl: string;
  endSessionsOf(userId: number): void;
  /** See Connection.dataVersion: lets the session-user cache notice changes made elsewhere. */
  dataVersion(): number;
  invitationHours: number;
  resetHours: number;
}

export class AccountsService {
  /** The user behind each session id, read on every request; emptied whenever this service writes a user. */
  private readonly sessionUsers: RowCache<number, SessionUser | null>;

  constructor(private readonly d: AccountsDeps) {
    this.sessionUsers = new RowCache(d.dataVersion);
  }

  /** The same answer (null) for an unknown address, a wrong password, an inactive account. */
  async authenticate(email: string, password: string): Promise<SessionUser | null> {
    const user = findUserByEmail(this.d.db, email);
    const ok = await verifyPassword(password, user?.passwordHash);
    if (!user || !ok || !user.active) {
      inTransaction(this.d.db, (tx) =>
        recordAudit(tx, { actorId: user?.id ?? null, action: 'auth.sign_in_refused', detail: { email: email.toLowerCase() } }),
      );
      return null;
    }
    inTransaction(this.d.db, (tx) => recordAudit(tx, { actorId: user.id, action: 'auth.signed_in' }));
    return toSessionUser(user);
  }

  recordSignOut(userId: number): void {
    inTransaction(this.d.db, (tx) => recordAudit(tx, { actorId: userId, action: 'auth.signed_out' }));
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

  /** Re-entered password as an electronic signature. */
  async verifySignature(userId: number, password: string): Promise<boolean> {
    const u = findUserById(this.d.db, userId);
    return (await verifyPassword(password, u?.passwordHash)) && !!u?.active;
  }

  list(): PublicUser[] {
    return listUsers(this.d.db).map(toPublic);
  }

  reviewersExcept(userId: number): SessionUser[] {
    return activeUsersWithRole(this.d.db, ['reviewer']).filter((u) => u.id !== userId).map(toSessionUser);
  }

  userById(id: number): SessionUser | null {
    const u = findUserById(this.d.db, id);
    return u ? toSessionUser(u) : null;
  }

  async create(actor: SessionUser | null, input: { email: string; name: string; role: Role; password?: string }): Promise<PublicUser> {
    if (input.password !== undefined) checkPassword(input.password);
    const hash = input.password !== undefined ? await hashPassword(input.password) : null;
    return inTransaction(this.d.db, (tx) => {
      if (findUserByEmail(tx, input.email)) throw new ConflictError('a user with this e-mail address exists', 'email_taken');
      const u = insertUser(tx, { email: input.email, name: input.name, role: input.role, passwordHash: hash });
      recordAudit(tx, { actorId: actor?.id ?? null, action: 'user.created', detail: { userId: u.id, email: u.email, role: u.role } });
      this.sessionUsers.delete(u.id);
      return toPublic(u);
    });
  }

  update(actor: SessionUser, id: number, patch: { name?: string; role?: Role; active?: boolean }): PublicUser {
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
      recordAudit(tx, { actorId: actor.id, action: 'user.updated', detail: { userId: id, changes } });
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
      recordAudit(tx, { actorId: actor.id, action: 'user.invited', detail: { userId: u.id, email: u.email, role: u.role } });
      return u;
    });
    const link = `${this.d.publicUrl}/set-password?token=${token}`;
    await this.d.mail.send({
      to: [user.email],
      subject: 'Your Dubito account',
      text:
        `Hello ${user.name},\n\n${actor.name} has invited you to Dubito as ${user.role}.\n` +
        `Choose your password here (the link works once, for ${this.d.invitationHours} hours):\n\n${link}\n`,
    });
    return { user: toPublic(user), expiresAt };
  }

  /** Always succeeds from the caller's view, so it reveals nothing about which addresses exist. */
  async requestPasswordReset(email: string): Promise<void> {
    const u = findUserByEmail(this.d.db, email);
    if (!u || !u.active || !u.passwordHash) return;
    const { token, hash } = newToken();
    inTransaction(this.d.db, (tx) => {
      retireTokens(tx, u.id);
      insertToken(tx, { kind: 'password_reset', userId: u.id, tokenHash: hash, expiresAt: Date.now() + this.d.resetHours * HOUR });
      recordAudit(tx, { actorId: u.id, action: 'user.password_reset_requested' });
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
    const t = findUnusedToken(this.d.db, hashToken(token));
    const u = t && t.expiresAt > Date.now() ? findUserById(this.d.db, t.userId) : undefined;
    if (!t || !u || !u.active) throw new NotFoundError('this link is invalid, used or expired', 'invalid_token');
    return { kind: t.kind, email: u.email, name: u.name };
  }

  /** Sets the password from an invitation or reset link; the link is then spent. */
  async completeToken(token: string, password: string): Promise<SessionUser> {
    checkPassword(password);
    const hash = await hashPassword(password);
    const user = inTransaction(this.d.db, (tx) => {
      const t = findUnusedToken(tx, hashToken(token));
      const u = t && t.expiresAt > Date.now() ? findUserById(tx, t.userId) : undefined;
      if (!t || !u || !u.active) throw new NotFoundError('this link is invalid, used or expired', 'invalid_token');
      markTokenUsed(tx, t.id);
      const after = updateUser(tx, u.id, { passwordHash: hash })!;
      recordAudit(tx, { actorId: u.id, action: 'user.password_set', detail: { via: t.kind } });
      return after;
    });
    this.sessionUsers.delete(user.id);
    this.d.endSessionsOf(user.id);
    return toSessionUser(user);
  }
}
