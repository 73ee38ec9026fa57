import type { Me } from '../../shared/api/accounts';

/** The signed-in user as the routes see it (never the password hash). */
export type SessionUser = Me;

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
  }
}
