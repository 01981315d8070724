import type { ReactNode } from 'react';
import { ApiError } from '../../lib/api-client';
import { ButtonLink } from './button';

export function Loading({ label = 'Loading…' }: { label?: string }) {
  return (
    <div role="status" className="flex items-center gap-3 py-10 text-graphite-soft">
      <span className="h-4 w-4 animate-spin rounded-full border-2 border-ink border-t-transparent" aria-hidden />
      {label}
    </div>
  );
}

/** How a failed query reads to a person: 404s as "not here", the rest with the server's message. */
export function ErrorNotice({ error, children }: { error: unknown; children?: ReactNode }) {
  const notFound = error instanceof ApiError && error.status === 404;
  const message = error instanceof Error ? error.message : 'Something went wrong.';
  return (
    <div role="alert" className="my-8 rounded-lg border border-oxide/40 bg-paper-card p-6">
      <h1 className="text-xl font-extrabold text-ink">{notFound ? 'Not in the yard' : 'That did not work'}</h1>
      <p className="mt-2 text-graphite">{message}</p>
      <div className="mt-4 flex flex-wrap gap-3">
        {children}
        <ButtonLink to="/search" variant="secondary">
          Search all swaps
        </ButtonLink>
      </div>
    </div>
  );
}
