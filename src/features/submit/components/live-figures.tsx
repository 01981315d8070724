import { useMemo } from 'react';
import { useWatch } from 'react-hook-form';
import type { Axle, Category } from '@shared/schemas/enums';
import { automaticChecks } from '@shared/review-checks';
import { costRouteLabels, costRoutes } from '@shared/schemas/enums';
import type { SwapData } from '@shared/schemas/swap-data';
import { brakeBalanceOf, checkWheelForSwap, costSummaryOf, rotorDiameterOf } from '@shared/fitment/swap-checks';
import { FitmentInputError } from '@shared/fitment/errors';
import { Figure, Verdict } from '../../../components/verdict';
import { formatMoney } from '../../../lib/money';
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

/** The record's own smallest wheel, chosen as the review desk's clearance check chooses it. */
function minWheelOf(data: SwapData) {
  const req = data.wheel!;
  const tested = [...req.testedWheels].sort((a, b) => a.diameterIn - b.diameterIn)[0];
  return tested
    ? { ...tested, spacerMm: tested.spacerMm ?? 0 }
    : { diameterIn: req.minDiameterIn, widthIn: 7, offsetMm: 35, spacerMm: 0 };
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
  photoCount,
}: {
  axle: Axle | null;
  category: Category | null;
  wheelBoltThread: string | null;
  photoCount: number;
}) {
  const values = useWatch<FormValues, 'data'>({ name: 'data' });
  const units = useUnits();
  const data = useMemo(() => liveDataOf(values), [values]);
  const margin = (mm: number) => `${mm >= 0 ? '+' : '−'}${units.length(Math.abs(mm))}`;

  const wheel = data.wheel;
  const rotorMm = axle ? rotorDiameterOf(data, axle) : null;
  const clearance =
    wheel && axle && rotorMm
      ? attempt(() => checkWheelForSwap(data, axle, wheelBoltThread ?? 'M12x1.5', minWheelOf(data)))
      : null;
  const balance = data.brakes ? attempt(() => brakeBalanceOf(data)) : null;
  const costs = data.costs.length ? costSummaryOf(data) : null;
  const checks = axle
    ? attempt(() =>
        automaticChecks({
          data,
          body: '',
          photoCount,
          chassis: { wheelBoltThread: wheelBoltThread ?? 'M12x1.5' },
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

      <h3 className="pt-1 text-sm font-extrabold uppercase tracking-wide text-graphite-soft">Clearance on the smallest wheel</h3>
      {!wheel ? (
        <p className="text-sm text-graphite-soft">Fill in the wheel requirement to see the clearance.</p>
      ) : !axle ? (
        <p className="text-sm text-graphite-soft">Choose the axle first.</p>
      ) : !rotorMm ? (
        <p className="text-sm text-graphite-soft">Add a rotor (or the “after” brake figures) so the rotor diameter is known.</p>
      ) : clearance && 'error' in clearance ? (
        <p className="text-sm text-oxide">{clearance.error}</p>
      ) : clearance && clearance.value.radial ? (
        <>
          <Verdict
            label={`Caliper to barrel on a ${wheel.minDiameterIn}″ wheel`}
            ok={clearance.value.radial.ok}
            value={units.length(clearance.value.radial.clearanceMm)}
            margin={margin(clearance.value.radial.marginMm)}
            rule={clearance.value.radial.rule}
            note={clearance.value.radial.basisNote}
          />
          {clearance.value.spoke && (
            <Verdict
              label="Caliper to spokes"
              ok={clearance.value.spoke.ok}
              value={units.length(clearance.value.spoke.clearanceMm)}
              margin={margin(clearance.value.spoke.marginMm)}
              rule={clearance.value.spoke.rule}
              note={clearance.value.spoke.basisNote}
            />
          )}
        </>
      ) : null}

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
            <Verdict
              label="Shift toward the front"
              ok={null}
              value={`${balance.value.shiftPoints >= 0 ? '+' : ''}${balance.value.shiftPoints.toFixed(1)} points`}
              note={balance.value.attention ? 'More than 5 points: the reviewer will look at this closely.' : 'Within 5 points.'}
              rule={`Equal line pressure (${units.pressure(balance.value.linePressureBar)}), pad μ ${balance.value.padMu}; T = 2 μ p A r.`}
            />
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
