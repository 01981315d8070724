import { useEffect, useId, useRef, useState } from 'react';
import { Link, useLocation } from 'react-router';
import { can, roleLabels, type Permission } from '@shared/roles';
import type { MeUser } from '@shared/schemas/me';
import { paths } from '../../../config/paths';
import { useMe } from '../api/get-me';
import { useSignOut } from '../api/sign-out';

type MenuLink = { to: string; label: string; need?: Permission };

const links: MenuLink[] = [
  { to: paths.mySubmissions(), label: 'My submissions', need: 'submit' },
  { to: paths.myCars(), label: 'My cars' },
  { to: paths.myFollowing(), label: 'Following' },
  { to: paths.myPlans(), label: 'My plans' },
  { to: paths.review(), label: 'Review desk', need: 'review' },
  { to: paths.reportModeration(), label: 'Fitted reports to check', need: 'review' },
  { to: paths.outbox(), label: 'Outbox', need: 'review' },
  { to: paths.shopLinks(), label: 'Shop links', need: 'manage_shop_links' },
  { to: paths.admin(), label: 'Admin', need: 'manage_users' },
  { to: paths.adminCatalogue(), label: 'Catalogue', need: 'manage_catalogue' },
];

export function initialsOf(user: { name: string; login: string }) {
  const words = (user.name || user.login).split(/[\s_-]+/).filter(Boolean);
  return words
    .slice(0, 2)
    .map((w) => w[0]!.toUpperCase())
    .join('');
}

export function Avatar({ user, size = 'h-8 w-8' }: { user: Pick<MeUser, 'name' | 'login' | 'avatarUrl'>; size?: string }) {
  const [broken, setBroken] = useState(false);
  if (user.avatarUrl && !broken) {
    return (
      <img src={user.avatarUrl} alt="" className={`${size} shrink-0 rounded-full object-cover`} onError={() => setBroken(true)} />
    );
  }
  return (
    <span
      aria-hidden
      className={`${size} grid shrink-0 place-items-center rounded-full bg-brass-soft text-xs font-extrabold text-brass-deep`}
    >
      {initialsOf(user)}
    </span>
  );
}

/** The header's account corner: a sign-in link, or the member's menu with the pages their role opens. */
export function AccountMenu() {
  const { data, isPending } = useMe();
  const location = useLocation();
  const user = data?.user ?? null;

  if (isPending) return <span className="inline-block h-9 w-24" aria-hidden />;
  if (!user) {
    // a full page load: sign-in runs through the server, not the client router
    return (
      <a
        href={paths.signIn(location.pathname + location.search)}
        className="inline-flex min-h-9 items-center rounded-md bg-paper px-3 py-1.5 text-sm font-bold text-ink hover:bg-brass-soft"
      >
        Sign in
      </a>
    );
  }
  return <SignedInMenu user={user} />;
}

function SignedInMenu({ user }: { user: MeUser }) {
  const [open, setOpen] = useState(false);
  const panelId = useId();
  const wrapper = useRef<HTMLDivElement>(null);
  const button = useRef<HTMLButtonElement>(null);
  const signOut = useSignOut();

  useEffect(() => {
    if (!open) return;
    const onPointer = (e: PointerEvent) => {
      if (!wrapper.current?.contains(e.target as Node)) setOpen(false);
    };
    const onKey = (e: KeyboardEvent) => {
      if (e.key === 'Escape') {
        setOpen(false);
        button.current?.focus();
      }
    };
    document.addEventListener('pointerdown', onPointer);
    document.addEventListener('keydown', onKey);
    return () => {
      document.removeEventListener('pointerdown', onPointer);
      document.removeEventListener('keydown', onKey);
    };
  }, [open]);

  const visible = links.filter((l) => !l.need || can(user.role, l.need));

  return (
    <div
      ref={wrapper}
      className="relative"
      onBlur={(e) => {
        if (open && !e.currentTarget.contains(e.relatedTarget as Node | null)) setOpen(false);
      }}
    >
      <button
        ref={button}
        type="button"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpen((o) => !o)}
        className="flex min-h-9 items-center gap-2 rounded-full py-1 pl-1 pr-2 text-sm font-bold text-paper hover:bg-paper/15"
      >
        <Avatar user={user} />
        <span className="hidden max-w-[10rem] truncate sm:inline">{user.name || user.login}</span>
        <span className="sr-only">{` (${roleLabels[user.role]}) account menu`}</span>
        <svg viewBox="0 0 20 20" className={`h-4 w-4 transition-transform ${open ? 'rotate-180' : ''}`} aria-hidden>
          <path d="M5 8l5 5 5-5" fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
        </svg>
      </button>
      {open && (
        <div
          id={panelId}
          className="absolute right-0 z-40 mt-2 w-64 max-w-[calc(100vw-2rem)] rounded-lg border border-graphite/15 bg-paper-card p-2 text-graphite shadow-lg"
        >
          <div className="flex items-center gap-3 border-b border-graphite/10 px-2 pb-3 pt-1">
            <Avatar user={user} size="h-10 w-10" />
            <div className="min-w-0">
              <p className="truncate font-bold text-ink">{user.name || user.login}</p>
              <p className="truncate text-xs text-graphite-soft">@{user.login}</p>
              <p className="mt-1 flex flex-wrap items-center gap-1">
                <span className="inline-flex rounded-full bg-ink-faint px-2 py-0.5 text-xs font-bold text-ink">
                  {roleLabels[user.role]}
                </span>
                {user.shop && <span className="truncate text-xs text-graphite-soft">{user.shop.name}</span>}
              </p>
            </div>
          </div>
          <nav aria-label="Account">
            <ul className="py-1">
              {visible.map((l) => (
                <li key={l.to}>
                  <Link
                    to={l.to}
                    className="block rounded-md px-3 py-2 text-sm font-semibold hover:bg-ink-faint focus-visible:bg-ink-faint"
                    onClick={() => setOpen(false)}
                  >
                    {l.label}
                  </Link>
                </li>
              ))}
            </ul>
          </nav>
          <div className="border-t border-graphite/10 pt-1">
            <button
              type="button"
              className="block w-full rounded-md px-3 py-2 text-left text-sm font-bold text-oxide hover:bg-oxide-soft disabled:opacity-60"
              disabled={signOut.isPending}
              onClick={() => signOut.mutate('here')}
            >
              {signOut.isPending && signOut.variables === 'here' ? 'Signing out…' : 'Sign out'}
            </button>
            <button
              type="button"
              className="block w-full rounded-md px-3 py-2 text-left text-sm font-semibold text-graphite hover:bg-oxide-soft disabled:opacity-60"
              disabled={signOut.isPending}
              onClick={() => signOut.mutate('everywhere')}
            >
              {signOut.isPending && signOut.variables === 'everywhere' ? 'Signing out everywhere…' : 'Sign out everywhere'}
              <span className="block text-xs font-normal text-graphite-soft">Ends your sessions on every device</span>
            </button>
            {signOut.error && (
              <p role="alert" className="px-3 pb-2 text-xs font-semibold text-oxide">
                {signOut.error.message}
              </p>
            )}
          </div>
        </div>
      )}
    </div>
  );
}
