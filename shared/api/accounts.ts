/**
 * Payloads of the accounts routes (sign-in, /api/me, users, invitations, tokens), and the zod
 * schemas of the bodies an administrator's forms send: the server validates with them and the
 * users page checks its fields with them, so a field's message is the server's.
 */
import { z } from 'zod';
import { ROLES, type Role } from '../policy/policy';

const email = z.email({ message: 'must be an e-mail address' }).max(254).transform((s) => s.toLowerCase());
const personName = z.string().trim().min(1, { message: 'must not be empty' }).max(200);
/** A role, named as the policy names it. */
export const roleField = z.enum(ROLES, { error: `must be one of ${ROLES.join(', ')}` });

/** A password as a body carries it (its strength is judged by the server alone). */
export const passwordField = z.string({ error: 'must be text' }).min(1, { message: 'must not be empty' }).max(1000);

/** `POST /api/users`. */
export const newUserBody = z.strictObject({ email, name: personName, role: roleField, password: passwordField.optional() });
/** `POST /api/invitations`. */
export const inviteBody = z.strictObject({ email, name: personName, role: roleField });
export type InviteInput = z.input<typeof inviteBody>;
/** `PATCH /api/users/:id`: a change of role or access carries the reason the audit trail keeps. */
export const patchUserBody = z
  .strictObject({
    name: personName.optional(),
    role: roleField.optional(),
    active: z.boolean().optional(),
    reason: z.string().trim().max(1000).optional(),
  })
  .refine((b) => b.name !== undefined || b.role !== undefined || b.active !== undefined, { message: 'give name, role or active' })
  .refine((b) => (b.role === undefined && b.active === undefined) || !!b.reason, {
    message: 'say why the role or the access changes; the reason goes into the audit trail',
    path: ['reason'],
  });
export type UserPatch = z.input<typeof patchUserBody>;

/** Columns `GET /api/users` sorts by (`sort`), with `order` asc or desc. */
export const USER_SORTS = ['name', 'email', 'role', 'created'] as const;
export type UserSort = (typeof USER_SORTS)[number];

/** The signed-in user: `GET /api/me`, and `user` in the sign-in answers. */
export interface Me {
  id: number;
  email: string;
  name: string;
  role: Role;
}

/** A user as the admin's user list shows it (`GET /api/users`). */
export interface UserAccount extends Me {
  active: boolean;
  /** False until an invited user sets a password. */
  hasPassword: boolean;
  createdAt: number;
}

export type TokenKind = 'invitation' | 'password_reset';

/** `GET /api/auth/token`: what a link from an e-mail is for. */
export interface TokenInfo {
  kind: TokenKind;
  email: string;
  name: string;
}

/** `POST /api/auth/login` and `POST /api/auth/password-reset/complete`. */
export interface SignInResponse {
  user: Me;
}

/** `POST /api/invitations`. */
export interface InvitationResponse {
  user: UserAccount;
  expiresAt: number;
}

/** `GET /api/dev/mail`: one message held by the local mail outbox. */
export interface MailMessage {
  id: number;
  at: number;
  sender: string;
  recipients: string[];
  subject: string;
  text: string;
}
