import { describe, expect, it } from 'vitest';
import { completeTokenBody, MIN_PASSWORD_LENGTH, signInBody } from '../../shared/api/accounts';
import { forgotPasswordForm, newPasswordForm, signInForm } from '../../src/features/auth/components/form-schemas';

const problems = (r: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) => Object.fromEntries((r.error?.issues ?? []).map((i) => [i.path.join('.'), i.message]));

describe('the sign-in form checks what the server checks, in the words beside each field', () => {
  it('asks for an address and a password', () => {
    expect(problems(signInForm.safeParse({ email: '', password: '' }))).toEqual({ email: 'Enter the e-mail address of your account.', password: 'Enter your password.' });
    expect(problems(signInForm.safeParse({ email: 'metrologist', password: 'x' }))).toEqual({ email: 'Enter the e-mail address of your account.' });
  });

  it('passes what the server takes', () => {
    const body = { email: 'metrologist@dubito.example', password: 'dubito-demo' };
    expect(signInForm.parse(body)).toEqual(body);
    expect(signInBody.parse(body)).toEqual(body);
  });

  it('refuses, as the server does, a password longer than the server reads', () => {
    const body = { email: 'metrologist@dubito.example', password: 'x'.repeat(1001) };
    expect(signInForm.safeParse(body).success).toBe(false);
    expect(signInBody.safeParse(body).success).toBe(false);
  });
});

describe('the password forms', () => {
  it('asks for the address of the account before sending a link', () => {
    expect(problems(forgotPasswordForm.safeParse({ email: 'no address' }))).toEqual({ email: 'Enter the e-mail address of your account.' });
    expect(forgotPasswordForm.safeParse({ email: 'trainee@dubito.example' }).success).toBe(true);
  });

  it('asks for the shortest password the server accepts, and says a differing repeat at the same time', () => {
    const short = 'x'.repeat(MIN_PASSWORD_LENGTH - 1);
    expect(problems(newPasswordForm.safeParse({ password: short, repeat: 'other' }))).toEqual({
      password: `Use at least ${MIN_PASSWORD_LENGTH} characters.`,
      repeat: 'The two passwords differ.',
    });
    expect(problems(newPasswordForm.safeParse({ password: 'heron gauge block wax', repeat: 'heron gauge block wa' }))).toEqual({ repeat: 'The two passwords differ.' });
  });

  it('passes a long enough password typed twice, which the server’s body takes', () => {
    const password = 'heron gauge block wax';
    expect(newPasswordForm.safeParse({ password, repeat: password }).success).toBe(true);
    expect(completeTokenBody.safeParse({ token: 'x'.repeat(43), password }).success).toBe(true);
  });
});
