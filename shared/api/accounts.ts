/** Payloads of the accounts routes (sign-in, /api/me, users, invitations, tokens). Types only. */
import type { Role } from '../policy/policy';

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
