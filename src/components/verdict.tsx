import type { ReactNode } from 'react';
import type { ClearanceFigure } from '@shared/fitment/swap-checks';
import { useUnits } from '../lib/units';

export type VerdictProps = {
  label: string;
  /** true pass, false fail, null when advisory only (a rule of thumb is never a hard pass/fail) */
  ok: boolean | null;
  value: ReactNode;
  margin?: ReactNode;
  rule?: string;
  note?: ReactNode;
  /** the pass/fail words, for checks that are not about clearance (default "Clears" / "Does not clear") */
  words?: { pass: string; fail: string };
};

/** One computed check: what was checked, the figure, pass/fail with the margin, and the rule it applied. */
export function Verdict({ label, ok, value, margin, rule, note, words }: VerdictProps) {
  const tone =
    ok === null ? 'border-brass/50 bg-brass-soft/40' : ok ? 'border-ink/30 bg-ink-faint/60' : 'border-oxide/50 bg-oxide-soft';
  const word = ok === null ? 'Advisory' : ok ? (words?.pass ?? 'Clears') : (words?.fail ?? 'Does not clear');
  return (
    <div className={`rounded-lg border p-3 ${tone}`} data-verdict={ok === null ? 'advisory' : ok ? 'pass' : 'fail'}>
      <div className="flex items-baseline justify-between gap-3">
        <p className="text-sm font-bold text-graphite">{label}</p>
        <p
          className={`text-xs font-extrabold uppercase tracking-wide ${ok === null ? 'text-brass-deep' : ok ? 'text-ink' : 'text-oxide'}`}
        >
          <span aria-hidden>{ok === null ? '◇ ' : ok ? '✓ ' : '✕ '}</span>
          {word}
        </p>
      </div>
      <p className="tabular mt-1 text-xl font-extrabold text-graphite">{value}</p>
      {margin !== undefined && <p className="tabular text-sm text-graphite-soft">Margin: {margin}</p>}
      {note && <p className="mt-1 text-sm text-graphite-soft">{note}</p>}
      {rule && <p className="mt-1 text-xs text-graphite-soft">Rule: {rule}</p>}
    </div>
  );
}

/** A figure without a verdict (new offset, track change…). */
export function Figure({ label, value, note }: { label: string; value: ReactNode; note?: ReactNode }) {
  return (
    <div className="rounded-lg border border-graphite/15 bg-paper-card p-3">
      <p className="text-sm font-bold text-graphite">{label}</p>
      <p className="tabular mt-1 text-xl font-extrabold text-graphite">{value}</p>
      {note && <p className="mt-1 text-xs text-graphite-soft">{note}</p>}
    </div>
  );
}

/**
 * A figure carried over from another wheel or a rule of thumb: it names its basis and carries no
 * pass or fail, so nobody takes it for a measurement.
 */
export function Estimate({ label, value, basis }: { label: string; value: ReactNode; basis: ReactNode }) {
  return (
    <div className="rounded-lg border border-dashed border-graphite/40 bg-paper p-3" data-verdict="estimate">
      <div className="flex items-baseline justify-between gap-3">
        <p className="text-sm font-bold text-graphite">{label}</p>
        <p className="text-xs font-extrabold uppercase tracking-wide text-graphite-soft">
          <span aria-hidden>≈ </span>Estimate
        </p>
      </div>
      <p className="tabular mt-1 text-xl font-extrabold text-graphite-soft">≈ {value}</p>
      <p className="mt-1 text-sm text-graphite-soft">{basis}</p>
    </div>
  );
}

/** A measured clearance gets a verdict against its rule; an estimate shows its basis and none. */
export function ClearanceCard({ label, figure }: { label: string; figure: ClearanceFigure }) {
  const units = useUnits();
  if (figure.basis === 'estimated') return <Estimate label={label} value={units.length(figure.clearanceMm)} basis={figure.basisNote} />;
  return (
    <Verdict
      label={label}
      ok={figure.ok}
      value={units.length(figure.clearanceMm)}
      margin={`${figure.marginMm >= 0 ? '+' : '−'}${units.length(Math.abs(figure.marginMm))}`}
      rule={figure.rule}
      note={figure.basisNote}
    />
  );
}
