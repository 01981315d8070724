import { Link } from 'react-router';
import { paths } from '../../../config/paths';
import { useModerationReports } from '../api/fitted-reports';

/** The desk's line about fitted reports: how many wait for a moderator, with the way to them. */
export function HeldReportsSummary() {
  const query = useModerationReports('held');
  const counts = query.data?.counts;
  return (
    <section aria-labelledby="held-reports-h" className="mx-auto w-full max-w-sheet px-4 pb-10 sm:px-6">
      <div className="rounded-xl border border-brass/40 bg-paper-card p-4">
        <h2 id="held-reports-h" className="text-xl font-extrabold text-ink">
          Fitted reports to check {counts && <span className="tabular text-graphite-soft">({counts.held})</span>}
        </h2>
        <p className="mt-1 text-sm text-graphite">
          {counts
            ? counts.held === 0
              ? 'No report from a new member is waiting.'
              : `${counts.held} ${counts.held === 1 ? 'report from a new member waits' : 'reports from new members wait'} before ${counts.held === 1 ? 'it shows' : 'they show'} on a sheet.`
            : 'Reports from new members wait for a moderator before they show on a sheet.'}{' '}
          {counts && counts.hidden > 0 && `${counts.hidden} hidden.`}{' '}
          <Link to={paths.reportModeration()} className="font-bold text-ink underline">
            Open the reports
          </Link>
        </p>
      </div>
    </section>
  );
}
