import type { Axle } from '../schemas/enums';
import type { BrakeCorner, Fastener, MachiningStep, SwapData, TorqueSpec } from '../schemas/swap-data';
import { isStructural } from '../schemas/swap-data';
import type { VehicleData } from '../schemas/vehicle';
import { DEFAULT_PAD_MU, frontShare, type AnyBrakeCorner } from './brakes';
import { COST_ROUTES, routeTotals, savingsAgainstNewKit, type CostRoute, type RouteTotals, type Saving } from './costs';
import { analyseBrakeDistribution, type DistributionAnalysis } from './distribution-analysis';
import { brakeAxlesChanged, fitmentCorner, vehicleStates } from './swap-distribution';

export { brakeAxlesChanged };
import type { FasteningChassis } from './swap-fastening';
import {
  checkWheelForSwap,
  describeBalanceShift,
  jobTouches,
  wheelCheckSummary,
  type BalanceShift,
  type JobTouches,
  type WheelCheck,
  type WheelCheckSummary,
  type WheelUnderTest,
} from './swap-checks';

// A build plan: several swaps on one car, computed together. A swap record says what it does to a
// stock car; a plan starts from the car as it is (stock plus the swaps already fitted) and applies the
// planned swaps on top, so the brake balance, the wheel requirement and the costs are those of the car.

export type PlanSwap = {
  slug: string;
  title: string;
  axle: Axle;
  revisionNumber: number;
  data: SwapData;
};

export type PlanInput = {
  chassis: {
    stockBrakes: { front: BrakeCorner; rear: BrakeCorner };
    /** the chassis' stock figures for the distribution analysis, when known */
    vehicle: VehicleData | null;
  } & FasteningChassis;
  /** the reader's car, when the plan is for one */
  car: { wheel: WheelUnderTest; vehicle: VehicleData | null; fitted: PlanSwap[] } | null;
  swaps: PlanSwap[];
};

// ---------- brakes ----------

/** Where an axle's brakes in a state of the car come from: the factory, or a swap (by slug). */
export type CornerSource = { kind: 'stock' } | { kind: 'swap'; slug: string; title: string };

export type CarBrakes = Record<Axle, { corner: AnyBrakeCorner; source: CornerSource }>;

export type PlanBrakes = {
  asIs: CarBrakes;
  planned: CarBrakes;
  /** front share of brake torque at equal line pressure, 0..1 */
  frontShareAsIs: number;
  frontSharePlanned: number;
  shift: BalanceShift;
  /** lock order before (car as it is) and after (as planned); null when the car's figures are not known */
  distribution: DistributionAnalysis | null;
  vehicleSource: 'car' | 'chassis' | null;
  /** swaps in the plan that change the same axle's brakes as an earlier one: the later one wins */
  overridden: Array<{ axle: Axle; slug: string; by: string }>;
};

function stockCorners(stock: PlanInput['chassis']['stockBrakes']): CarBrakes {
  // The factory corners carry no pad friction of their own; the default applies to both axles alike,
  // so it cancels out of the balance unless a swap brings its own.
  const corner = (c: BrakeCorner) => fitmentCorner(c, DEFAULT_PAD_MU);
  return {
    front: { corner: corner(stock.front), source: { kind: 'stock' } },
    rear: { corner: corner(stock.rear), source: { kind: 'stock' } },
  };
}

function applySwaps(start: CarBrakes, swaps: PlanSwap[], overridden?: PlanBrakes['overridden']): CarBrakes {
  const out: CarBrakes = { ...start };
  for (const swap of swaps) {
    const b = swap.data.brakes;
    if (!b) continue;
    for (const axle of brakeAxlesChanged(swap.data)) {
      const previous = out[axle].source;
      if (overridden && previous.kind === 'swap' && swaps.some((s) => s.slug === previous.slug)) {
        overridden.push({ axle, slug: previous.slug, by: swap.slug });
      }
      out[axle] = { corner: fitmentCorner(b.after[axle], b.padMu), source: { kind: 'swap', slug: swap.slug, title: swap.title } };
    }
  }
  return out;
}

/** A car's brakes as they are: the factory's, with the fitted swaps' brakes on the axles they change. */
export function carBrakesAsIs(stock: PlanInput['chassis']['stockBrakes'], fitted: PlanSwap[]): CarBrakes {
  return applySwaps(stockCorners(stock), fitted);
}

export function planBrakes(input: PlanInput): PlanBrakes {
  const asIs = carBrakesAsIs(input.chassis.stockBrakes, input.car?.fitted ?? []);
  const overridden: PlanBrakes['overridden'] = [];
  const planned = applySwaps(asIs, input.swaps, overridden);
  const frontShareAsIs = frontShare(asIs.front.corner, asIs.rear.corner);
  const frontSharePlanned = frontShare(planned.front.corner, planned.rear.corner);

  const vehicle = input.car?.vehicle ?? input.chassis.vehicle;
  const vehicleSource = input.car?.vehicle ? 'car' : input.chassis.vehicle ? 'chassis' : null;
  let distribution: DistributionAnalysis | null = null;
  if (vehicle) {
    distribution = analyseBrakeDistribution({
      ...vehicleStates(vehicle),
      before: { front: asIs.front.corner, rear: asIs.rear.corner, rearValve: vehicle.rearValve },
      after: { front: planned.front.corner, rear: planned.rear.corner, rearValve: vehicle.rearValve },
      change: 'The plan',
    });
  }
  return {
    asIs,
    planned,
    frontShareAsIs,
    frontSharePlanned,
    shift: describeBalanceShift(frontShareAsIs, frontSharePlanned),
    distribution,
    vehicleSource,
    overridden,
  };
}

