import { useEffect, type ReactNode } from 'react';
import { useLocation } from 'react-router';
import { can, roleLabels, type Permission, type Role } from '@shared/roles';
import { paths } from '../../../config/paths';
import { Page } from '../../../components/ui/page';
import { ButtonLink, buttonClass } from '../../../components/ui/button';
import { ErrorNotice, Loading } from '../../../components/ui/query-state';
import { useMe } from '../api/get-me';

type Props = {
  children: ReactNode;
  /** the page needs this permission (`can()` from shared/roles) */
  permission?: Permission;
  /** or one of these roles */
  roles?: Role[];
  /** what the page is called, for the messages */
  what?: string;
};

/**
 * Guards a page in the client: a signed-out visitor goes to sign in and comes back here;
 * a signed-in account without the role reads a polite refusal. The server checks again.
 */
export function RequireSignedIn({ children, permission, roles, what = 'this page' }: Props) {
  const { data, isPending, error } = useMe();
  const location = useLocation();
  const signInHref = paths.signIn(location.pathname + location.search + location.hash);
  const user = data?.user ?? null;

  useEffect(() => {
    if (!isPending && !error && !user) window.location.assign(signInHref);
  }, [isPending, error, user, signInHref]);

  if (isPending) return <Loading />;
  if (error) return <ErrorNotice error={error} />;
  if (!user) {
    return (
      <Page
        title="Sign in"
        heading="Sign in to continue"
        lead={`You need to be signed in to open ${what}. Taking you to sign-in…`}
      >
        <a href={signInHref} className={buttonClass('primary')}>
          Sign in
        </a>
      </Page>
    );
  }
  const allowed = (!permission || can(user.role, permission)) && (!roles || roles.includes(user.role));
  if (!allowed) {
    return (
      <Page
        title="Not for this account"
        heading="Your account cannot open this"
        lead={`You are signed in as ${user.login} (${roleLabels[user.role]}), and ${what} is for other roles. If you think your account should have access, ask an admin.`}
      >
        <ButtonLink to={paths.home()} variant="secondary">
          Back to the start page
        </ButtonLink>
      </Page>
    );
  }
  return <>{children}</>;
}
