import { useMemo } from 'react';
import { useWatch } from 'react-hook-form';
import type { ChassisView } from '@shared/schemas/views';
import { chassisFigures } from '@shared/schemas/vehicle';
import type { Axle, Category } from '@shared/schemas/enums';
import { automaticChecks } from '@shared/review-checks';
import { costRouteLabels, costRoutes } from '@shared/schemas/enums';
import { brakeBalanceOf, costSummaryOf, testedWheelVerdicts } from '@shared/fitment/swap-checks';
import { wheelOutcomeLabels } from '@shared/schemas/swap-data-labels';
import { BalanceShiftNote } from '../../../components/balance-shift-note';
import { FitmentInputError } from '@shared/fitment/errors';
import { Figure } from '../../../components/verdict';
import { formatMoney } from '@shared/money';
import { useUnits } from '../../../lib/units';
import { liveDataOf, type FormValues } from '../lib/form-values';

const pct = (share: number) => `${(share * 100).toFixed(1)} %`;

function attempt<T>(fn: () => T): { value: T } | { error: string } {
  try {
    return { value: fn() };
  } catch (err) {
    if (err instanceof FitmentInputError) return { error: err.message };
    throw err;
  }
}

const checkTone = { pass: 'text-ink', fail: 'text-oxide', attention: 'text-brass-deep' } as const;
const checkMark = { pass: '✓', fail: '✕', attention: '!' } as const;

/**
 * The figures a reviewer will see, computed from what is typed so far with the same
 * functions the swap sheet and the review desk use.
 */
