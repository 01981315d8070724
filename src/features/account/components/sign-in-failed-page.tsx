import { useSearchParams } from 'react-router';
import { paths } from '../../../config/paths';
import { Page } from '../../../components/ui/page';
import { ButtonLink, buttonClass } from '../../../components/ui/button';

const reasons: Record<string, { heading: string; lead: string; retry: boolean }> = {
  state: {
    heading: 'That sign-in had expired',
    lead: 'The sign-in started in another tab, or took too long, so we could not be sure it was yours. Nothing happened to your account; start again.',
    retry: true,
  },
  provider: {
    heading: 'The sign-in provider did not confirm you',
    lead: 'Its answer was refused or never arrived, so you are not signed in. This is usually brief; try again in a moment.',
    retry: true,
  },
  denied: {
    heading: 'Sign-in cancelled',
    lead: 'You chose not to sign in. You can keep reading every swap without an account.',
    retry: true,
  },
  link: {
    heading: 'That sign-in link no longer works',
    lead: 'A sign-in link works once, for a short time. This one has been used, has run out, or was not copied whole. Ask for a new one.',
    retry: true,
  },
  suspended: {
    heading: 'This account is suspended',
    lead: 'An admin has suspended this account, so it cannot sign in. If you think this is a mistake, contact the Swapyard moderators.',
    retry: false,
  },
};

const unknown = { heading: 'Sign-in did not work', lead: 'Something went wrong while signing you in. Try again.', retry: true };

/** Where a failed sign-in lands: `/signin-failed?reason=state|provider|denied|link|suspended`. */
export default function SignInFailedPage() {
  const [params] = useSearchParams();
  const r = reasons[params.get('reason') ?? ''] ?? unknown;
  return (
    <Page title="Sign-in did not work" heading={r.heading} lead={r.lead}>
      <div className="flex flex-wrap gap-3">
        {r.retry && (
          <a href={paths.signIn(paths.home())} className={buttonClass('primary')}>
            Try signing in again
          </a>
        )}
        <ButtonLink to={paths.home()} variant="secondary">
          Back to the start page
        </ButtonLink>
      </div>
    </Page>
  );
}
