import type { ReactNode } from 'react';

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
