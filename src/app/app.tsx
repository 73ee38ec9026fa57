import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { createElement, lazy, Suspense, useEffect, type ComponentProps, type ComponentType } from 'react';
import { createBrowserRouter, Navigate, RouterProvider, useParams, useSearchParams, type Params, type RouteObject } from 'react-router-dom';
import { budgetQuery, meQuery, versionQuery } from '../budget/queries';
import { budgetListRequest } from '../features/budgets/api/list-request';
import { ApiError } from './http';
import { PageLoading, RouteError } from './route-loading';
import { useSignedInUser } from './routes/signed-in-user';
import { ToastProvider } from './ui/toasts';

// React.lazy's own bound; a page's props stay checked through ComponentProps of its own type.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type AnyComponent = ComponentType<any>;

/** Fetches a lazy module's code, or what a page shows, ahead of its first render (given the route's parameters); a failure shows when it renders. */
type Preload = (params: Params) => Promise<unknown>;

/**
 * A page loaded with its own chunk the first time its route is opened, so the
 * sign-in page carries none of the editor, the engine or the chart library.
 * `preload` fetches that chunk ahead (see fetchAhead). Once the chunk is here the
 * page renders at once: React.lazy suspends on its first render even then, and
 * React keeps a loading state on screen for a few hundred milliseconds once shown.
 */
function lazyPage<M extends Record<K, AnyComponent>, K extends PropertyKey>(load: () => Promise<M>, name: K) {
  let loaded: AnyComponent | undefined;
  const fetchPage = () => load().then((m) => (loaded = m[name]));
  const Lazy = lazy(async () => ({ default: await fetchPage() }));
  function Page(props: ComponentProps<M[K]>) {
    return createElement(loaded ?? Lazy, props);
  }
  const preload = () => fetchPage().catch(() => {});
  return Object.assign(Page, { preload });
}

/** The same for a module whose default export is the page (`src/app/routes/`). */
const lazyRoute = <M extends { default: ComponentType }>(load: () => Promise<M>) => lazyPage(load, 'default');

const SignInPage = lazyPage(() => import('../features/auth/components/SignInPage'), 'SignInPage');
const ForgotPasswordPage = lazyPage(() => import('../features/auth/components/PasswordPages'), 'ForgotPasswordPage');
const SetPasswordPage = lazyPage(() => import('../features/auth/components/PasswordPages'), 'SetPasswordPage');
const BudgetsListPage = lazyPage(() => import('../features/budgets/components/BudgetsListPage'), 'BudgetsListPage');
const ReviewQueue = lazyPage(() => import('../features/reviews/components/ReviewQueue'), 'ReviewQueue');
const VersionsPage = lazyPage(() => import('../features/versions/components/VersionsPage'), 'VersionsPage');
const ComparePage = lazyPage(() => import('../features/versions/components/ComparePage'), 'ComparePage');
const TemplatesPage = lazyPage(() => import('../features/templates/components/TemplatesPage'), 'TemplatesPage');
const AuditPage = lazyPage(() => import('../features/audit/components/AuditPage'), 'AuditPage');
const MailboxPage = lazyPage(() => import('../features/admin/components/MailboxPage'), 'MailboxPage');
const UsersPage = lazyPage(() => import('../features/admin/components/UsersPage'), 'UsersPage');
// The signed-in frame (navigation, sign-in check, role guard) is code the public pages never run.
const SignedIn = lazyPage(() => import('./shell'), 'SignedIn');
const RequireAction = lazyPage(() => import('./shell'), 'RequireAction');
const NotFound = lazyPage(() => import('./shell'), 'NotFound');
// Routes that compose several features live in one module each, so their parts arrive in one chunk, not one after another.
const EditorRoute = lazyRoute(() => import('./routes/editor-route'));
const ReportRoute = lazyRoute(() => import('./routes/report-route'));

const queryClient = new QueryClient({
  defaultOptions: {
    queries: {
      staleTime: 15_000,
      refetchOnWindowFocus: false,
      retry: (count, e) => !(e instanceof ApiError && e.status >= 400 && e.status < 500) && count < 2,
    },
  },
});

/**
 * The stored budget an editor route opens (and the past version asked for), fetched with the
 * editor's code: the first render then shows the budget, instead of a loading state that
 * asks for it only once the code has run. Same queries, so the page finds them in the cache.
 */
const budgetAhead: Preload = ({ id, n }) => {
  const budgetId = Number(id);
  if (!Number.isInteger(budgetId)) return Promise.resolve();
  return Promise.all([queryClient.prefetchQuery(budgetQuery(budgetId)), n === undefined ? null : queryClient.prefetchQuery(versionQuery(budgetId, Number(n)))]);
};

/** The page of the budget list the address asks for, fetched with the list's code (as `budgetAhead`). */
const budgetListAhead: Preload = () => queryClient.prefetchQuery(budgetListRequest(new URLSearchParams(window.location.search)).query);

/** A page outside the shell (sign-in, passwords), with its own wait while its chunk loads. */
function publicPage(path: string, element: React.ReactNode, preload: Preload): RouteObject {
  return { path, errorElement: <RouteError />, element: <Suspense fallback={<PageLoading />}>{element}</Suspense>, ...ahead(preload) };
}

