import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link, Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { ApiError } from '../../../app/http';
import { Field, FormError, inputClass, SubmitButton } from '../../../app/ui/controls';
import { useMe, useSignIn } from '../api/auth';
import { signInForm, type SignInForm } from './form-schemas';

const DEMO = ['metrologist', 'reviewer', 'auditor', 'trainee', 'admin'];

function safeNext(next: string | null): string {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : '/budgets';
}

export function SignInPage() {
  const [params] = useSearchParams();
  const next = safeNext(params.get('next'));
  const me = useMe();
  const signIn = useSignIn();
  const navigate = useNavigate();
  const { register, handleSubmit, setValue, formState } = useForm<SignInForm>({ resolver: zodResolver(signInForm), defaultValues: { email: '', password: '' } });

  if (me.data) return <Navigate to={next} replace />;

  const serverError =
    signIn.error instanceof ApiError
      ? signIn.error.status === 429
        ? 'Too many attempts. Wait a few minutes before trying again.'
        : signIn.error.message.replace(/^./, (c) => c.toUpperCase()) + '.'
      : signIn.error
        ? 'Sign-in failed. Try again.'
        : null;

  const submit = handleSubmit((body) => signIn.mutate(body, { onSuccess: () => navigate(next, { replace: true }) }));
  // after a first try, a changed field is checked again at once
  const typed = { shouldValidate: formState.isSubmitted };

  return (
    <main className="flex min-h-screen items-center justify-center bg-stone-100 px-4">
      <div className="grid w-full max-w-3xl overflow-hidden rounded-xl border border-stone-300 bg-white shadow-sm md:grid-cols-2">
        <section className="flex flex-col justify-between gap-6 bg-stone-900 p-8 text-stone-100">
          <div>
            <p className="text-2xl font-semibold tracking-tight">
              Dubito<span className="text-accent-100">.</span>
            </p>
            <p className="mt-2 text-sm text-stone-300">Measurement-uncertainty budgets for calibration and testing laboratories.</p>
          </div>
          <p className="num text-xs leading-relaxed text-stone-300">
            U = k · u<sub>c</sub>(y)
            <br />u<sub>c</sub>²(y) = Σ c<sub>i</sub>² u²(x<sub>i</sub>)
          </p>
        </section>
        <form onSubmit={submit} noValidate className="flex flex-col gap-4 p-8" aria-labelledby="signin-title">
          <h1 id="signin-title" className="text-xl font-semibold text-stone-900">
            Sign in
          </h1>
          <Field label="E-mail address" error={formState.errors.email?.message}>
            {(p) => <input {...p} {...register('email')} type="email" autoComplete="username" className={inputClass} autoFocus />}
          </Field>
          <Field label="Password" error={formState.errors.password?.message}>
            {(p) => <input {...p} {...register('password')} type="password" autoComplete="current-password" className={inputClass} />}
          </Field>
          {serverError ? <FormError>{serverError}</FormError> : null}
          <SubmitButton pending={signIn.isPending} pendingLabel="Signing in…">
            Sign in
          </SubmitButton>
          <Link to="/forgot-password" className="self-start text-sm text-accent-700 underline-offset-2 hover:underline">
            Forgot password?
          </Link>
          <details className="text-xs text-stone-600">
            <summary className="cursor-pointer select-none font-medium text-stone-700">Demo accounts</summary>
            <p className="mt-2">This installation holds a fictional demo lab. Every demo account uses the password dubito-demo.</p>
            <ul className="mt-2 flex flex-wrap gap-1">
              {DEMO.map((r) => (
                <li key={r}>
                  <button
                    type="button"
                    className="rounded border border-stone-300 px-2 py-0.5 hover:bg-stone-100"
                    onClick={() => {
                      setValue('email', `${r}@dubito.example`, typed);
                      setValue('password', 'dubito-demo', typed);
                    }}
                  >
                    {r}
                  </button>
                </li>
              ))}
            </ul>
          </details>
        </form>
      </div>
    </main>
  );
}
