import { and, asc, eq, gt, sql } from 'drizzle-orm';
import { stringify } from 'csv-stringify/sync';
import type { Db } from '../../db/client';
import { chassis, revisions, swaps, takedowns, users } from '../../db/schema/index';
import { licenceLine, OPEN_DATA_LICENCE, type ExportedSwap } from '../../../shared/schemas/export';
import { SWAP_DATA_VERSION, type SwapData } from '../../../shared/schemas/swap-data';
import { upgradeSwapData } from '../../../shared/schemas/swap-data-upgrade';

// Every approved swap at its current revision, read in batches by swap id (keyset), so an export of any size
// holds one batch in memory and never keeps the database busy between batches: other requests run in between.

const BATCH = 500;

const published = and(eq(revisions.id, swaps.currentRevisionId), eq(revisions.status, 'approved'), eq(chassis.proposed, false));

function batchAfter(db: Db, afterId: number) {
  return db
    .select({
      swap: swaps,
      revision: {
        number: revisions.number,
        reviewedAt: revisions.reviewedAt,
        updatedAt: revisions.updatedAt,
        // a write-up a moderator took down is published as empty, as the sheet shows it
        body: sql<string>`case when exists (
          select 1 from ${takedowns} t
          where t.revision_id = ${revisions.id} and t.target = 'body' and t.reverted_at is null
        ) then '' else ${revisions.body} end`,
      },
      // the stored text, not the column's reading of it: see `recordOf`
      data: sql<string>`${revisions.data}`,
      chassis,
      author: users.login,
    })
    .from(swaps)
    .innerJoin(chassis, eq(chassis.id, swaps.chassisId))
    .innerJoin(revisions, published)
    .innerJoin(users, eq(users.id, revisions.authorId))
    .where(gt(swaps.id, afterId))
    .orderBy(asc(swaps.id))
    .limit(BATCH)
    .all();
}

/**
 * An approved version-2 record was validated and cleaned by the schema when it was written, so it is taken as
 * stored; re-validating every record on read made the export spend most of its time in the schema. Older
 * records are upgraded the way the column type does it.
 */
function recordOf(stored: string): SwapData {
  const data = JSON.parse(stored) as { schemaVersion?: unknown };
  return data.schemaVersion === SWAP_DATA_VERSION ? (data as SwapData) : upgradeSwapData(data);
}

/** Every published swap as the open data describes it, oldest swap first. */
export function* exportedSwaps(db: Db, siteUrl: string): Generator<ExportedSwap> {
  let afterId = 0;
  for (;;) {
    const rows = batchAfter(db, afterId);
    for (const { swap, revision, data, chassis: c, author } of rows) {
      yield {
        slug: swap.slug,
        permalink: `${siteUrl}/swaps/${swap.slug}/r/${revision.number}`,
        axle: swap.axle,
        category: swap.category,
        revision: { number: revision.number, approvedAt: (revision.reviewedAt ?? revision.updatedAt).toISOString() },
        author,
        chassis: {
          slug: c.slug,
          make: c.make,
          model: c.model,
          code: c.code,
          yearFrom: c.yearFrom,
          yearTo: c.yearTo,
          lugCount: c.lugCount,
          pcdMm: c.pcdMm,
          centreBoreMm: c.centreBoreMm,
          wheelBoltThread: c.wheelBoltThread,
          stockWheel: c.stockWheel,
          stockBrakes: c.stockBrakes,
          vehicle: c.vehicle ?? null,
          wheelFastening: c.wheelFastening ?? null,
        },
        record: recordOf(data),
        writeUp: revision.body,
      };
    }
    if (rows.length < BATCH) return;
    afterId = rows[rows.length - 1].swap.id;
  }
}

/** When the newest exported revision was approved: the same answer for the same data, so caches can share it. */
function asOf(db: Db): string | null {
  const row = db
    .select({ at: sql<number | null>`max(${revisions.reviewedAt})` })
    .from(swaps)
    .innerJoin(chassis, eq(chassis.id, swaps.chassisId))
    .innerJoin(revisions, published)
    .get();
  return row?.at ? new Date(row.at).toISOString() : null;
}

/** The JSON file, piece by piece: the licence first, then one swap at a time, the count last. */
export function* swapsJson(db: Db, siteUrl: string): Generator<string> {
  const licence = { ...OPEN_DATA_LICENCE, notice: licenceLine(siteUrl) };
  yield `{"licence":${JSON.stringify(licence)},"asOf":${JSON.stringify(asOf(db))},"swaps":[`;
  let count = 0;
  for (const swap of exportedSwaps(db, siteUrl)) yield (count++ === 0 ? '\n' : ',\n') + JSON.stringify(swap);
  yield `\n],"count":${count}}\n`;
}

export const csvColumns = [
  'slug',
  'permalink',
  'axle',
  'category',
  'revision_number',
  'approved_at',
  'author',
  'chassis_slug',
  'chassis_make',
  'chassis_model',
  'chassis_code',
  'chassis_year_from',
  'chassis_year_to',
  'title',
  'summary',
  'parts',
  'part_numbers',
  'adapter',
  'adapter_part_number',
  'min_wheel_diameter_in',
  'record_json',
  'chassis_json',
  'write_up',
] as const;

function csvRow(s: ExportedSwap): unknown[] {
  const r = s.record;
  return [
    s.slug,
    s.permalink,
    s.axle,
    s.category,
    s.revision.number,
    s.revision.approvedAt,
    s.author,
    s.chassis.slug,
    s.chassis.make,
    s.chassis.model,
    s.chassis.code,
    s.chassis.yearFrom,
    s.chassis.yearTo ?? '',
    r.title,
    r.summary ?? '',
    r.parts.map((p) => `${p.quantity} × ${p.name}`).join('; '),
    [...new Set(r.parts.flatMap((p) => p.partNumbers))].join(' '),
    r.adapter?.name ?? '',
    r.adapter?.partNumber ?? '',
    r.wheel?.minDiameterIn ?? '',
    JSON.stringify(r),
    JSON.stringify(s.chassis),
    s.writeUp,
  ];
}

/**
 * Cells are written by csv-stringify with `escape_formulas`: a text cell that begins with =, +, -, @, a tab or a
 * carriage return (or their full-width forms) gets a leading apostrophe, so a spreadsheet shows it as text and
 * never runs it as a formula. Numbers stay numbers (a negative offset is not a formula).
 */
const csvLines = (rows: unknown[][]) => stringify(rows, { escape_formulas: true, record_delimiter: 'unix' });

/** The CSV file, piece by piece: a `#` line naming the licence, the header, then one swap per row. */
export function* swapsCsv(db: Db, siteUrl: string): Generator<string> {
  yield `# ${licenceLine(siteUrl)}\n`;
  yield csvLines([[...csvColumns]]);
  let batch: unknown[][] = [];
  for (const swap of exportedSwaps(db, siteUrl)) {
    batch.push(csvRow(swap));
    if (batch.length === 100) {
      yield csvLines(batch);
      batch = [];
    }
  }
  if (batch.length) yield csvLines(batch);
}
