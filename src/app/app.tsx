import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { createBrowserRouter, Navigate, Outlet, RouterProvider, useParams, useSearchParams } from 'react-router-dom';
import type { Me } from '../../shared/api/accounts';
import { SignInPage } from '../features/auth/components/SignInPage';
import { ForgotPasswordPage, SetPasswordPage } from '../features/auth/components/PasswordPages';
import { BudgetsListPage } from '../features/budgets/components/BudgetsListPage';
import { EditorPage } from '../features/editor/components/EditorPage';
import { MonteCarloPanel } from '../features/monte-carlo/components/MonteCarloPanel';
import { VersionsPage } from '../features/versions/components/VersionsPage';
import { ComparePage } from '../features/versions/components/ComparePage';
import { ReviewActions } from '../features/reviews/components/ReviewActions';
import { CommentBadge, ReviewPanel, type ThreadKey } from '../features/reviews/components/ReviewPanel';
import { TemplatesPage, TemplateToggle } from '../features/templates/components/TemplatesPage';
import { AuditPage } from '../features/audit/components/AuditPage';
import { MailboxPage } from '../features/admin/components/MailboxPage';
import { UsersPage } from '../features/admin/components/UsersPage';
import { ReportPage } from '../features/report/components/ReportPage';
import { BudgetWithContributions } from '../features/editor/components/BudgetTable';
import { ApiError } from './http';
import { AppShell, NotFound, RequireAction, RequireSignIn } from './shell';
import { ToastProvider } from './ui/toasts';
import { useOutletContext } from 'react-router-dom';
import { useState } from 'react';

const queryClient = new QueryClient({
  defaultOptions: {
    queries: {
      staleTime: 15_000,
      refetchOnWindowFocus: false,
      retry: (count, e) => !(e instanceof ApiError && e.status >= 400 && e.status < 500) && count < 2,
    },
  },
});

function useMeFromShell(): Me {
  return useOutletContext<Me>();
}

function SignedIn() {
  return (
    <RequireSignIn>
      {(me) => (
        <AppShellWithContext me={me} />
      )}
    </RequireSignIn>
  );
}

function AppShellWithContext({ me }: { me: Me }) {
  return <AppShell me={me} outlet={<Outlet context={me} />} />;
}

function BudgetsRoute() {
  const me = useMeFromShell();
  return <BudgetsListPage role={me.role} />;
}

function EditorRoute() {
  const { id, n } = useParams();
  return <EditorWithReview key={`${id}-${n ?? 'current'}`} id={id} n={n} />;
}

/** The editor with the review feature in its slots: comment badges on rows, the thread beside the table, the review actions. */
function EditorWithReview({ id, n }: { id?: string; n?: string }) {
  const me = useMeFromShell();
  const budgetId = id && id !== 'new' ? Number(id) : undefined;
  const [thread, setThread] = useState<ThreadKey | null>(null);
  return (
    <EditorPage
      me={me}
      budgetId={budgetId}
      versionNumber={n ? Number(n) : undefined}
      renderMonteCarlo={(props) => <MonteCarloPanel {...props} />}
      slots={
        budgetId === undefined
          ? undefined
          : {
              renderRowAdornment: (symbol) => <CommentBadge budgetId={budgetId} symbol={symbol} open={thread === symbol} onOpen={(s) => setThread((t) => (t === s ? null : s))} />,
              renderHeaderActions: (ctx) => (
                <>
                  <ReviewActions ctx={ctx} me={me} />
                  {ctx.viewingOld ? null : <TemplateToggle budgetId={ctx.budgetId} isTemplate={ctx.facts.isTemplate} role={me.role} />}
                </>
              ),
              renderSidePanel: (ctx) => <ReviewPanel ctx={ctx} me={me} thread={thread} onThread={setThread} />,
            }
      }
    />
  );
}

function VersionsRoute() {
  const me = useMeFromShell();
  const { id } = useParams();
  return <VersionsPage me={me} budgetId={Number(id)} />;
}

function TemplatesRoute() {
  const me = useMeFromShell();
  return <TemplatesPage role={me.role} />;
}

function UsersRoute() {
  const me = useMeFromShell();
  return <UsersPage meId={me.id} />;
}

function ReportRoute() {
  const { id, n } = useParams();
  return (
    <ReportPage
      budgetId={Number(id)}
      versionNumber={Number(n)}
      renderBudgetTable={(model) => <BudgetWithContributions model={model} />}
    />
  );
}

function CompareRoute() {
  const { id } = useParams();
  const [params] = useSearchParams();
  const n = (k: string) => (params.get(k) ? Number(params.get(k)) || undefined : undefined);
  return <ComparePage budgetId={Number(id)} from={n('from')} to={n('to')} />;
}

function Guarded({ action, children }: { action: Parameters<typeof RequireAction>[0]['action']; children: React.ReactNode }) {
  const me = useMeFromShell();
  return (
    <RequireAction me={me} action={action}>
      {children}
    </RequireAction>
  );
}

/** A route only for the roles that the policy allows the action. */
function guarded(path: string, action: Parameters<typeof Guarded>[0]['action'], element: React.ReactNode) {
  return { path, element: <Guarded action={action}>{element}</Guarded> };
}

const router = createBrowserRouter([
  { path: '/sign-in', element: <SignInPage /> },
  { path: '/forgot-password', element: <ForgotPasswordPage /> },
  { path: '/set-password', element: <SetPasswordPage mode="invitation" /> },
  { path: '/reset-password', element: <SetPasswordPage mode="reset" /> },
  {
    path: '/',
    element: <SignedIn />,
    children: [
      { index: true, element: <Navigate to="/budgets" replace /> },
      { path: 'budgets', element: <BudgetsRoute /> },
      guarded('budgets/new', 'budget.create', <EditorRoute />),
      { path: 'budgets/:id', element: <EditorRoute /> },
      { path: 'budgets/:id/versions', element: <VersionsRoute /> },
      { path: 'budgets/:id/versions/:n', element: <EditorRoute /> },
      { path: 'budgets/:id/compare', element: <CompareRoute /> },
      { path: 'budgets/:id/versions/:n/report', element: <ReportRoute /> },
      guarded('templates', 'budget.read', <TemplatesRoute />),
      guarded('audit', 'audit.read', <AuditPage />),
      guarded('admin/users', 'user.manage', <UsersRoute />),
      guarded('admin/mail', 'mail.read', <MailboxPage />),
      { path: '*', element: <NotFound /> },
    ],
  },
]);

export function App() {
  return (
    <QueryClientProvider client={queryClient}>
      <ToastProvider>
        <RouterProvider router={router} />
      </ToastProvider>
    </QueryClientProvider>
  );
}
