import { inArray } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { swaps } from '../../db/schema/index';
import { AppError } from '../../lib/app-error';

/**
 * The approved swaps named by `slugs`, in their order, all for `chassisId`; every problem is named by its
 * list position under `field` (`swapSlugs.1`).
 */
export function approvedSwapsOn(db: Db, slugs: string[], chassisId: number, field: string, message: string) {
  const rows = slugs.length ? db.select().from(swaps).where(inArray(swaps.slug, slugs)).all() : [];
  const fields: Record<string, string> = {};
  const found = slugs.map((slug, i) => {
    const row = rows.find((r) => r.slug === slug);
    if (!row || row.currentRevisionId === null) fields[`${field}.${i}`] = `No approved swap “${slug}”`;
    else if (row.chassisId !== chassisId) fields[`${field}.${i}`] = 'That swap is for another chassis';
    return row;
  });
  if (Object.keys(fields).length) throw AppError.invalid(message, fields);
  return found as (typeof swaps.$inferSelect)[];
}
