import { FitmentInputError, requireInteger } from './errors';

export type CostRoute = 'as_built' | 'budget' | 'new_kit';
export const COST_ROUTES: readonly CostRoute[] = ['as_built', 'budget', 'new_kit'];

export interface CostLineAmount {
  route: CostRoute;
  amountMinor: number;
}

/** integer minor units (cents, pence); null where the route has no lines */
export type RouteTotals = Record<CostRoute, number | null>;

export interface Saving {
  /** new kit − route: positive means cheaper than the new kit */
  amountMinor: number;
  /** saving as a percentage of the new kit; null when the new kit costs nothing */
  percent: number | null;
}

export function routeTotals(lines: CostLineAmount[]): RouteTotals {
  if (!Array.isArray(lines)) throw new FitmentInputError('lines', 'lines must be a list of cost lines');
  const totals: RouteTotals = { as_built: null, budget: null, new_kit: null };
  lines.forEach((line, i) => {
    const route = line?.route;
    if (!COST_ROUTES.includes(route)) {
      throw new FitmentInputError(`lines.${i}.route`, `lines.${i}.route must be one of ${COST_ROUTES.join(', ')}`);
    }
    const amount = requireInteger(line.amountMinor, `lines.${i}.amountMinor`, 0);
    const sum = (totals[route] ?? 0) + amount;
    if (!Number.isSafeInteger(sum)) {
      throw new FitmentInputError(`lines.${i}.amountMinor`, `The ${route} total is too large to add up exactly`);
    }
    totals[route] = sum;
  });
  return totals;
}

export function savingsAgainstNewKit(totals: RouteTotals): Record<CostRoute, Saving | null> {
  if (totals === null || typeof totals !== 'object') {
    throw new FitmentInputError('totals', 'totals must give an amount (or null) per route');
  }
  const checked = {} as RouteTotals;
  for (const route of COST_ROUTES) {
    const value = totals[route];
    checked[route] = value === null || value === undefined ? null : requireInteger(value, `totals.${route}`, 0);
  }

  const baseline = checked.new_kit;
  const savings = { as_built: null, budget: null, new_kit: null } as Record<CostRoute, Saving | null>;
  if (baseline === null) return savings;
  for (const route of COST_ROUTES) {
    const total = checked[route];
    if (total === null) continue;
    const amountMinor = baseline - total;
    savings[route] = { amountMinor, percent: baseline === 0 ? null : (amountMinor / baseline) * 100 };
  }
  return savings;
}
