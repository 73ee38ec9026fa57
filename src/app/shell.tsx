import { Suspense } from 'react';
import { NavLink, Navigate, Outlet, useLocation, useNavigate } from 'react-router-dom';
import type { Me } from '../../shared/api/accounts';
import { can, type Action, type Role } from '../../shared/policy/policy';
import { useMe, useSignOut } from '../features/auth/api/auth';
import { errorMessage } from './http';
import { PageLoading } from './route-loading';
import { Button, ErrorNote, Spinner } from './ui/controls';

interface NavItem {
  to: string;
  label: string;
  action: Action;
}

/** Navigation: each entry appears only for the roles the policy map allows. */
const NAV: NavItem[] = [
  { to: '/budgets', label: 'Budgets', action: 'budget.read' },
  { to: '/templates', label: 'Templates', action: 'budget.read' },
  { to: '/audit', label: 'Audit trail', action: 'audit.read' },
  { to: '/admin/users', label: 'Users', action: 'user.manage' },
  { to: '/admin/mail', label: 'Mailbox', action: 'mail.read' },
];

const ROLE_LABEL: Record<Role, string> = {
  admin: 'Administrator',
  metrologist: 'Metrologist',
  reviewer: 'Reviewer',
  auditor: 'Auditor',
  trainee: 'Trainee',
};

function roleLabel(role: Role): string {
  return ROLE_LABEL[role];
}

/** Signed-in area: redirects visitors to the sign-in page, keeping where they wanted to go. */
function RequireSignIn({ children }: { children: (me: Me) => React.ReactNode }) {
  const me = useMe();
  const location = useLocation();
  if (me.isPending) {
    return (
      <div className="flex min-h-screen items-center justify-center">
        <Spinner label="Opening Dubito" />
      </div>
    );
  }
  if (me.isError) {
    return (
      <div className="mx-auto max-w-lg p-8">
        <ErrorNote heading title="Dubito cannot reach its server">
          {errorMessage(me.error)}
        </ErrorNote>
      </div>
    );
  }
  if (!me.data) return <Navigate to={`/sign-in?next=${encodeURIComponent(location.pathname + location.search)}`} replace />;
  return <>{children(me.data)}</>;
}

/** The signed-in area: the shell stays on screen while a page's chunk loads; only the page area waits. */
export function SignedIn() {
  return (
    <RequireSignIn>
      {(me) => (
        <AppShell
          me={me}
          outlet={
            <Suspense fallback={<PageLoading />}>
              <Outlet context={me} />
            </Suspense>
          }
        />
      )}
    </RequireSignIn>
  );
}

function AppShell({ me, outlet }: { me: Me; outlet?: React.ReactNode }) {
  const signOut = useSignOut();
  const navigate = useNavigate();
  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-white focus:px-3 focus:py-1">
        Skip to content
      </a>
      <header className="no-print sticky top-0 z-30 border-b border-stone-800 bg-stone-900 text-stone-100">
        <div className="mx-auto flex max-w-[1600px] flex-wrap items-center gap-x-6 gap-y-1 px-6 py-2">
          <NavLink to="/budgets" className="text-lg font-semibold tracking-tight text-white">
            Dubito<span className="text-accent-100">.</span>
          </NavLink>
          <nav aria-label="Main" className="flex flex-1 flex-wrap gap-1">
            {NAV.filter((n) => can(me.role, n.action)).map((n) => (
              <NavLink
                key={n.to}
                to={n.to}
                className={({ isActive }) => `rounded-md px-3 py-1.5 text-sm font-medium ${isActive ? 'bg-stone-700 text-white' : 'text-stone-300 hover:bg-stone-800 hover:text-white'}`}
              >
                {n.label}
              </NavLink>
            ))}
          </nav>
          <div className="flex items-center gap-3 text-sm">
            <span className="text-right leading-tight">
              <span className="block font-medium text-white">{me.name}</span>
              <span className="block text-xs text-stone-300">{roleLabel(me.role)}</span>
            </span>
            <Button
              size="sm"
              className="!border-stone-600 !bg-stone-800 !text-stone-100 hover:!bg-stone-700"
              onClick={() => signOut.mutate(undefined, { onSettled: () => navigate('/sign-in', { replace: true }) })}
            >
              Sign out
            </Button>
          </div>
        </div>
      </header>
      <main id="main" className="flex-1">
        {outlet ?? <Outlet />}
      </main>
    </div>
  );
}

/** Shown instead of a page the role may not open. */
function NotAllowed({ role }: { role: Role }) {
  return (
    <div className="mx-auto max-w-xl px-6 py-12">
      <h1 className="text-xl font-semibold">Not available for your role</h1>
      <p className="mt-2 text-sm text-stone-700">You are signed in as {roleLabel(role).toLowerCase()}. This page is for other roles; ask an administrator if you need access.</p>
    </div>
  );
}

export function RequireAction({ me, action, children }: { me: Me; action: Action; children: React.ReactNode }) {
  return can(me.role, action) ? <>{children}</> : <NotAllowed role={me.role} />;
}

function Placeholder({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <div className="mx-auto max-w-3xl px-6 py-10">
      <h1 className="text-2xl font-semibold tracking-tight">{title}</h1>
      <p className="mt-2 text-sm text-stone-700">{children}</p>
    </div>
  );
}

export function NotFound() {
  return (
    <Placeholder title="Page not found">
      There is nothing at this address.{' '}
      <NavLink to="/budgets" className="text-accent-700 underline">
        Go to the budgets
      </NavLink>
      .
    </Placeholder>
  );
}
