import { zodResolver } from '@hookform/resolvers/zod';
import type { ReactNode } from 'react';
import { useForm } from 'react-hook-form';
import { Link, useSearchParams } from 'react-router-dom';
import { MIN_PASSWORD_LENGTH } from '../../../../shared/api/accounts';
import { ApiError, errorMessage } from '../../../app/http';
import { ErrorNote, Field, FormError, inputClass, Spinner, SubmitButton } from '../../../app/ui/controls';
import { useCompleteToken, useRequestReset, useToken } from '../api/auth';
import { forgotPasswordForm, newPasswordForm, type ForgotPasswordForm, type NewPasswordForm } from './form-schemas';

function Frame({ title, children }: { title: string; children: ReactNode }) {
  return (
    <main className="flex min-h-screen items-center justify-center bg-stone-100 px-4">
      <div className="w-full max-w-md rounded-xl border border-stone-300 bg-white p-8 shadow-sm">
        <p className="mb-4 text-lg font-semibold tracking-tight text-stone-900">
          Dubito<span className="text-accent-600">.</span>
        </p>
        <h1 className="mb-4 text-xl font-semibold text-stone-900">{title}</h1>
        {children}
      </div>
    </main>
  );
}

/** Set a first password (invitation link) or a new one (reset link). */
export function SetPasswordPage({ mode }: { mode: 'invitation' | 'reset' }) {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const info = useToken(token);
  const complete = useCompleteToken();
  const { register, handleSubmit, formState } = useForm<NewPasswordForm>({ resolver: zodResolver(newPasswordForm), defaultValues: { password: '', repeat: '' } });
  const title = mode === 'invitation' ? 'Set your password' : 'Choose a new password';

  if (token.length < 10) {
    return (
      <Frame title={title}>
        <ErrorNote title="This link is incomplete">Open the link from the e-mail again, or ask for a new one.</ErrorNote>
        <p className="mt-4 text-sm">
          <Link to="/forgot-password" className="text-accent-700 underline">
            Ask for a new link
          </Link>
        </p>
      </Frame>
    );
  }
  if (info.isPending) {
    return (
      <Frame title={title}>
        <Spinner label="Checking the link" />
      </Frame>
    );
  }
  if (info.isError) {
    const gone = info.error instanceof ApiError && (info.error.status === 404 || info.error.status === 400);
    return (
      <Frame title={title}>
        <ErrorNote title={gone ? 'This link is invalid, used or expired' : 'The link could not be checked'}>
          {gone ? 'Each link works once and for a limited time. Ask for a new one.' : errorMessage(info.error)}
        </ErrorNote>
        <p className="mt-4 text-sm">
          <Link to="/forgot-password" className="text-accent-700 underline">
            Ask for a new link
          </Link>{' '}
          ·{' '}
          <Link to="/sign-in" className="text-accent-700 underline">
            Sign in
          </Link>
        </p>
      </Frame>
    );
  }
  if (complete.isSuccess) {
    return (
      <Frame title="Password saved">
        <p role="status" className="text-sm text-stone-700">
          The password of {info.data.email} is set. Sign in with it now.
        </p>
        <Link to="/sign-in" className="mt-4 inline-flex rounded-md bg-accent-600 px-3 py-1.5 text-sm font-medium text-white hover:bg-accent-700">
          Go to sign-in
        </Link>
      </Frame>
    );
  }
  const submit = handleSubmit(({ password }) => complete.mutate({ token, password }));
  return (
    <Frame title={title}>
      <p className="mb-4 text-sm text-stone-700">
        {info.data.kind === 'invitation' ? `Welcome, ${info.data.name}. ` : ''}Account: <span className="font-medium">{info.data.email}</span>
      </p>
      <form onSubmit={submit} noValidate className="flex flex-col gap-4">
        <input type="email" value={info.data.email} autoComplete="username" readOnly hidden />
        <Field label="New password" error={formState.errors.password?.message} hint={`At least ${MIN_PASSWORD_LENGTH} characters; a short sentence is easy to remember.`}>
          {(p) => <input {...p} {...register('password')} type="password" autoComplete="new-password" className={inputClass} autoFocus />}
        </Field>
        <Field label="Repeat the password" error={formState.errors.repeat?.message}>
          {(p) => <input {...p} {...register('repeat')} type="password" autoComplete="new-password" className={inputClass} />}
        </Field>
        {complete.error ? (
          <FormError>{complete.error instanceof ApiError && complete.error.code === 'invalid_token' ? 'This link is no longer valid. Ask for a new one.' : errorMessage(complete.error)}</FormError>
        ) : null}
        <SubmitButton pending={complete.isPending} pendingLabel="Saving…">
          Save password
        </SubmitButton>
      </form>
    </Frame>
  );
}

export function ForgotPasswordPage() {
  const reset = useRequestReset();
  const { register, handleSubmit, formState, getValues } = useForm<ForgotPasswordForm>({ resolver: zodResolver(forgotPasswordForm), defaultValues: { email: '' } });
  if (reset.isSuccess) {
    return (
      <Frame title="Check your e-mail">
        <p role="status" className="text-sm text-stone-700">
          If {getValues('email')} belongs to an account, a link to choose a new password is on its way. The link works once and for a limited time.
        </p>
        <Link to="/sign-in" className="mt-4 inline-block text-sm text-accent-700 underline">
          Back to sign-in
        </Link>
      </Frame>
    );
  }
  return (
    <Frame title="Forgot your password?">
      <form noValidate className="flex flex-col gap-4" onSubmit={handleSubmit(({ email }) => reset.mutate(email.trim()))}>
        <p className="text-sm text-stone-700">Enter the address of your account; Dubito mails you a link to choose a new password.</p>
        <Field label="E-mail address" error={formState.errors.email?.message}>
          {(p) => <input {...p} {...register('email')} type="email" autoComplete="username" className={inputClass} autoFocus />}
        </Field>
        {reset.error ? (
          <FormError>{reset.error instanceof ApiError && reset.error.status === 429 ? 'Too many requests. Wait a few minutes and try again.' : errorMessage(reset.error)}</FormError>
        ) : null}
        <SubmitButton pending={reset.isPending} pendingLabel="Sending…">
          Send reset link
        </SubmitButton>
        <Link to="/sign-in" className="text-sm text-accent-700 underline">
          Back to sign-in
        </Link>
      </form>
    </Frame>
  );
}
