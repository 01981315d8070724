import { isRouteErrorResponse, useRouteError } from 'react-router';

/** Shown when a page crashes or a route module fails to load (e.g. after a new release). */
export function RouteError() {
  const error = useRouteError();
  const message = isRouteErrorResponse(error)
    ? `${error.status} ${error.statusText}`
    : error instanceof Error
      ? error.message
      : 'Unknown error';
  return (
    <div className="mx-auto max-w-xl px-4 py-16">
      <h1 className="text-2xl font-extrabold text-ink">This page hit a snag</h1>
      <p className="mt-2 text-graphite">Reloading usually helps. If it keeps happening, tell us what you clicked.</p>
      <p className="mt-4 rounded bg-paper-deep p-3 font-mono text-xs text-graphite-soft">{message}</p>
      <a href="/" className="mt-6 inline-block font-bold text-ink underline">
        Back to the start
      </a>
    </div>
  );
}