/** The home page: a reviewer's queue above the list of budgets. */
function BudgetsRoute() {
  const me = useSignedInUser();
  // Opening a budget is what the list is for: fetch the editor's chunk once the browser is idle, so that click is instant.
  useEffect(() => {
    if (typeof requestIdleCallback === 'function') {
      const handle = requestIdleCallback(() => void EditorRoute.preload());
      return () => cancelIdleCallback(handle);
    }
    void EditorRoute.preload();
  }, []);
  return (
    <>
      <ReviewQueue role={me.role} />
      <BudgetsListPage role={me.role} />
    </>
  );
}

function VersionsRoute() {
  const me = useSignedInUser();
  const { id } = useParams();
  return <VersionsPage me={me} budgetId={Number(id)} />;
}

function TemplatesRoute() {
  const me = useSignedInUser();
  return <TemplatesPage role={me.role} />;
}

function UsersRoute() {
  const me = useSignedInUser();
  return <UsersPage meId={me.id} />;
}

function CompareRoute() {
  const { id } = useParams();
  const [params] = useSearchParams();
  const n = (k: string) => (params.get(k) ? Number(params.get(k)) || undefined : undefined);
  return <ComparePage budgetId={Number(id)} from={n('from')} to={n('to')} />;
}

function Guarded({ action, children }: { action: Parameters<typeof RequireAction>[0]['action']; children: React.ReactNode }) {
  const me = useSignedInUser();
  return (
    <RequireAction me={me} action={action}>
      {children}
    </RequireAction>
  );
}

/** What a route fetches ahead when it is the first page opened (see fetchAhead), its data before its code. */
interface RouteHandle {
  preload: Preload[];
}
const ahead = (...preload: Preload[]): { handle: RouteHandle } => ({ handle: { preload } });

/** A route only for the roles that the policy allows the action. */
function guarded(path: string, action: Parameters<typeof Guarded>[0]['action'], element: React.ReactNode, ...preload: Preload[]): RouteObject {
  return { path, element: <Guarded action={action}>{element}</Guarded>, ...ahead(RequireAction.preload, ...preload) };
}

const router = createBrowserRouter([
  publicPage('/sign-in', <SignInPage />, SignInPage.preload),
  publicPage('/forgot-password', <ForgotPasswordPage />, ForgotPasswordPage.preload),
  publicPage('/set-password', <SetPasswordPage mode="invitation" />, SetPasswordPage.preload),
  publicPage('/reset-password', <SetPasswordPage mode="reset" />, SetPasswordPage.preload),
  {
    path: '/',
    element: (
      <Suspense fallback={<PageLoading />}>
        <SignedIn />
      </Suspense>
    ),
    errorElement: <RouteError />,
    ...ahead(SignedIn.preload),
    children: [
      {
        // A page that fails (or whose chunk cannot be loaded) shows its error inside the shell, navigation intact.
        errorElement: <RouteError />,
        children: [
          { index: true, element: <Navigate to="/budgets" replace /> },
          { path: 'budgets', element: <BudgetsRoute />, ...ahead(budgetListAhead, ReviewQueue.preload, BudgetsListPage.preload) },
          guarded('budgets/new', 'budget.create', <EditorRoute />, EditorRoute.preload),
          { path: 'budgets/:id', element: <EditorRoute />, ...ahead(budgetAhead, EditorRoute.preload) },
          { path: 'budgets/:id/versions', element: <VersionsRoute />, ...ahead(VersionsPage.preload) },
          { path: 'budgets/:id/versions/:n', element: <EditorRoute />, ...ahead(budgetAhead, EditorRoute.preload) },
          { path: 'budgets/:id/compare', element: <CompareRoute />, ...ahead(ComparePage.preload) },
          { path: 'budgets/:id/versions/:n/report', element: <ReportRoute />, ...ahead(ReportRoute.preload) },
          guarded('templates', 'budget.read', <TemplatesRoute />, TemplatesPage.preload),
          guarded('audit', 'audit.read', <AuditPage />, AuditPage.preload),
          guarded('admin/users', 'user.manage', <UsersRoute />, UsersPage.preload),
          guarded('admin/mail', 'mail.read', <MailboxPage />, MailboxPage.preload),
          { path: '*', element: <NotFound />, ...ahead(NotFound.preload) },
        ],
      },
    ],
  },
]);

/**
 * Fetches who is signed in and the code of every route the first URL matches (the signed-in
 * frame and the page), with the data a route names (a stored budget), at once, as soon as this
 * module runs, instead of one after another as each renders: frame, then the sign-in check,
 * then the page's chunk, then its data. Resolves when that code and data are here (a chunk or a
 * request that fails shows its error when the page renders). The page's own route goes first: its
 * data is one small request, which would otherwise wait behind a dozen files for one of the six
 * connections a browser opens to the server.
 */
function fetchAhead(): Promise<unknown> {
  void queryClient.prefetchQuery(meQuery());
  const pageFirst = [...router.state.matches].reverse();
  return Promise.all(pageFirst.flatMap((match) => (match.route.handle as RouteHandle | undefined)?.preload.map((preload) => preload(match.params)) ?? []));
}

/**
 * The first page's code (and the budget an editor opens) has arrived: rendering then shows the page at once, never its
 * loading state first (React holds a loading state on screen for a few hundred
 * milliseconds once shown, so showing one would make the page arrive later).
 */
export const firstPageReady = fetchAhead();

export function App() {
  return (
    <QueryClientProvider client={queryClient}>
      <ToastProvider>
        {/* Without transitions a click shows the page area's loading state at once, instead of leaving the old page up, unanswered, while the next page's chunk arrives. */}
        <RouterProvider router={router} useTransitions={false} />
      </ToastProvider>
    </QueryClientProvider>
  );
}