// ---------- wheels ----------

export type PlanWheels = {
  /** the largest of the swaps' minimum wheel diameters; null when none states one */
  minDiameterIn: number | null;
  minDiameterFrom: string | null;
  /** the reader's wheel against each swap's wheel requirement, on the swap's axle */
  checks: Array<{ slug: string; axle: Axle; check: WheelCheck; summary: WheelCheckSummary }>;
  spacers: Record<Axle, Array<{ slug: string; thicknessMm: number; mounting: string; hubCentric: boolean; quantity: number }>>;
  wheelBolts: Record<
    Axle,
    Array<{ slug: string; label: string; thread: string; lengthMm: number | null; quantity: number | null }>
  >;
};

export function planWheels(input: PlanInput): PlanWheels {
  let minDiameterIn: number | null = null;
  let minDiameterFrom: string | null = null;
  const spacers: PlanWheels['spacers'] = { front: [], rear: [] };
  const wheelBolts: PlanWheels['wheelBolts'] = { front: [], rear: [] };
  const checks: PlanWheels['checks'] = [];

  for (const swap of input.swaps) {
    const req = swap.data.wheel;
    if (req && (minDiameterIn === null || req.minDiameterIn > minDiameterIn)) {
      minDiameterIn = req.minDiameterIn;
      minDiameterFrom = swap.slug;
    }
    for (const s of swap.data.spacers) {
      spacers[s.axle].push({
        slug: swap.slug,
        thicknessMm: s.thicknessMm,
        mounting: s.mounting,
        hubCentric: s.hubCentric,
        quantity: s.quantity,
      });
    }
    for (const f of swap.data.fasteners.filter((f) => f.kind === 'wheel')) {
      wheelBolts[swap.axle].push({
        slug: swap.slug,
        label: f.label,
        thread: f.thread,
        lengthMm: f.lengthMm ?? null,
        quantity: f.quantity ?? null,
      });
    }
    if (input.car && req) {
      const check = checkWheelForSwap(swap.data, swap.axle, input.chassis, input.car.wheel);
      checks.push({ slug: swap.slug, axle: swap.axle, check, summary: wheelCheckSummary(check) });
    }
  }
  return { minDiameterIn, minDiameterFrom, checks, spacers, wheelBolts };
}

// ---------- what to buy, do and use ----------

export type MergedPart = {
  key: string;
  name: string;
  maker: string;
  kind: string;
  partId: number | null;
  /** per axle, the most any one swap on that axle needs: two swaps on one axle share a part */
  perAxle: Record<Axle, number>;
  total: number;
  usedBy: string[];
};

/** The same part is the catalogue part with the same id, else the same maker and part number, else the same name. */
export function partKey(part: SwapData['parts'][number]): string {
  if (part.partId) return `id:${part.partId}`;
  const number = part.partNumbers[0]?.replace(/[\s\-./]/g, '').toLowerCase();
  if (number) return `no:${part.maker.trim().toLowerCase()}:${number}`;
  return `name:${part.name.trim().toLowerCase()}`;
}

export function mergedParts(swaps: PlanSwap[]): MergedPart[] {
  const merged = new Map<string, MergedPart>();
  for (const swap of swaps) {
    for (const part of swap.data.parts) {
      const key = partKey(part);
      const row =
        merged.get(key) ??
        ({
          key,
          name: part.name,
          maker: part.maker,
          kind: part.kind,
          partId: part.partId ?? null,
          perAxle: { front: 0, rear: 0 },
          total: 0,
          usedBy: [],
        } satisfies MergedPart);
      row.perAxle[swap.axle] = Math.max(row.perAxle[swap.axle], part.quantity);
      row.total = row.perAxle.front + row.perAxle.rear;
      if (!row.usedBy.includes(swap.slug)) row.usedBy.push(swap.slug);
      merged.set(key, row);
    }
  }
  return [...merged.values()];
}

export type PlanStep = MachiningStep & { n: number; slug: string; axle: Axle; structural: boolean };

/**
 * Machining in the order of work: required steps before optional ones (an optional trim is done once
 * everything else is in place), each swap's own order kept, the plan's swap order between swaps.
 */
export function machiningInOrder(swaps: PlanSwap[]): PlanStep[] {
  const all = swaps.flatMap((swap) => swap.data.machining.map((step) => ({ ...step, slug: swap.slug, axle: swap.axle })));
  const ordered = [...all.filter((s) => s.required), ...all.filter((s) => !s.required)];
  return ordered.map((s, i) => ({ ...s, n: i + 1, structural: isStructural(s) }));
}

