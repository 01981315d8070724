import { eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { chassis } from '../../db/schema/index';
import { AppError } from '../../lib/app-error';
import { partKinds } from '../../../shared/schemas/enums';
import { normalisePartNumber } from '../../../shared/search/normalise';
import type {
  ChassisDonor,
  ChassisGraph,
  DonorPart,
  FitGroup,
  GraphTotals,
  PartGraph,
  PartRef,
  RecordedNumber,
  SwapLink,
  WhereElse,
} from '../../../shared/schemas/graph';
import {
  adaptersIn,
  donorParts,
  linesOnChassis,
  recordedNumbers,
  revisionTitles,
  samePartAs,
  samePartByKey,
  swapsUsing,
  type RevisionTitle,
  type UseRow,
} from './interchange-queries';

// The three views of the interchange graph. Lists of swaps are cut to a few per group (newest approval
// first) with the full count beside them, so a part used by thousands of swaps still answers in one page.

/** chassis shown per part (most swaps first; the totals count them all), and swaps shown per chassis */
const SHOWN_CHASSIS = 48;
const SWAPS_PER_CHASSIS = 3;
const SWAPS_PER_DONOR = 3;
const DONORS_PER_KIND = 16;

const partRef = ({ id, slug, kind, name, maker, partNumbers }: DonorPart): PartRef => ({
  id,
  slug,
  kind,
  name,
  maker,
  partNumbers,
});

function adapterOf(a: Record<string, unknown> | null | undefined): SwapLink['adapter'] {
  const text = (v: unknown) => (typeof v === 'string' ? v : '');
  return a && typeof a === 'object' ? { name: text(a.name), maker: text(a.maker), partNumber: text(a.partNumber) } : null;
}

function linkFor(row: UseRow, titles: Map<number, RevisionTitle>): SwapLink {
  const t = titles.get(row.revisionId);
  return {
    slug: row.slug,
    title: t?.title ?? row.slug,
    axle: row.axle,
    revisionNumber: row.revisionNumber,
    adapter: adapterOf(t?.adapter),
    partId: row.partId,
  };
}

/** one row per swap (a swap may list two records of the same part), in the order given */
function oncePerSwap(rows: UseRow[]): UseRow[] {
  const seen = new Set<number>();
  return rows.filter((r) => !seen.has(r.revisionId) && !!seen.add(r.revisionId));
}

/**
 * Swaps grouped by the chassis they fit, most swaps first, with the catalogue adapters they use there. Only the
 * first groups are read in full (titles, adapters): a part on a thousand chassis still answers in one page.
 */
function fitsByChassis(db: Db, uses: UseRow[], notAdapters: Set<number>): { fits: FitGroup[]; totals: GraphTotals } {
  const groups = new Map<number, UseRow[]>();
  for (const row of oncePerSwap(uses)) groups.set(row.chassisId, [...(groups.get(row.chassisId) ?? []), row]);
  const ordered = [...groups.values()]
    .sort((a, b) => b.length - a.length || a[0].make.localeCompare(b[0].make) || a[0].model.localeCompare(b[0].model))
    .slice(0, SHOWN_CHASSIS);
  const chassisOfRevision = new Map(ordered.flatMap((rows) => rows.map((r) => [r.revisionId, r.chassisId] as const)));
  const adapterIds = new Map<number, Set<number>>();
  for (const a of adaptersIn(db, [...chassisOfRevision.keys()])) {
    if (notAdapters.has(a.partId)) continue;
    const chassisId = chassisOfRevision.get(a.revisionId)!;
    adapterIds.set(chassisId, (adapterIds.get(chassisId) ?? new Set()).add(a.partId));
  }
  const adapters = new Map(donorParts(db, [...new Set([...adapterIds.values()].flatMap((s) => [...s]))]).map((p) => [p.id, p]));
  const titles = revisionTitles(
    db,
    ordered.flatMap((rows) => rows.slice(0, SWAPS_PER_CHASSIS).map((r) => r.revisionId)),
  );
  const fits = ordered.map((rows) => ({
    chassis: {
      slug: rows[0].chassisSlug,
      make: rows[0].make,
      model: rows[0].model,
      code: rows[0].code,
      yearFrom: rows[0].yearFrom,
      yearTo: rows[0].yearTo,
    },
    swapCount: rows.length,
    swaps: rows.slice(0, SWAPS_PER_CHASSIS).map((r) => linkFor(r, titles)),
    adapters: [...(adapterIds.get(rows[0].chassisId) ?? [])].map((id) => partRef(adapters.get(id)!)),
  }));
  const swapCount = [...groups.values()].reduce((n, rows) => n + rows.length, 0);
  return { fits, totals: { chassis: groups.size, swaps: swapCount } };
}

/** each number once (by its key): carried numbers before stamps, the given record's before the others' */
function distinctNumbers(numbers: (RecordedNumber & { key: string })[], firstPart?: number) {
  const rank = (n: RecordedNumber) => (n.source === 'number' ? 0 : 2) + (n.partId === firstPart ? 0 : 1);
  const byKey = new Map<string, RecordedNumber & { key: string }>();
  for (const n of [...numbers].sort((a, b) => rank(a) - rank(b))) if (!byKey.has(n.key)) byKey.set(n.key, n);
  return [...byKey.values()];
}

const unique = (values: string[]) => [...new Set(values)];
const recorded = ({ number, partId, source }: RecordedNumber): RecordedNumber => ({ number, partId, source });

/** A part page's graph: the vehicles it came on, and every chassis approved swaps fit it to, with how. */
export function partGraph(db: Db, partId: number): PartGraph {
  const same = samePartAs(db, partId).map((s) => s.partId);
  const records = donorParts(db, same);
  const part = records.find((p) => p.id === partId);
  if (!part) throw AppError.notFound('That part');
  const { fits, totals } = fitsByChassis(db, swapsUsing(db, same), new Set(same));
  return {
    part,
    sameAs: records.filter((p) => p.id !== partId),
    numbers: distinctNumbers(recordedNumbers(db, same), partId).map(recorded),
    cameOn: unique(records.flatMap((p) => p.cameOn)),
    fits,
    totals,
  };
}

/** A chassis page's graph: the parts that fit it through any approved swap, by kind, each with the swaps. */
export function chassisGraph(db: Db, slug: string): ChassisGraph {
  const row = db.select().from(chassis).where(eq(chassis.slug, slug)).get();
  // a proposed chassis has no approved swaps to show, and the graph is public: it is not found here
  if (!row || row.proposed) throw AppError.notFound('That chassis');
  const lines = linesOnChassis(db, row.id);
  const byPart = new Map<number, UseRow[]>();
  for (const line of lines) byPart.set(line.partId, [...(byPart.get(line.partId) ?? []), line]);
  for (const [id, rows] of byPart) byPart.set(id, oncePerSwap(rows));
  const parts = new Map(donorParts(db, [...byPart.keys()]).map((p) => [p.id, p]));
  const donors = [...byPart.entries()]
    .filter(([id]) => parts.has(id))
    .map(([id, rows]) => ({ part: parts.get(id)!, rows }))
    .sort((a, b) => b.rows.length - a.rows.length || a.part.name.localeCompare(b.part.name));
  const kinds = partKinds
    .map((kind) => {
      const ofKind = donors.filter((d) => d.part.kind === kind);
      return { kind, partCount: ofKind.length, shown: ofKind.slice(0, DONORS_PER_KIND) };
    })
    .filter((k) => k.partCount > 0);
  const titles = revisionTitles(
    db,
    kinds.flatMap((k) => k.shown.flatMap((d) => d.rows.slice(0, SWAPS_PER_DONOR).map((r) => r.revisionId))),
  );
  return {
    chassis: { slug: row.slug, make: row.make, model: row.model, code: row.code, yearFrom: row.yearFrom, yearTo: row.yearTo },
    kinds: kinds.map(({ kind, partCount, shown }) => ({
      kind,
      partCount,
      parts: shown.map((d): ChassisDonor => ({
        part: d.part,
        swapCount: d.rows.length,
        swaps: d.rows.slice(0, SWAPS_PER_DONOR).map((r) => linkFor(r, titles)),
      })),
    })),
    totals: { parts: donors.length, swaps: new Set(lines.map((l) => l.revisionId)).size },
  };
}

/** Where else a part number goes: its records, the other numbers of the same part, every chassis it reaches. */
export function whereElse(db: Db, number: string): WhereElse {
  const key = normalisePartNumber(number);
  const same = samePartByKey(db, key);
  const matched = new Map(same.map((s) => [s.partId, s.matched]));
  const ids = same.map((s) => s.partId);
  const records = donorParts(db, ids);
  const { fits: reaches, totals } = fitsByChassis(db, swapsUsing(db, ids), new Set(ids));
  const order = { number: 0, stamp: 1, same_part: 2 } as const;
  return {
    number,
    key,
    parts: records.map((p) => ({ ...p, matched: matched.get(p.id)! })).sort((a, b) => order[a.matched] - order[b.matched]),
    otherNumbers: distinctNumbers(recordedNumbers(db, ids))
      .filter((n) => n.key !== key)
      .map(recorded),
    cameOn: unique(records.flatMap((p) => p.cameOn)),
    reaches,
    totals,
  };
}
