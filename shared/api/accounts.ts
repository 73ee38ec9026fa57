/**
 * Payloads of the accounts routes (sign-in, /api/me, users, invitations,
 * tokens). Besides the types, the bodies of sign-in and the password links as
 * zod schemas: the server's routes parse them and the client's forms check
 * them, so both hold one rule.
 */
import * as z from 'zod/mini';
import type { Role } from '../policy/policy';

/** The shortest password accepted; the password is also the approval signature. */
export const MIN_PASSWORD_LENGTH = 12;

// zod/mini: these schemas reach the sign-in page, which loads only what it uses

/** An address as typed to sign in or ask for a link: looked up as given, so any text up to the longest address. */
const typedAddress = z.string({ error: 'must be text' }).check(z.maxLength(254, { error: 'is longer than any e-mail address' }));
/** A password as typed: its strength is judged where one is chosen, not here. */
const typedPassword = z.string({ error: 'must be text' }).check(z.minLength(1, { error: 'must not be empty' }), z.maxLength(1000, { error: 'must have at most 1000 characters' }));
/** The token of a link from an e-mail. */
export const linkToken = z.string().check(z.minLength(10), z.maxLength(200));

/** `POST /api/auth/login`. */
export const signInBody = z.strictObject({ email: typedAddress, password: typedPassword });

/** `POST /api/auth/password-reset`. */
export const passwordResetBody = z.strictObject({ email: typedAddress });

/** `POST /api/auth/password-reset/complete`: the token of the link and the new password. */
export const completeTokenBody = z.strictObject({ token: linkToken, password: typedPassword });

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