export type PlanTorqueRow = TorqueSpec & { slug: string; axle: Axle; fastener: Fastener };

export function torqueTable(swaps: PlanSwap[]): PlanTorqueRow[] {
  return swaps.flatMap((swap) =>
    swap.data.torque.flatMap((row) => {
      const fastener = swap.data.fasteners.find((f) => f.id === row.fastenerId);
      return fastener ? [{ ...row, slug: swap.slug, axle: swap.axle, fastener }] : [];
    }),
  );
}

/** Tools named alike (case and spacing aside) are one tool. */
export function mergedTools(swaps: PlanSwap[]): Array<{ name: string; usedBy: string[] }> {
  const tools = new Map<string, { name: string; usedBy: string[] }>();
  for (const swap of swaps) {
    for (const tool of swap.data.tools) {
      const key = tool.trim().replace(/\s+/g, ' ').toLowerCase();
      const row = tools.get(key) ?? { name: tool.trim(), usedBy: [] };
      if (!row.usedBy.includes(swap.slug)) row.usedBy.push(swap.slug);
      tools.set(key, row);
    }
  }
  return [...tools.values()];
}

// ---------- costs and time ----------

export type PlanCosts = {
  /** null when the swaps price in different currencies: they are not added up */
  currency: string | null;
  /** the whole plan, integer minor units per route; a route is null unless every swap prices it */
  totals: RouteTotals;
  perAxle: Record<Axle, RouteTotals>;
  bySwap: Array<{ slug: string; axle: Axle; currency: string; totals: RouteTotals }>;
  savings: Record<CostRoute, Saving | null>;
  /** routes a swap does not price, which leave that route's plan total open */
  missing: Array<{ slug: string; route: CostRoute }>;
};

function addTotals(parts: RouteTotals[]): RouteTotals {
  const out = { as_built: null, budget: null, new_kit: null } as RouteTotals;
  for (const route of COST_ROUTES) {
    if (parts.length === 0 || parts.some((t) => t[route] === null)) continue;
    out[route] = parts.reduce((sum, t) => sum + (t[route] as number), 0);
  }
  return out;
}

export function planCosts(swaps: PlanSwap[]): PlanCosts {
  const bySwap = swaps.map((s) => ({ slug: s.slug, axle: s.axle, currency: s.data.currency, totals: routeTotals(s.data.costs) }));
  const currencies = new Set(bySwap.map((s) => s.currency));
  const currency = currencies.size === 1 ? [...currencies][0] : null;
  const empty = { as_built: null, budget: null, new_kit: null } as RouteTotals;
  const totals = currency ? addTotals(bySwap.map((s) => s.totals)) : empty;
  const perAxle = {
    front: currency ? addTotals(bySwap.filter((s) => s.axle === 'front').map((s) => s.totals)) : empty,
    rear: currency ? addTotals(bySwap.filter((s) => s.axle === 'rear').map((s) => s.totals)) : empty,
  };
  const missing = bySwap.flatMap((s) =>
    COST_ROUTES.filter((route) => s.totals[route] === null).map((route) => ({ slug: s.slug, route })),
  );
  return { currency, totals, perAxle, bySwap, savings: savingsAgainstNewKit(totals), missing };
}

export type PlanTime = {
  /** summed over the swaps that state one; null when none does */
  totalHours: number | null;
  longest: { slug: string; title: string; hours: number } | null;
  unstated: string[];
};

export function planTime(swaps: PlanSwap[]): PlanTime {
  const stated = swaps.filter((s) => s.data.installHours !== null);
  const longest = stated.reduce<PlanTime['longest']>(
    (best, s) =>
      best === null || s.data.installHours! > best.hours ? { slug: s.slug, title: s.title, hours: s.data.installHours! } : best,
    null,
  );
  return {
    totalHours: stated.length ? stated.reduce((sum, s) => sum + s.data.installHours!, 0) : null,
    longest,
    unstated: swaps.filter((s) => s.data.installHours === null).map((s) => s.slug),
  };
}

// ---------- the whole plan ----------

export type PlanComputation = {
  brakes: PlanBrakes;
  wheels: PlanWheels;
  parts: MergedPart[];
  machining: PlanStep[];
  torque: PlanTorqueRow[];
  tools: Array<{ name: string; usedBy: string[] }>;
  costs: PlanCosts;
  time: PlanTime;
  /** what the plan's work touches, for the cautions */
  touches: JobTouches;
};

export function computePlan(input: PlanInput): PlanComputation {
  const touched = input.swaps.map((s) => jobTouches(s.data));
  const any = (k: keyof JobTouches) => touched.some((t) => t[k]);
  return {
    brakes: planBrakes(input),
    wheels: planWheels(input),
    parts: mergedParts(input.swaps),
    machining: machiningInOrder(input.swaps),
    torque: torqueTable(input.swaps),
    tools: mergedTools(input.swaps),
    costs: planCosts(input.swaps),
    time: planTime(input.swaps),
    touches: {
      brakes: any('brakes'),
      wheelFastening: any('wheelFastening'),
      structural: any('structural'),
      suspension: any('suspension'),
    },
  };
}
