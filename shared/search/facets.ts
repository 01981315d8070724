import { axles, categories, categoryLabels, machiningLevelLabels, machiningLevels, type Category } from '../schemas/enums';
import type { SearchDocument } from './search-document';
import type { Hits } from './hits';
import { groups, layoutTable, tallyFiltered, tallyUnfiltered, type FacetTable, type Group } from './facet-table';
import {
  costBucketOf,
  costBuckets,
  type FacetValue,
  type FilterKey,
  type SearchFacets,
  type SearchFilters,
} from './search-types';

// Facets: each document's value in every filter group, the counts a result set gives, and their labels.

const SEP = '\u0000';

/** Rim diameters of passenger cars, offered by "fits my wheel" whether or not a swap names them (common practice, no source). */
export const usualWheelSizes = [13, 14, 15, 16, 17, 18, 19, 20, 21, 22] as const;

type Codes = { values: string[]; code: Map<string, number>; byDoc: Uint32Array };

function seeded(order: readonly string[] = []): Codes {
  const values = ['', ...order];
  return { values, code: new Map(order.map((v, i) => [v, i + 1])), byDoc: new Uint32Array(256) };
}

const valueOf: Record<Group, (d: SearchDocument) => string | null> = {
  make: (d) => d.chassis.make,
  model: (d) => d.chassis.make + SEP + d.chassis.model,
  chassis: (d) => d.chassis.slug,
  axle: (d) => d.axle,
  category: (d) => d.category,
  wheel: (d) => (d.minWheelIn === null ? null : String(d.minWheelIn)),
  machining: (d) => d.machining,
  parkingBrake: (d) => (d.parkingBrakeKept === null ? null : d.parkingBrakeKept ? 'yes' : 'no'),
  cost: (d) => (d.cost ? costBucketOf(d.cost.min) : null),
};

export type ChassisLabel = { make: string; model: string; label: string };

/** Facet codes of every document added so far; the shared table is laid out again after each addition. */
export class FacetIndex {
  size = 0;
  readonly codes: Record<Group, Codes> = {
    make: seeded(),
    model: seeded(),
    chassis: seeded(),
    axle: seeded(axles),
    category: seeded(categories),
    wheel: seeded(usualWheelSizes.map(String)),
    machining: seeded(machiningLevels),
    parkingBrake: seeded(['yes', 'no']),
    cost: seeded(costBuckets.map((b) => b.value)),
  };
  readonly chassisLabels = new Map<string, ChassisLabel>();
  private laidOut: FacetTable | null = null;

  add(docs: SearchDocument[]) {
    const base = this.size;
    for (const g of groups) {
      const c = this.codes[g];
      if (c.byDoc.length < base + docs.length) {
        const next = new Uint32Array(Math.max(base + docs.length, c.byDoc.length * 2));
        next.set(c.byDoc);
        c.byDoc = next;
      }
      docs.forEach((d, i) => {
        const v = valueOf[g](d);
        let code = 0;
        if (v !== null) {
          code = c.code.get(v) ?? c.values.push(v) - 1;
          c.code.set(v, code);
        }
        c.byDoc[base + i] = code;
      });
    }
    for (const { chassis: c } of docs) {
      if (!this.chassisLabels.has(c.slug))
        this.chassisLabels.set(c.slug, { make: c.make, model: c.model, label: `${c.code} (${c.yearFrom}–${c.yearTo ?? 'on'})` });
    }
    this.size = base + docs.length;
    this.laidOut = null;
  }

  table(): FacetTable {
    if (this.laidOut) return this.laidOut;
    const byDoc = {} as Record<Group, Uint32Array>;
    const valueCounts = {} as Record<Group, number>;
    for (const g of groups) {
      byDoc[g] = this.codes[g].byDoc;
      valueCounts[g] = this.codes[g].values.length;
    }
    return (this.laidOut = layoutTable(byDoc, valueCounts, this.size));
  }
}

const bit = Object.fromEntries(groups.map((g, i) => [g, 1 << i])) as Record<Group, number>;
/** Filters a facet's own counts ignore: counts show what choosing another value would give. Make → model → chassis nest. */
const ignoredBy: Record<Group, number> = {
  make: bit.make | bit.model | bit.chassis,
  model: bit.model | bit.chassis,
  chassis: bit.chassis,
  axle: bit.axle,
  category: bit.category,
  wheel: bit.wheel,
  machining: bit.machining,
  parkingBrake: bit.parkingBrake,
  cost: bit.cost,
};

