import { useState, type FormEvent } from 'react';
import { useSearchParams } from 'react-router';
import { Page } from '../../../components/ui/page';
import { Button, buttonClass } from '../../../components/ui/button';
import { TextInput } from '../../../components/ui/field';
import { ApiError } from '../../../lib/api-client';
import { paths } from '../../../config/paths';
import { useEmailSignIn } from '../api/email-sign-in';

/** `/signin?returnTo=…`: the two ways in — the code-hosting account, or a one-time link by e-mail. */
export default function SignInPage() {
  const [params] = useSearchParams();
  const returnTo = params.get('returnTo') ?? paths.home();
  const [email, setEmail] = useState('');
  const ask = useEmailSignIn();
  const fieldError = ask.error instanceof ApiError ? (ask.error.fields.email ?? ask.error.message) : undefined;

  const submit = (e: FormEvent) => {
    e.preventDefault();
    ask.mutate({ email, returnTo });
  };

  return (
    <Page title="Sign in" heading="Sign in to Swapyard" lead="Reading needs no account. Sign in to record swaps, report fitting one, keep your cars and follow a chassis.">
      <div className="grid max-w-3xl gap-6 md:grid-cols-2">
        <section aria-labelledby="email-h" className="rounded-xl border border-ink/15 bg-paper-card p-5">
          <h2 id="email-h" className="text-lg font-extrabold text-ink">
            With your e-mail address
          </h2>
          {ask.isSuccess ? (
            <div role="status" className="mt-3 space-y-2 text-sm text-graphite" data-testid="link-sent">
              <p className="font-bold">Look in your inbox for a message from Swapyard.</p>
              <p>
                If {email.trim()} can receive mail, a sign-in link is on its way. It works once, for {ask.data.minutes} minutes, in any
                browser — on this computer or your phone.
              </p>
              <Button variant="quiet" onClick={() => ask.reset()}>
                Use another address
              </Button>
            </div>
          ) : (
            <form className="mt-3 space-y-3" onSubmit={submit} noValidate>
              <p className="text-sm text-graphite-soft">
                No password and no other account needed: we send a one-time link. A new address becomes a member account.
              </p>
              <TextInput
                label="E-mail address"
                type="email"
                autoComplete="email"
                inputMode="email"
                value={email}
                onChange={(e) => setEmail(e.target.value)}
                error={fieldError}
                required
              />
              <Button type="submit" disabled={ask.isPending || email.trim() === ''}>
                {ask.isPending ? 'Sending…' : 'E-mail me a sign-in link'}
              </Button>
            </form>
          )}
        </section>
        <section aria-labelledby="provider-h" className="rounded-xl border border-ink/15 bg-paper-card p-5">
          <h2 id="provider-h" className="text-lg font-extrabold text-ink">
            With a GitHub account
          </h2>
          <p className="mt-3 text-sm text-graphite-soft">
            If you have one, sign in with it; an account made by e-mail joins it when both use the same address.
          </p>
          <a href={paths.providerSignIn(returnTo)} className={`${buttonClass('secondary')} mt-3`}>
            Continue with GitHub
          </a>
        </section>
      </div>
    </Page>
  );
}
