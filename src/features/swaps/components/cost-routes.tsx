import type { SwapData } from '@shared/schemas/swap-data';
import { costRouteLabels, costRoutes } from '@shared/schemas/enums';
import { costSummaryOf } from '@shared/fitment/swap-checks';
import { formatMoney } from '@shared/money';
import { SheetSection } from './sheet-section';

export function CostRoutesSection({ data }: { data: SwapData }) {
  if (data.costs.length === 0) return null;
  const { totals, savings, currency } = costSummaryOf(data);
  return (
    <SheetSection id="costs" title="Cost by route">
      <div className="grid gap-3 sm:grid-cols-3">
        {costRoutes.map((route) => {
          const lines = data.costs.filter((c) => c.route === route);
          const total = totals[route];
          const saving = savings[route];
          return (
            <div
              key={route}
              className={`rounded-lg border p-4 print:px-2 print:py-1 ${route === 'new_kit' ? 'border-brass/50 bg-brass-soft/30' : 'border-ink/10 bg-paper-card'}`}
            >
              <h3 className="text-sm font-bold uppercase tracking-wide text-graphite-soft">{costRouteLabels[route]}</h3>
              <p className="tabular mt-1 text-2xl font-extrabold text-graphite print:mt-0 print:text-base">
                {total === null ? '—' : formatMoney(total, currency)}
              </p>
              {route !== 'new_kit' && saving && saving.amountMinor !== 0 && (
                <p className={`tabular text-sm font-bold ${saving.amountMinor > 0 ? 'text-ink' : 'text-oxide'}`}>
                  {saving.amountMinor > 0 ? 'Saves ' : 'Costs '}
                  {formatMoney(Math.abs(saving.amountMinor), currency)}
                  {saving.percent !== null && ` (${Math.abs(saving.percent).toFixed(0)} %)`}
                  {saving.amountMinor > 0 ? ' against the new kit' : ' more than the new kit'}
                </p>
              )}
              {route === 'new_kit' && <p className="text-xs text-graphite-soft">Baseline for comparison</p>}
              {lines.length > 0 && (
                <ul className="tabular mt-3 space-y-1 text-sm print:hidden">
                  {lines.map((l, i) => (
                    <li key={i} className="flex justify-between gap-2">
                      <span>{l.item}</span>
                      <span className="whitespace-nowrap">{formatMoney(l.amountMinor, currency)}</span>
                    </li>
                  ))}
                </ul>
              )}
            </div>
          );
        })}
      </div>
    </SheetSection>
  );
}
