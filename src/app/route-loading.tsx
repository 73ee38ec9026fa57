import { isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { errorMessage } from './http';
import { Button, ErrorNote, Spinner } from './ui/controls';

/** Shown while a page's code arrives; the spinner is a status region, so screen readers hear it. */
export function PageLoading() {
  return (
    <div className="flex justify-center px-6 py-16" aria-busy="true">
      <Spinner label="Loading the page" />
    </div>
  );
}

/** Browsers word a failed dynamic import differently; all name the module script. */
function isMissingCode(e: unknown): boolean {
  return e instanceof TypeError && /dynamically imported module|module script/i.test(e.message);
}

/**
 * The error boundary of every route: a page whose code cannot be loaded (most
 * often because Dubito was updated since the tab was opened, so the old chunk
 * is gone) offers a reload; any other failure says what went wrong.
 */
export function RouteError() {
  const error = useRouteError();
  if (isMissingCode(error)) {
    return (
      <div className="mx-auto max-w-lg px-6 py-12">
        <ErrorNote heading title="This page could not be loaded">
          <p>Dubito may have been updated since this tab was opened, or the server could not be reached. Reload to get the current version.</p>
          <Button className="mt-2" onClick={() => window.location.reload()}>
            Reload
          </Button>
        </ErrorNote>
      </div>
    );
  }
  const message = isRouteErrorResponse(error) ? `${error.status} ${error.statusText}` : errorMessage(error);
  return (
    <div className="mx-auto max-w-lg px-6 py-12">
      <ErrorNote heading title="This page failed">
        <p>{message}</p>
        <a href="/budgets" className="text-accent-700 underline">
          Go to the budgets
        </a>
      </ErrorNote>
    </div>
  );
}
