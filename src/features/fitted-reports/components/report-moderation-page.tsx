import { useState } from 'react';
import { Link } from 'react-router';
import type { ModerationReportItem } from '@shared/schemas/fitted-reports';
import { trustLevelLabels } from '@shared/trust';
import { Page } from '../../../components/ui/page';
import { Badge } from '../../../components/ui/badge';
import { ErrorNotice, Loading } from '../../../components/ui/query-state';
import { paths } from '../../../config/paths';
import { useModerationReports } from '../api/fitted-reports';
import { ModerateReport, ReportEvidence, useWheelText } from './fitted-reports-section';
import { formatDate } from '@shared/dates';

/**
 * Fitted reports for moderators: those new members wrote, waiting to go live (the longest waiting first),
 * and those hidden, to restore one hidden by mistake.
 */
export default function ReportModerationPage() {
  const [show, setShow] = useState<'held' | 'hidden'>('held');
  const query = useModerationReports(show);
  const counts = query.data?.counts;
  return (
    <Page
      title="Fitted reports to check"
      heading="Fitted reports to check"
      lead="Reports from members who are new here wait for a moderator before they show on a sheet or count toward its verification. Let a report go live when its wheel, clearance and photo make sense for the swap; hide it when they do not."
    >
      <p className="mb-4 text-sm">
        <Link to={paths.review()} className="font-bold text-ink underline">
          ← Back to the review desk
        </Link>
      </p>
      <div role="tablist" aria-label="Which reports" className="mb-5 flex flex-wrap gap-2">
        {(['held', 'hidden'] as const).map((s) => (
          <button
            key={s}
            type="button"
            role="tab"
            aria-selected={show === s}
            onClick={() => setShow(s)}
            className={`min-h-10 rounded-md border px-4 text-sm font-bold ${show === s ? 'border-ink bg-ink text-paper' : 'border-ink/30 bg-paper-card text-ink hover:bg-ink-faint'}`}
          >
            {s === 'held' ? 'Waiting' : 'Hidden'}
            {counts && <span className="tabular ml-1">({counts[s]})</span>}
          </button>
        ))}
      </div>
      {query.isPending ? (
        <Loading label="Loading the reports…" />
      ) : query.isError ? (
        <ErrorNotice error={query.error} />
      ) : query.data.items.length === 0 ? (
        <p className="text-graphite-soft">{show === 'held' ? 'No report is waiting.' : 'No report is hidden.'}</p>
      ) : (
        <ul className="grid gap-4 md:grid-cols-2" aria-label={show === 'held' ? 'Reports waiting' : 'Hidden reports'}>
          {query.data.items.map((r) => (
            <li key={r.id}>
              <ModerationCard report={r} />
            </li>
          ))}
        </ul>
      )}
    </Page>
  );
}

function ModerationCard({ report }: { report: ModerationReportItem }) {
  const wheelText = useWheelText();
  return (
    <article className="flex h-full gap-3 rounded-xl border border-ink/15 bg-paper-card p-4">
      {report.photo && (
        <a href={report.photo.url} target="_blank" rel="noopener" className="shrink-0">
          <img
            src={report.photo.thumbUrl}
            alt={`Photo from ${report.member.name}`}
            loading="lazy"
            className="h-24 w-24 rounded-md bg-paper-deep object-cover"
          />
        </a>
      )}
      <div className="min-w-0 flex-1 text-sm">
        <h2 className="font-extrabold text-ink">
          <Link to={`${paths.swap(report.swap.slug)}#fitted`} className="underline decoration-brass underline-offset-2">
            {report.swap.title}
          </Link>
        </h2>
        <p className="mt-1 flex flex-wrap items-center gap-x-2 gap-y-1">
          <strong>{report.member.name}</strong>
          <Badge tone={report.memberTrust === 'new' ? 'brass' : 'ink'}>{trustLevelLabels[report.memberTrust]}</Badge>
          <span className="text-graphite-soft">
            revision {report.revisionNumber} · {formatDate(report.updatedAt)}
          </span>
        </p>
        <p className="tabular mt-1 font-bold">{wheelText(report.wheel)}</p>
        <ReportEvidence report={report} />
        {report.note && <p className="mt-1 whitespace-pre-line break-words text-graphite">{report.note}</p>}
        {report.hidden && <p className="mt-1 text-xs font-bold text-oxide">Hidden by a moderator</p>}
        <ModerateReport report={report} slug={report.swap.slug} />
      </div>
    </article>
  );
}
