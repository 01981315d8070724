import { useEffect, type ReactNode } from 'react';

/**
 * Sets the document title and gives the page its heading and width. A page still loading passes no title,
 * so the title the server wrote for the address stays until the page knows its own (the same words).
 */
export function Page({
  title,
  heading,
  lead,
  actions,
  children,
}: {
  title?: string;
  heading?: ReactNode;
  lead?: ReactNode;
  actions?: ReactNode;
  children: ReactNode;
}) {
  useEffect(() => {
    if (title) document.title = `${title} · Swapyard`;
  }, [title]);
  return (
    <div className="mx-auto w-full max-w-sheet px-4 py-6 sm:px-6 sm:py-10 print:max-w-none print:p-0">
      {(heading || actions) && (
        <header className="mb-6 flex flex-wrap items-end justify-between gap-4">
          <div>
            {heading && <h1 className="text-2xl font-extrabold tracking-tight text-ink sm:text-3xl">{heading}</h1>}
            {lead && <p className="mt-2 max-w-2xl text-graphite-soft">{lead}</p>}
          </div>
          {actions}
        </header>
      )}
      {children}
    </div>
  );
}
