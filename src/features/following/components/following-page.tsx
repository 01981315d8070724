import { Link } from 'react-router';
import { digestFrequencies, digestFrequencyLabels, type DigestFrequency, type FollowItem } from '@shared/schemas/following';
import { Page } from '../../../components/ui/page';
import { Loading, ErrorNotice } from '../../../components/ui/query-state';
import { Button } from '../../../components/ui/button';
import { paths } from '../../../config/paths';
import { useMyFollows, useSetFrequency, useStopFollow } from '../api/follows';
import { formatDate } from '@shared/dates';

/** What the member follows: each chassis or car, how often its digest comes, and a way to stop it. */
export default function FollowingPage() {
  const follows = useMyFollows();
  return (
    <Page
      title="Following"
      heading="What you follow"
      lead="Each chassis or car you follow sends you one e-mail digest of the swaps the review desk published for it — once a day or once a week, and only when something is new."
    >
      {follows.isPending ? (
        <Loading label="Loading what you follow…" />
      ) : follows.isError ? (
        <ErrorNotice error={follows.error} />
      ) : follows.data.length === 0 ? (
        <div className="rounded-lg border border-dashed border-ink/25 bg-paper-card p-6 text-graphite">
          <p>You follow nothing yet.</p>
          <p className="mt-2 text-sm">
            Open a chassis page and choose <strong>Follow</strong>, or follow one of{' '}
            <Link to={paths.myCars()} className="font-bold text-ink underline">
              your cars
            </Link>
            .
          </p>
        </div>
      ) : (
        <ul className="grid gap-3" aria-label="What you follow">
          {follows.data.map((f) => (
            <li key={f.id}>
              <FollowRow follow={f} />
            </li>
          ))}
        </ul>
      )}
      <p className="mt-8 max-w-2xl text-sm text-graphite-soft">
        Digests go out after 06:00 UTC; weekly ones on Mondays. Each e-mail carries a link that stops it in one click, without
        signing in.
      </p>
    </Page>
  );
}

function FollowRow({ follow }: { follow: FollowItem }) {
  const setFrequency = useSetFrequency();
  const stop = useStopFollow();
  const t = follow.target;
  const name = t.kind === 'car' ? t.car.nickname : t.chassis.label;
  const error = setFrequency.error ?? stop.error;
  return (
    <article
      aria-label={name}
      className="flex flex-wrap items-center gap-x-6 gap-y-3 rounded-xl border border-ink/10 bg-paper-card p-4 shadow-sm"
    >
      <div className="min-w-0 flex-1 basis-56">
        <p className="text-xs font-bold uppercase tracking-wide text-graphite-soft">{t.kind === 'car' ? 'My car' : 'Chassis'}</p>
        <h2 className="text-lg font-extrabold text-ink">
          {t.kind === 'car' ? (
            <Link to={paths.myCars()} className="underline decoration-brass underline-offset-2">
              {t.car.nickname}
            </Link>
          ) : (
            <Link to={paths.chassis(t.chassis.slug)} className="underline decoration-brass underline-offset-2">
              {t.chassis.label}
            </Link>
          )}
        </h2>
        {t.kind === 'car' && (
          <p className="text-sm text-graphite-soft">
            <Link to={paths.chassis(t.chassis.slug)} className="underline">
              {t.chassis.label}
            </Link>
          </p>
        )}
        <p className="tabular mt-1 text-xs text-graphite-soft">
          Next digest due {formatDate(follow.nextDigestAt)}, if anything is published
        </p>
      </div>
      <label className="flex items-center gap-2 text-sm font-bold text-graphite">
        E-mail me
        <select
          className="rounded-md border border-ink/30 bg-paper px-2 py-1.5 font-normal"
          value={follow.frequency}
          disabled={setFrequency.isPending}
          onChange={(e) => setFrequency.mutate({ id: follow.id, frequency: e.target.value as DigestFrequency })}
        >
          {digestFrequencies.map((f) => (
            <option key={f} value={f}>
              {digestFrequencyLabels[f].toLowerCase()}
            </option>
          ))}
        </select>
      </label>
      <Button variant="quiet" disabled={stop.isPending} onClick={() => stop.mutate(follow.id)}>
        Stop following
      </Button>
      {error && (
        <p role="alert" className="basis-full text-sm font-semibold text-oxide">
          {error.message}
        </p>
      )}
    </article>
  );
}
