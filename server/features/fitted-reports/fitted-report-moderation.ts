import { and, asc, desc, eq, isNotNull, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { fittedReports, revisions, swaps, users } from '../../db/schema/index';
import type { Clock } from '../../lib/clock';
import { AppError } from '../../lib/app-error';
import type { SessionUser } from '../../middleware/require-role';
import type { ModerationReportList } from '../../../shared/schemas/fitted-reports';
import { trustLevelsOf } from '../trust/member-trust';
import { recount, reportView } from './fitted-reports.service';

// The moderators' side of fitted reports: the reports new members wrote, waiting to go live, and the hidden ones.

const LIST_LIMIT = 200;

/** GET /api/fitted-reports: held reports oldest first (the longest waiting on top), or hidden ones newest first. */
export function moderationReports(db: Db, show: 'held' | 'hidden'): ModerationReportList {
  const where = show === 'held' ? eq(fittedReports.state, 'held') : isNotNull(fittedReports.hiddenAt);
  const rows = db
    .select({
      report: fittedReports,
      member: users,
      revisionNumber: revisions.number,
      slug: swaps.slug,
      title: sql<string>`(select json_extract(c.data, '$.title') from revisions c where c.id = ${swaps.currentRevisionId})`,
    })
    .from(fittedReports)
    .innerJoin(users, eq(users.id, fittedReports.userId))
    .innerJoin(revisions, eq(revisions.id, fittedReports.revisionId))
    .innerJoin(swaps, eq(swaps.id, fittedReports.swapId))
    .where(where)
    .orderBy(
      show === 'held' ? asc(fittedReports.updatedAt) : desc(fittedReports.hiddenAt),
      show === 'held' ? asc(fittedReports.id) : desc(fittedReports.id),
    )
    .limit(LIST_LIMIT)
    .all();
  const trust = trustLevelsOf(
    db,
    rows.map((r) => r.member),
  );
  const count = (condition: ReturnType<typeof eq>) =>
    db
      .select({ n: sql<number>`count(*)` })
      .from(fittedReports)
      .where(condition)
      .get()!.n;
  return {
    show,
    items: rows.map((r) => ({
      ...reportView(r),
      swap: { slug: r.slug, title: r.title ?? r.slug },
      memberTrust: trust.get(r.member.id)!,
    })),
    counts: { held: count(eq(fittedReports.state, 'held')), hidden: count(isNotNull(fittedReports.hiddenAt)) },
  };
}

/** A moderator lets a held report go live: it shows on the sheet and counts toward its verification. */
export function releaseFittedReport({ db, clock }: { db: Db; clock: Clock }, id: number, moderator: SessionUser) {
  const report = db.select().from(fittedReports).where(eq(fittedReports.id, id)).get();
  if (!report) throw AppError.notFound('That fitted report');
  if (report.userId === moderator.id) throw AppError.forbidden('Another moderator has to check your own report.');
  const now = clock.now();
  db.transaction((tx) => {
    const changed = tx
      .update(fittedReports)
      .set({ state: 'live', releasedAt: now, releasedById: moderator.id })
      .where(and(eq(fittedReports.id, id), eq(fittedReports.state, 'held')))
      .run().changes;
    if (!changed) throw AppError.conflict('This report is not waiting for a moderator any more.');
    recount(tx as unknown as Db, report.swapId);
  });
  return { id, state: 'live' as const };
}
