import { Link } from 'react-router';
import { paths } from '../../../config/paths';
import { Page } from '../../../components/ui/page';
import { ErrorNotice, Loading } from '../../../components/ui/query-state';
import { useMyPlans } from '../api/plans';
import { formatDate } from '@shared/dates';

const dateText = (iso: string) => formatDate(iso);

export default function MyPlansPage() {
  const plans = useMyPlans(true);
  return (
    <Page
      title="My plans"
      heading="My plans"
      lead="Swaps for a whole car, computed together. Start one from any swap sheet with “Add this swap to the plan”."
    >
      {plans.isPending ? (
        <Loading label="Loading your plans…" />
      ) : plans.isError ? (
        <ErrorNotice error={plans.error} />
      ) : plans.data.length === 0 ? (
        <p className="text-graphite">No plans yet.</p>
      ) : (
        <ul className="grid gap-2">
          {plans.data.map((p) => (
            <li key={p.id} className="rounded-lg border border-ink/15 bg-paper-card p-3">
              <Link to={paths.plan(p.id)} className="font-extrabold text-ink underline">
                {p.title}
              </Link>
              <p className="text-sm text-graphite-soft">
                {p.chassis.make} {p.chassis.model}
                {p.carNickname && ` · ${p.carNickname}`} · {p.swapCount} swaps · changed {dateText(p.updatedAt)}
              </p>
            </li>
          ))}
        </ul>
      )}
    </Page>
  );
}
