import * as z from 'zod/mini';
import { completeTokenBody, MIN_PASSWORD_LENGTH, passwordResetBody, signInBody } from '../../../../shared/api/accounts';

/*
 * The auth forms' checks: the bodies the server parses (shared/api/accounts.ts),
 * each field first given the words the form says beside it. The server looks
 * an address up as given; the form also asks that it look like one.
 */

const ADDRESS_SHAPE = /^\S+@\S+\.\S+$/;
const address = z.string().check(z.regex(ADDRESS_SHAPE, { error: 'Enter the e-mail address of your account.' }));

export const signInForm = z.extend(signInBody, {
  email: z.pipe(address, signInBody.shape.email),
  password: z.pipe(z.string().check(z.minLength(1, { error: 'Enter your password.' })), signInBody.shape.password),
});
export type SignInForm = z.infer<typeof signInForm>;

export const forgotPasswordForm = z.extend(passwordResetBody, { email: z.pipe(address, passwordResetBody.shape.email) });
export type ForgotPasswordForm = z.infer<typeof forgotPasswordForm>;

export const newPasswordForm = z
  .object({
    password: z.pipe(z.string().check(z.minLength(MIN_PASSWORD_LENGTH, { error: `Use at least ${MIN_PASSWORD_LENGTH} characters.` })), completeTokenBody.shape.password),
    repeat: z.string(),
  })
  .check(
    z.refine((f) => f.repeat === f.password, {
      path: ['repeat'],
      error: 'The two passwords differ.',
      // said together with a short password, as soon as both are text
      when: (p) => typeof (p.value as { password?: unknown }).password === 'string' && typeof (p.value as { repeat?: unknown }).repeat === 'string',
    }),
  );
export type NewPasswordForm = z.infer<typeof newPasswordForm>;
