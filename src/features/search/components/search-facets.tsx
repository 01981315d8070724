import type { ReactNode } from 'react';
import { costBuckets, type FacetValue, type FilterKey, type SearchFacets, type SearchFilters } from '@shared/search/search-types';
import { ChassisCombobox, type ChassisOption } from '../../../components/chassis-combobox';
import { formatMoney } from '@shared/money';

type Props = {
  facets: SearchFacets;
  filters: SearchFilters;
  chassis: ChassisOption[];
  currency: string | null;
  onChange: (key: FilterKey, value: string | number | undefined) => void;
  onClear: () => void;
};

export function costBucketLabel(value: string, currency: string | null) {
  const b = costBuckets.find((x) => x.value === value);
  if (!b) return value;
  const money = (minor: number) => (currency ? formatMoney(minor, currency, { whole: true }) : String(minor / 100));
  if (b.minMinor === 0) return `Under ${money(b.maxMinor)}`;
  if (b.maxMinor === Infinity) return `${money(b.minMinor)} and more`;
  return `${money(b.minMinor)} – ${money(b.maxMinor)}`;
}

function Group({ title, children, hint }: { title: string; children: ReactNode; hint?: string }) {
  return (
    <fieldset className="border-t border-ink/10 pt-4">
      <legend className="float-left mb-2 w-full text-sm font-bold text-graphite">{title}</legend>
      {hint && <p className="clear-both mb-2 text-xs text-graphite-soft">{hint}</p>}
      <div className="clear-both">{children}</div>
    </fieldset>
  );
}

function Options({
  values,
  selected,
  onPick,
  label = (v) => v.label,
}: {
  values: FacetValue[];
  selected: string | undefined;
  onPick: (v: string | undefined) => void;
  label?: (v: FacetValue) => string;
}) {
  if (values.length === 0) return <p className="text-sm text-graphite-soft">None in these results.</p>;
  return (
    <ul className="flex flex-col gap-0.5">
      {values.map((v) => {
        const on = v.value === selected;
        return (
          <li key={v.value}>
            <button
              type="button"
              aria-pressed={on}
              onClick={() => onPick(on ? undefined : v.value)}
              className={`flex min-h-9 w-full items-center justify-between gap-3 rounded-md px-2.5 py-1.5 text-left text-sm transition-colors ${
                on ? 'bg-ink font-bold text-paper' : 'text-graphite hover:bg-ink-faint'
              }`}
            >
              <span>{label(v)}</span>
              <span className={`tabular text-xs font-bold ${on ? 'text-paper/80' : 'text-graphite-soft'}`}>
                {v.count.toLocaleString('en-GB')}
              </span>
            </button>
          </li>
        );
      })}
    </ul>
  );
}

/** Facet lists with counts; a chosen value is pressed, and pressing it again lets it go. */
export function SearchFacetsPanel({ facets, filters, chassis, currency, onChange, onClear }: Props) {
  const active = Object.keys(filters).length;
  const pick = (key: FilterKey) => (v: string | undefined) => onChange(key, key === 'wheel' && v !== undefined ? Number(v) : v);
  return (
    <div className="flex flex-col gap-4">
      <div className="flex items-center justify-between">
        <h2 className="text-base font-extrabold text-ink">Narrow down</h2>
        {active > 0 && (
          <button type="button" onClick={onClear} className="text-sm font-bold text-ink underline underline-offset-2">
            Clear all ({active})
          </button>
        )}
      </div>
      <ChassisCombobox
        label="Your chassis"
        options={chassis}
        value={filters.chassis ?? null}
        onChange={(slug) => onChange('chassis', slug ?? undefined)}
        placeholder="e.g. Halden H31 or 1995"
      />
      <Group title="Make">
        <Options values={facets.make} selected={filters.make} onPick={pick('make')} />
        {filters.make && facets.model.length > 0 && (
          <div className="ml-3 mt-2 border-l-2 border-brass/40 pl-2">
            <p className="mb-1 text-xs font-bold text-graphite-soft">Model</p>
            <Options values={facets.model} selected={filters.model} onPick={pick('model')} />
          </div>
        )}
        {facets.chassis.length > 0 && (
          <div className="ml-6 mt-2 border-l-2 border-brass/40 pl-2">
            <p className="mb-1 text-xs font-bold text-graphite-soft">Chassis</p>
            <Options values={facets.chassis} selected={filters.chassis} onPick={pick('chassis')} />
          </div>
        )}
      </Group>
      <Group title="Axle">
        <Options values={facets.axle} selected={filters.axle} onPick={pick('axle')} />
      </Group>
      <Group title="Category">
        <Options values={facets.category} selected={filters.category} onPick={pick('category')} />
      </Group>
      <Group title="Fits my wheel" hint="Swaps whose minimum wheel diameter is at most yours.">
        <Options
          values={facets.wheel}
          selected={filters.wheel === undefined ? undefined : String(filters.wheel)}
          onPick={pick('wheel')}
        />
      </Group>
      <Group title="Machining">
        <Options values={facets.machining} selected={filters.machining} onPick={pick('machining')} />
      </Group>
      <Group title="Parking brake">
        <Options values={facets.parkingBrake} selected={filters.parkingBrake} onPick={pick('parkingBrake')} />
      </Group>
      <Group title="Cheapest route">
        <Options
          values={facets.cost}
          selected={filters.cost}
          onPick={pick('cost')}
          label={(v) => costBucketLabel(v.value, currency)}
        />
      </Group>
    </div>
  );
}
