import { useState, type FormEvent } from 'react';
import { Link, Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { ApiError } from '../../../app/http';
import { Field, FormError, SubmitButton, TextInput } from '../../../app/ui/controls';
import { useMe, useSignIn } from '../api/auth';

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
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [touched, setTouched] = useState(false);

  if (me.data) return <Navigate to={next} replace />;

  const emailError = touched && !/^\S+@\S+\.\S+$/.test(email) ? 'Enter the e-mail address of your account.' : null;
  const passwordError = touched && password === '' ? 'Enter your password.' : null;
  const serverError =
    signIn.error instanceof ApiError
      ? signIn.error.status === 429
        ? 'Too many attempts. Wait a few minutes before trying again.'
        : signIn.error.message.replace(/^./, (c) => c.toUpperCase()) + '.'
      : signIn.error
        ? 'Sign-in failed. Try again.'
        : null;

  const submit = (e: FormEvent) => {
    e.preventDefault();
    setTouched(true);
    if (!/^\S+@\S+\.\S+$/.test(email) || password === '') return;
    signIn.mutate({ email, password }, { onSuccess: () => navigate(next, { replace: true }) });
  };

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
            <br />
            u<sub>c</sub>²(y) = Σ c<sub>i</sub>² u²(x<sub>i</sub>)
          </p>
        </section>
        <form onSubmit={submit} noValidate className="flex flex-col gap-4 p-8" aria-labelledby="signin-title">
          <h1 id="signin-title" className="text-xl font-semibold text-stone-900">
            Sign in
          </h1>
          <Field label="E-mail address" error={emailError}>
            {(p) => <TextInput {...p} type="email" autoComplete="username" value={email} onChange={(e) => setEmail(e.target.value)} autoFocus />}
          </Field>
          <Field label="Password" error={passwordError}>
            {(p) => <TextInput {...p} type="password" autoComplete="current-password" value={password} onChange={(e) => setPassword(e.target.value)} />}
          </Field>
          {serverError ? (
            <FormError>{serverError}</FormError>
          ) : null}
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
                      setEmail(`${r}@dubito.example`);
                      setPassword('dubito-demo');
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
