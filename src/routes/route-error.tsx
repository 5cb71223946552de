import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { paths } from '@/lib/paths';

/** Shown by the router when a screen fails to render or load; the rest of the app stays usable. */
export function RouteErrorScreen() {
  const error = useRouteError();
  const detail = isRouteErrorResponse(error)
    ? `${error.status} ${error.statusText}`
    : error instanceof Error
      ? error.message
      : 'Unknown problem';
  return (
    <div
      role="alert"
      className="m-4 max-w-xl sm:m-10 space-y-3 rounded-card border border-brick-500/40 bg-brick-100 p-6"
    >
      <h1 className="text-title font-black text-brick-700">This screen ran into a problem</h1>
      <p className="text-body text-brick-700">{detail}</p>
      <p className="text-body text-ink-800">Nothing you saved is lost. Try again, or go back to the overview.</p>
      <div className="flex gap-3">
        <button
          type="button"
          onClick={() => window.location.reload()}
          className="rounded-md bg-ink-800 px-4 py-2 font-bold text-paper-50 hover:bg-ink-700"
        >
          Reload
        </button>
        <Link to={paths.overview()} className="rounded-md border border-ink-300 px-4 py-2 font-bold text-ink-800">
          Overview
        </Link>
      </div>
    </div>
  );
}
