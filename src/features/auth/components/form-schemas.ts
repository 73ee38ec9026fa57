import { z } from 'zod';
import { completeTokenBody, MIN_PASSWORD_LENGTH, passwordResetBody, signInBody } from '../../../../shared/api/accounts';

/*
 * The auth forms' checks: the bodies the server parses (shared/api/accounts.ts),
 * each field first given the words the form says beside it. The server looks
 * an address up as given; the form also asks that it look like one.
 */

const ADDRESS_SHAPE = /^\S+@\S+\.\S+$/;
const address = z.string().regex(ADDRESS_SHAPE, { message: 'Enter the e-mail address of your account.' });

export const signInForm = signInBody.extend({
  email: address.pipe(signInBody.shape.email),
  password: z.string().min(1, { message: 'Enter your password.' }).pipe(signInBody.shape.password),
});
export type SignInForm = z.infer<typeof signInForm>;

export const forgotPasswordForm = passwordResetBody.extend({ email: address.pipe(passwordResetBody.shape.email) });
export type ForgotPasswordForm = z.infer<typeof forgotPasswordForm>;

export const newPasswordForm = z
  .object({
    password: z.string().min(MIN_PASSWORD_LENGTH, { message: `Use at least ${MIN_PASSWORD_LENGTH} characters.` }).pipe(completeTokenBody.shape.password),
    repeat: z.string(),
  })
  .refine((f) => f.repeat === f.password, {
    path: ['repeat'],
    message: 'The two passwords differ.',
    // said together with a short password, as soon as both are text
    when: (p) => typeof (p.value as { password?: unknown }).password === 'string' && typeof (p.value as { repeat?: unknown }).repeat === 'string',
  });
export type NewPasswordForm = z.infer<typeof newPasswordForm>;
