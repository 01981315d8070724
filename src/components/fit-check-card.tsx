import type { FitCheck } from '@shared/fitment/fit-check';
import { Verdict } from './verdict';
import { useUnits } from '../lib/units';

export type CheckWords = Record<string, { pass: string; fail: string }>;

/** "+1.2 mm" / "−0.4 mm"; a figure that shows as zero gets no sign */
export function withSign(value: number, format: (abs: number) => string): string {
  const abs = format(Math.abs(value));
  if (abs === format(0)) return abs;
  return `${value > 0 ? '+' : '−'}${abs}`;
}

/** One rule-based check from shared/fitment: its figure, margin, the rule and where the rule comes from. */
export function FitCheckCard({ check, words, value }: { check: FitCheck; words?: CheckWords; value?: string }) {
  const { length } = useUnits();
  const shown = value ?? (check.valueMm === null ? (check.ok ? 'Match' : 'Mismatch') : length(check.valueMm, 2));
  return (
    <div data-check={check.id}>
      <Verdict
        label={check.label}
        ok={check.ok}
        words={words?.[check.id]}
        value={shown}
        margin={check.marginMm === null ? undefined : withSign(check.marginMm, (v) => length(v, 2))}
        rule={`${check.rule.replace(/ \(common practice\)$/, '')} — source: ${check.source}`}
      />
    </div>
  );
}
