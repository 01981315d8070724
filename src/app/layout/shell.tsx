import { Suspense, useState } from 'react';
import { Link, NavLink, Outlet, ScrollRestoration, useLocation } from 'react-router';
import { UnitsToggle } from '../../components/units-toggle';
import { Footer } from './footer';
import { Loading } from '../../components/ui/query-state';
import { AccountMenu } from '../../features/account/components/account-menu';
import { AdoptDevicePlans } from '../../features/plans/components/adopt-device-plans';
import { useMe } from '../../features/account/api/get-me';
import { OfflineBanner } from '../../features/offline/components/offline-banner';

const nav = [
  { to: '/search', label: 'Find a swap' },
  { to: '/where-else', label: 'Where else' },
  { to: '/tools', label: 'Calculators' },
  { to: '/submit', label: 'Record a swap' },
];

function Logo() {
  return (
    <Link to="/" className="flex items-center gap-2 text-lg font-extrabold tracking-tight text-paper">
      <svg viewBox="0 0 64 64" className="h-8 w-8" aria-hidden>
        <circle cx="32" cy="32" r="19" fill="none" stroke="currentColor" strokeWidth="5" />
        <circle cx="32" cy="32" r="6" fill="#b8892f" />
        <path d="M32 8v9M32 47v9M8 32h9M47 32h9" stroke="#b8892f" strokeWidth="5" strokeLinecap="round" />
      </svg>
      Swapyard
    </Link>
  );
}

/** The frame of every page; `loading` while the first page's module arrives. */
export function Shell({ loading = false }: { loading?: boolean }) {
  const [open, setOpen] = useState(false);
  const location = useLocation();
  const me = useMe();
  const linkClass = ({ isActive }: { isActive: boolean }) =>
    `rounded-md px-3 py-2 text-sm font-bold ${isActive ? 'bg-paper/15 text-paper' : 'text-paper/85 hover:text-paper'}`;
  return (
    <div className="flex min-h-screen flex-col">
      <AdoptDevicePlans signedIn={Boolean(me.data?.user)} />
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-paper focus:px-3 focus:py-2"
      >
        Skip to content
      </a>
      <header className="no-print bg-ink text-paper">
        <div className="mx-auto flex max-w-sheet items-center gap-3 px-4 py-3 sm:px-6">
          <Logo />
          <nav aria-label="Main" className="ml-4 hidden items-center gap-1 md:flex">
            {nav.map((n) => (
              <NavLink key={n.to} to={n.to} className={linkClass}>
                {n.label}
              </NavLink>
            ))}
          </nav>
          <div className="ml-auto flex items-center gap-2">
            <span className="hidden sm:block">
              <UnitsToggle />
            </span>
            <AccountMenu />
            <button
              type="button"
              className="rounded-md p-2 md:hidden"
              aria-expanded={open}
              aria-controls="mobile-nav"
              onClick={() => setOpen((o) => !o)}
            >
              <span className="sr-only">Menu</span>
              <svg viewBox="0 0 24 24" className="h-6 w-6" aria-hidden>
                <path d="M4 7h16M4 12h16M4 17h16" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
              </svg>
            </button>
          </div>
        </div>
        {open && (
          <nav id="mobile-nav" aria-label="Main" className="border-t border-paper/15 px-4 pb-4 md:hidden" key={location.pathname}>
            <ul className="flex flex-col gap-1 pt-2">
              {nav.map((n) => (
                <li key={n.to}>
                  <NavLink to={n.to} className={linkClass} onClick={() => setOpen(false)}>
                    {n.label}
                  </NavLink>
                </li>
              ))}
            </ul>
            <div className="mt-3">
              <UnitsToggle />
            </div>
          </nav>
        )}
      </header>
      <OfflineBanner />
      <main id="main" className="flex-1">
        <Suspense
          fallback={
            <div className="mx-auto max-w-sheet px-4">
              <Loading />
            </div>
          }
        >
          {loading ? (
            <div className="mx-auto max-w-sheet px-4">
              <Loading />
            </div>
          ) : (
            <Outlet />
          )}
        </Suspense>
      </main>
      <Footer />
      <ScrollRestoration />
    </div>
  );
}
