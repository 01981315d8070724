import type { Axle, Category, MachiningLevel } from '../schemas/enums';
import { machiningLevel, type SwapData } from '../schemas/swap-data';
import { routeTotals } from '../fitment/costs';
import { normalisePartNumber, partNumbersIn } from './normalise';

/**
 * One approved swap as the search index sees it: what is searched, filtered, sorted and shown
 * on a result card, and nothing more (the whole list travels to every reader's browser).
 */
export type SearchDocument = {
  id: number;
  slug: string;
  title: string;
  chassis: { slug: string; make: string; model: string; code: string; yearFrom: number; yearTo: number | null };
  axle: Axle;
  category: Category;
  partNames: string[];
  partNumbers: string[];
  /** other numbers the parts are known by, read from their notes and catalogue records (searched, not shown) */
  otherNumbers?: string[];
  /** donor vehicles the parts came on */
  cameOn: string[];
  adapter: { name: string; maker: string; partNumber: string } | null;
  minWheelIn: number | null;
  machining: MachiningLevel;
  /** null when the axle has no parking brake */
  parkingBrakeKept: boolean | null;
  /** cheapest and dearest route total, integer minor units */
  cost: { min: number; max: number; currency: string } | null;
  fittedCount: number;
  /** approval time of the current revision, ISO */
  updatedAt: string;
};

export type SearchIndexResponse = { documents: SearchDocument[] };

export type SearchDocumentSource = {
  id: number;
  slug: string;
  axle: Axle;
  category: Category;
  fittedCount: number;
  chassis: SearchDocument['chassis'];
  data: SwapData;
  approvedAt: Date;
  /** the catalogue record a part line points at, for numbers written there */
  partRecord?: (partId: number) => { partNumbers: string[]; notes: string } | undefined;
};

const unique = (values: string[]) => [...new Set(values.map((v) => v.trim()).filter(Boolean))];

export function toSearchDocument(s: SearchDocumentSource): SearchDocument {
  const { data } = s;
  const partNumbers = unique([...data.parts.flatMap((p) => p.partNumbers), ...data.rotors.map((r) => r.partNumber)]);
  const seen = new Set(partNumbers.map(normalisePartNumber));
  const written = data.parts.flatMap((p) => {
    const record = p.partId === undefined ? undefined : s.partRecord?.(p.partId);
    return [...partNumbersIn(p.notes), ...(record ? [...record.partNumbers, ...partNumbersIn(record.notes)] : [])];
  });
  const otherNumbers = unique(written).filter((n) => {
    const key = normalisePartNumber(n);
    return !seen.has(key) && !!seen.add(key);
  });
  const totals = Object.values(routeTotals(data.costs)).filter((t): t is number => t !== null);
  return {
    id: s.id,
    slug: s.slug,
    title: data.title,
    chassis: s.chassis,
    axle: s.axle,
    category: s.category,
    partNames: unique(
      data.parts.map((p) => (p.maker && !p.name.toLowerCase().includes(p.maker.toLowerCase()) ? `${p.maker} ${p.name}` : p.name)),
    ),
    partNumbers,
    ...(otherNumbers.length ? { otherNumbers } : {}),
    cameOn: unique(data.parts.flatMap((p) => p.cameOn)),
    adapter: data.adapter ? { name: data.adapter.name, maker: data.adapter.maker, partNumber: data.adapter.partNumber } : null,
    minWheelIn: data.wheel?.minDiameterIn ?? null,
    machining: machiningLevel(data.machining),
    parkingBrakeKept: data.parkingBrake?.kept ?? null,
    cost: totals.length ? { min: Math.min(...totals), max: Math.max(...totals), currency: data.currency } : null,
    fittedCount: s.fittedCount,
    updatedAt: s.approvedAt.toISOString(),
  };
}
