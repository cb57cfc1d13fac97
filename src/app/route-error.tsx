import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';

/** One error boundary for the app: an expected miss reads as such, a crash says so plainly. */
export function RouteError() {
  const error = useRouteError();
  const status = isRouteErrorResponse(error) ? error.status : undefined;
  const message = isRouteErrorResponse(error) ? error.statusText : error instanceof Error ? error.message : String(error);
  return (
    <div role="alert" className="mx-auto max-w-lg py-16 text-center">
      <p className="text-sm font-semibold uppercase tracking-wider text-ink-faint">{status ?? 'Error'}</p>
      <h1 className="mt-2 text-2xl font-bold">{status === 404 ? 'Not found' : 'This page failed to load'}</h1>
      <p className="mt-2 text-ink-soft">{message}</p>
      <Link to="/" className="mt-6 inline-block font-semibold text-copper underline underline-offset-4">
        Back to the workbench
      </Link>
    </div>
  );
}