/** Per group, which codes pass the filter (null: no filter on that group). */
export function allowedCodes(index: FacetIndex, f: SearchFilters): Record<Group, Uint8Array | null> {
  const out = {} as Record<Group, Uint8Array | null>;
  for (const g of groups) {
    const codes = index.codes[g];
    const value = f[g];
    if (value === undefined) {
      out[g] = null;
      continue;
    }
    const allowed = new Uint8Array(codes.values.length);
    codes.values.forEach((v, c) => {
      if (c === 0) allowed[c] = g === 'wheel' ? 1 : 0;
      else if (g === 'wheel') allowed[c] = Number(v) <= (value as number) ? 1 : 0;
      else if (g === 'model') allowed[c] = (f.make === undefined ? v.endsWith(SEP + value) : v === f.make + SEP + value) ? 1 : 0;
      else allowed[c] = v === value ? 1 : 0;
    });
    out[g] = allowed;
  }
  return out;
}

export type Tally = { passing: Int32Array; counts: Record<Group, Int32Array>; relaxCounts: Int32Array };

function split(table: FacetTable, flat: Int32Array): Record<Group, Int32Array> {
  const counts = {} as Record<Group, Int32Array>;
  groups.forEach((g, i) => (counts[g] = flat.subarray(table.offset[i], table.offset[i + 1])));
  return counts;
}

/**
 * Candidates that pass every filter, facet counts and, per active filter, how many more would pass
 * without it. `hits` (null when browsing) lets a broad match count by subtraction.
 */
export function tally(
  index: FacetIndex,
  candidates: Int32Array,
  hits: Hits | null,
  allowed: Record<Group, Uint8Array | null>,
): Tally {
  const table = index.table();
  const filtered = groups.some((g) => allowed[g] !== null);
  const t = filtered ? tallyFiltered(table, candidates, allowed, ignoredBy) : tallyUnfiltered(table, candidates, hits);
  return { passing: t.passing, counts: split(table, t.flatCounts), relaxCounts: t.relaxCounts };
}

export function relaxTotals(filters: SearchFilters, t: Tally): { filter: FilterKey; total: number }[] {
  return groups
    .filter((g) => filters[g] !== undefined)
    .map((filter) => ({ filter, total: t.passing.length + t.relaxCounts[groups.indexOf(filter)] }));
}

const parkingLabels: Record<string, string> = { yes: 'Parking brake kept', no: 'Parking brake lost' };
const machiningLabels: Record<string, string> = machiningLevelLabels;

export function facetValues(index: FacetIndex, filters: SearchFilters, counts: Record<Group, Int32Array>): SearchFacets {
  const list = (g: Group, label: (v: string) => string, keep: (v: string) => boolean = () => true) => {
    const { values } = index.codes[g];
    const out: FacetValue[] = [];
    for (let c = 1; c < values.length; c++)
      if (counts[g][c] > 0 && keep(values[c])) out.push({ value: values[c], label: label(values[c]), count: counts[g][c] });
    return out;
  };
  // plain code-unit order: localeCompare is slow enough to show in a keystroke's budget
  const byCount = (xs: FacetValue[]) =>
    xs.sort((a, b) => b.count - a.count || (a.label < b.label ? -1 : a.label > b.label ? 1 : 0));

  // the nested lists only open under a chosen make (models) and a chosen model or chassis (chassis)
  const modelCounts = new Map<string, number>();
  if (filters.make !== undefined) {
    for (const m of list(
      'model',
      (v) => v,
      (v) => v.startsWith(filters.make + SEP),
    )) {
      const model = m.value.slice(m.value.indexOf(SEP) + 1);
      modelCounts.set(model, (modelCounts.get(model) ?? 0) + m.count);
    }
  }
  const picked = filters.chassis ? index.chassisLabels.get(filters.chassis) : undefined;
  const make = filters.make ?? picked?.make;
  const model = filters.model ?? picked?.model;
  const keepChassis = (slug: string) => {
    const c = index.chassisLabels.get(slug)!;
    return c.make === make && c.model === model;
  };

  return {
    make: byCount(list('make', (v) => v)),
    model: byCount([...modelCounts].map(([value, count]) => ({ value, label: value, count }))),
    chassis:
      model === undefined ? [] : byCount(list('chassis', (slug) => index.chassisLabels.get(slug)?.label ?? slug, keepChassis)),
    axle: list('axle', (a) => (a === 'front' ? 'Front axle' : 'Rear axle')),
    category: list('category', (c) => categoryLabels[c as Category]),
    wheel: wheelValues(index.codes.wheel.values, counts.wheel),
    machining: list('machining', (m) => machiningLabels[m]),
    parkingBrake: list('parkingBrake', (v) => parkingLabels[v]),
    cost: list('cost', (v) => v),
  };
}

/** A wheel fits every swap whose minimum is at or below it, and every swap that names no minimum. */
function wheelValues(values: string[], counts: Int32Array): FacetValue[] {
  const sizes = values
    .slice(1)
    .map((v, i) => ({ size: Number(v), count: counts[i + 1] }))
    .sort((a, b) => a.size - b.size);
  let cumulative = counts[0];
  return sizes.map(({ size, count }) => {
    cumulative += count;
    return { value: String(size), label: `${size}″ wheels`, count: cumulative };
  });
}
