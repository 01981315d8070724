import type { WheelCheckSummary } from '@shared/fitment/swap-checks';
import { VerdictIcon } from '../../../components/ui/icons';
import { useUnits } from '../../../lib/units';

const lineTone = {
  fail: 'border-oxide bg-oxide text-paper-card',
  pass: 'border-ink bg-ink text-paper-card',
  open: 'border-brass bg-brass-soft text-graphite',
  none: 'border-ink/20 bg-paper-card text-graphite-soft',
};

/**
 * The check's verdict in one line above the form, so a reader on a phone sees it while typing. A pass or a
 * failure only comes from a measurement (the summary's rule); an estimate reads "Not settled".
 */
export function VerdictLine({ summary, error }: { summary: WheelCheckSummary | null; error: string | null }) {
  const tone = error ? 'fail' : (summary?.tone ?? 'none');
  const text = error ?? summary?.headline ?? 'Enter your wheel for a verdict';
  return (
    <p
      className={`mb-3 flex min-h-10 items-center gap-2 rounded-lg border px-3 text-sm font-extrabold ${lineTone[tone]}`}
      data-testid="wheel-verdict"
      data-tone={tone}
    >
      <VerdictIcon tone={tone} />
      <span className="min-w-0 truncate" title={text}>
        {text}
      </span>
    </p>
  );
}

const summaryTone = {
  fail: 'border-oxide bg-oxide-soft text-oxide',
  pass: 'border-ink/30 bg-ink-faint text-ink',
  open: 'border-brass bg-brass-soft/50 text-graphite',
};

export function SummaryLine({ summary }: { summary: WheelCheckSummary }) {
  const units = useUnits();
  return (
    <p className={`rounded-lg border px-3 py-2 text-sm font-bold ${summaryTone[summary.tone]}`} data-testid="wheel-summary">
      {summary.text}
      {summary.leastClearanceMm !== undefined && ` Least clearance ${units.length(summary.leastClearanceMm)}.`}
    </p>
  );
}
