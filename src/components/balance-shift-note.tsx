import type { BalanceShift } from '@shared/fitment/swap-checks';

const tone = {
  hazard: 'border-oxide bg-oxide-soft',
  advisory: 'border-brass bg-brass-soft/50',
  none: 'border-ink/20 bg-ink-faint/60',
} as const;

const word = { hazard: 'Check before driving', advisory: 'Worth knowing', none: 'No concern' } as const;

/**
 * What a change of brake balance means, in the same words on the swap sheet, the calculator and the
 * review desk: the direction, the figures, and what it risks.
 */
export function BalanceShiftNote({ shift }: { shift: BalanceShift }) {
  return (
    <div
      className={`rounded-lg border-l-4 p-3 print:py-1.5 ${tone[shift.severity]}`}
      data-balance={shift.direction}
      data-severity={shift.severity}
    >
      <p className="text-xs font-extrabold uppercase tracking-wide text-graphite-soft">{word[shift.severity]}</p>
      <p className="tabular mt-1 font-extrabold text-graphite print:text-sm">{shift.headline}</p>
      {/* the printed build sheet has room for the risk only where it is a hazard */}
      <p className={`mt-1 text-sm text-graphite ${shift.severity === 'hazard' ? '' : 'print:hidden'}`}>{shift.risk}</p>
      <p className="mt-1 text-xs text-graphite-soft print:hidden">Rule: {shift.rule}</p>
    </div>
  );
}