export function LiveFigures({
  axle,
  category,
  wheelBoltThread,
  chassis,
  photoCount,
}: {
  axle: Axle | null;
  category: Category | null;
  wheelBoltThread: string | null;
  /** the chosen chassis: its stock figures say which axle locks first; its wheel fastening, when on record, is checked */
  chassis:
    (Pick<ChassisView, 'make' | 'model' | 'vehicle'> & Partial<Pick<ChassisView, 'centreBoreMm' | 'wheelFastening'>>) | null;
  photoCount: number;
}) {
  const values = useWatch<FormValues, 'data'>({ name: 'data' });
  const units = useUnits();
  const data = useMemo(() => liveDataOf(values), [values]);

  const wheel = data.wheel;
  const tried = testedWheelVerdicts(data);
  const figures = chassis ? chassisFigures(chassis) : null;
  const balance = data.brakes ? attempt(() => brakeBalanceOf(data, figures)) : null;
  const costs = data.costs.length ? costSummaryOf(data) : null;
  const checks = axle
    ? attempt(() =>
        automaticChecks({
          data,
          body: '',
          photoCount,
          chassis: {
            wheelBoltThread: wheelBoltThread ?? 'M12x1.5',
            figures,
            centreBoreMm: chassis?.centreBoreMm,
            wheelFastening: chassis?.wheelFastening ?? null,
          },
          axle,
          category: category ?? undefined,
          duplicates: [],
        }).filter((c) => c.id !== 'duplicate'),
      )
    : null;

  return (
    <section aria-labelledby="live-h" className="space-y-3" aria-live="polite">
      <h2 id="live-h" className="text-lg font-extrabold text-ink">
        Figures from your entries
      </h2>
      <p className="text-xs text-graphite-soft">Worked out as you type, the same way the swap sheet and the review desk do.</p>

      <h3 className="pt-1 text-sm font-extrabold uppercase tracking-wide text-graphite-soft">Wheels you tried</h3>
      {!wheel ? (
        <p className="text-sm text-graphite-soft">Fill in the wheel requirement and the wheels you tried.</p>
      ) : tried.length === 0 ? (
        <p className="text-sm text-graphite-soft">
          No wheel yet. Each wheel you measured, fitting or not, gets its figures held against the rule here.
        </p>
      ) : (
        <ul className="space-y-2 text-sm" data-testid="live-wheels">
          {tried.map((w) => (
            <li key={w.index} className="rounded-lg border border-graphite/15 bg-paper-card p-2">
              <p className="font-bold">
                {w.label} · {wheelOutcomeLabels[w.outcome].toLowerCase()}
              </p>
              {w.figures.length === 0 && <p className="text-xs text-graphite-soft">No clearance measured.</p>}
              {w.figures.map((f) => (
                <p key={f.where} className={`tabular text-xs ${f.ok ? 'text-ink' : 'text-oxide'}`}>
                  <span aria-hidden>{f.ok ? '✓ ' : '✕ '}</span>
                  {f.where === 'barrel' ? 'Barrel' : 'Spokes'} {units.length(f.clearanceMm)} ({f.ok ? 'at least' : 'under'} 3 mm,
                  rule of thumb)
                </p>
              ))}
              {w.contradiction && <p className="text-xs font-bold text-oxide">{w.contradiction}</p>}
            </li>
          ))}
        </ul>
      )}

      <h3 className="pt-2 text-sm font-extrabold uppercase tracking-wide text-graphite-soft">Brake balance</h3>
      {!balance ? (
        <p className="text-sm text-graphite-soft">Fill in the brake figures before and after to see the front share.</p>
      ) : 'error' in balance ? (
        <p className="text-sm text-oxide">{balance.error}</p>
      ) : balance.value ? (
        <div className="grid grid-cols-2 gap-2">
          <Figure label="Front share before" value={pct(balance.value.frontShareBefore)} />
          <Figure label="Front share after" value={pct(balance.value.frontShareAfter)} />
          <div className="col-span-2">
            <BalanceShiftNote shift={balance.value.shift} />
            {balance.value.figures && (
              <p className="mt-1 text-xs text-graphite-soft">
                Which axle locks first: worked out with {balance.value.figures.label}.
              </p>
            )}
          </div>
        </div>
      ) : null}

      <h3 className="pt-2 text-sm font-extrabold uppercase tracking-wide text-graphite-soft">Checks the reviewer will see</h3>
      {!checks ? (
        <p className="text-sm text-graphite-soft">Choose the axle to run the checks.</p>
      ) : 'error' in checks ? (
        <p className="text-sm text-oxide">{checks.error}</p>
      ) : (
        <ul className="space-y-1.5 text-sm" data-testid="live-checks">
          {checks.value.map((c) => (
            <li key={c.id} data-status={c.status}>
              <span className={`font-bold ${checkTone[c.status]}`}>
                <span aria-hidden>{checkMark[c.status]} </span>
                {c.label}
                <span className="sr-only">
                  {' '}
                  — {c.status === 'pass' ? 'passes' : c.status === 'fail' ? 'fails' : 'needs a close look'}
                </span>
              </span>
              {c.status !== 'pass' && <span className="block text-xs text-graphite-soft">{c.detail}</span>}
            </li>
          ))}
          <li className="text-xs text-graphite-soft">The moderator also checks for a likely duplicate of an approved swap.</li>
        </ul>
      )}

      <h3 className="pt-2 text-sm font-extrabold uppercase tracking-wide text-graphite-soft">Cost by route</h3>
      {!costs ? (
        <p className="text-sm text-graphite-soft">Add cost lines to see the totals.</p>
      ) : (
        <dl className="tabular grid grid-cols-3 gap-2 text-sm">
          {costRoutes.map((r) => (
            <div key={r} className="rounded-lg border border-graphite/15 bg-paper-card p-2">
              <dt className="text-xs text-graphite-soft">{costRouteLabels[r]}</dt>
              <dd className="font-extrabold text-graphite">
                {costs.totals[r] === null ? '—' : formatMoney(costs.totals[r]!, costs.currency)}
              </dd>
              {r !== 'new_kit' && costs.savings[r] && costs.savings[r]!.amountMinor !== 0 && (
                <dd className={`text-xs ${costs.savings[r]!.amountMinor > 0 ? 'text-ink' : 'text-oxide'}`}>
                  {costs.savings[r]!.amountMinor > 0 ? 'saves ' : 'costs '}
                  {formatMoney(Math.abs(costs.savings[r]!.amountMinor), costs.currency)}
                  {costs.savings[r]!.amountMinor < 0 && ' more'}
                </dd>
              )}
            </div>
          ))}
        </dl>
      )}
    </section>
  );
}
