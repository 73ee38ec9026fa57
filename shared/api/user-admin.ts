/**
 * The zod schemas of the bodies an administrator's forms send (users, invitations, changes of
 * role or access): the server validates with them and the users page checks its fields with
 * them, so a field's message is the server's. Apart from `accounts.ts`, whose sign-in schemas
 * are written for the sign-in page's small bundle.
 */
import { z } from 'zod';
import { ROLES } from '../policy/policy';

const email = z
  .email({ message: 'must be an e-mail address' })
  .max(254)
  .transform((s) => s.toLowerCase());
const personName = z.string().trim().min(1, { message: 'must not be empty' }).max(200);
/** A role, named as the policy names it. */
export const roleField = z.enum(ROLES, { error: `must be one of ${ROLES.join(', ')}` });

/** A password as a body carries it (its strength is judged by the server alone). */
const passwordField = z.string({ error: 'must be text' }).min(1, { message: 'must not be empty' }).max(1000);

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
