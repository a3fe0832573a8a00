import { isRouteErrorResponse, Link, useRouteError } from 'react-router';
import { ErrorNote } from './QueryState.js';

/** Shown when a loader or a page throws. */
export function RouteError() {
  const error = useRouteError();
  const notFound = isRouteErrorResponse(error) && error.status === 404;
  return (
    <div className="mx-auto max-w-xl space-y-4 p-8">
      <h1 className="text-xl font-semibold">
        {notFound ? 'Page not found' : 'This page could not be shown'}
      </h1>
      {!notFound && <ErrorNote error={isRouteErrorResponse(error) ? new Error(error.statusText) : error} />}
      <Link to="/designs" className="text-glow underline">
        Back to designs
      </Link>
    </div>
  );
}
