import { and, asc, eq, lt, sql, type SQL } from 'drizzle-orm';
import { chassis, revisions, swaps, users } from '../../db/schema/index';
import type { SessionUser } from '../../middleware/require-role';
import type { ReviewQueue, ReviewQueueItem } from '../../../shared/schemas/submissions';
import {
  QUEUE_PAGE_SIZE,
  type CheckOutcome,
  type ReviewQueueFilters,
  type ReviewQueueQuery,
} from '../../../shared/schemas/review-queue';
import { iso, personRef } from '../swaps/swap-views';
import { checksFor, duplicateCandidates, photoCounts, type DuplicateCandidate } from '../submissions/submission-views';
import { trustRecords } from '../trust/member-trust';
import { trustLevel } from '../../../shared/trust';
import { claimsOn, tryClaim } from './review-claims.service';
import { flagPage } from '../flags/flags.service';
import type { ReviewDeps } from './review.service';
import { chassisName } from '../../../shared/chassis-label';

// The desk's queue: filters in SQL where they can be (status, chassis, category, age, words), then the automatic
// checks and the authors' trust levels for what is left (both are filters too), oldest first, a page at a time.

const DAY_MS = 24 * 60 * 60 * 1000;
/** more than a desk ever holds; a bound so one request cannot read without end */
const MAX_MATCHING = 5000;

/** every word must appear in the title, summary, a part's name, maker or number, the author or the chassis */
function wordsWhere(q: string): SQL[] {
  const haystack = sql`lower(
    coalesce(json_extract(${revisions.data}, '$.title'), '') || ' ' ||
    coalesce(json_extract(${revisions.data}, '$.summary'), '') || ' ' ||
    coalesce((select group_concat(
      coalesce(json_extract(p.value, '$.name'), '') || ' ' || coalesce(json_extract(p.value, '$.maker'), '') || ' ' ||
      coalesce(json_extract(p.value, '$.partNumbers'), ''), ' ') from json_each(${revisions.data}, '$.parts') p), '') || ' ' ||
    ${users.login} || ' ' || ${users.name} || ' ' ||
    ${chassis.make} || ' ' || ${chassis.model} || ' ' || ${chassis.code} || ' ' || ${swaps.slug})`;
  // part numbers are found without their separators, as search finds them
  const compact = sql`replace(replace(replace(replace(${haystack}, '-', ''), ' ', ''), '.', ''), '/', '')`;
  return q
    .toLowerCase()
    .split(/\s+/)
    .filter(Boolean)
    .slice(0, 8)
    .map((word) => {
      const key = word.replace(/[^a-z0-9]/g, '');
      return /\d/.test(key)
        ? sql`(instr(${haystack}, ${word}) > 0 or instr(${compact}, ${key}) > 0)`
        : sql`instr(${haystack}, ${word}) > 0`;
    });
}

const outcomeOf = (failed: number, attention: number): CheckOutcome =>
  failed > 0 ? 'fail' : attention > 0 ? 'attention' : 'clear';

type Matching = ReviewQueueItem & { authorId: number };

/** Every revision the filters match, oldest first, with its checks, the author's standing and any claim. */
function matching(deps: ReviewDeps, viewer: SessionUser, filters: ReviewQueueFilters): Matching[] {
  const { db, clock } = deps;
  const now = clock.now();
  const where: SQL[] = [eq(revisions.status, filters.status)];
  if (filters.chassis) where.push(eq(chassis.slug, filters.chassis));
  if (filters.category) where.push(eq(swaps.category, filters.category));
  if (filters.olderThanDays !== undefined)
    where.push(lt(revisions.submittedAt, new Date(now.getTime() - filters.olderThanDays * DAY_MS)));
  if (filters.q) where.push(...wordsWhere(filters.q));
  const rows = db
    .select({ revision: revisions, swap: swaps, chassis, author: users })
    .from(revisions)
    .innerJoin(swaps, eq(swaps.id, revisions.swapId))
    .innerJoin(chassis, eq(chassis.id, swaps.chassisId))
    .innerJoin(users, eq(users.id, revisions.authorId))
    .where(and(...where))
    .orderBy(asc(revisions.submittedAt), asc(revisions.id))
    .limit(MAX_MATCHING)
    .all();
  const ids = rows.map((r) => r.revision.id);
  const photos = photoCounts(db, ids);
  const claims = claimsOn(db, ids, viewer.id, now);
  const trust = trustRecords(
    db,
    rows.map((r) => r.author),
  );
  // the approved swaps a record is compared with, read once per chassis and axle
  const candidates = new Map<string, DuplicateCandidate[]>();
  const candidatesFor = (chassisId: number, axle: 'front' | 'rear') => {
    const key = `${chassisId}:${axle}`;
    if (!candidates.has(key)) candidates.set(key, duplicateCandidates(db, chassisId, axle));
    return candidates.get(key)!;
  };
  const items = rows.map((row): Matching => {
    const checks = checksFor(db, row, photos.get(row.revision.id) ?? 0, candidatesFor(row.swap.chassisId, row.swap.axle));
    const failedChecks = checks.filter((c) => c.status === 'fail').length;
    const attentionChecks = checks.filter((c) => c.status === 'attention').length;
    const record = trust.get(row.author.id)!;
    return {
      revisionId: row.revision.id,
      swapSlug: row.swap.slug,
      title: row.revision.data.title,
      author: personRef(row.author),
      authorId: row.author.id,
      authorTrust: trustLevel(record),
      authorApproved: record.approvedRevisions,
      submittedAt: iso(row.revision.submittedAt),
      status: row.revision.status,
      number: row.revision.number,
      isCorrection: row.revision.number > 1,
      chassis: {
        slug: row.chassis.slug,
        label: chassisName(row.chassis),
      },
      axle: row.swap.axle,
      category: row.swap.category,
      failedChecks,
      attentionChecks,
      checkOutcome: outcomeOf(failedChecks, attentionChecks),
      claim: claims.get(row.revision.id) ?? null,
    };
  });
  return items.filter(
    (i) =>
      (!filters.checks || i.checkOutcome === filters.checks) && (!filters.authorTrust || i.authorTrust === filters.authorTrust),
  );
}

/** GET /api/review/queue */
export function reviewQueue(deps: ReviewDeps, viewer: SessionUser, query: ReviewQueueQuery): ReviewQueue {
  const { db } = deps;
  const { page, ...filters } = query;
  const all = matching(deps, viewer, filters);
  const items = all.slice((page - 1) * QUEUE_PAGE_SIZE, page * QUEUE_PAGE_SIZE).map(({ authorId: _, ...item }) => item);
  const count = (status: 'in_review' | 'sent_back') =>
    db
      .select({ n: sql<number>`count(*)` })
      .from(revisions)
      .where(eq(revisions.status, status))
      .get()!.n;
  const openFlags = flagPage(db, 1);
  return {
    items,
    total: all.length,
    page,
    pageSize: QUEUE_PAGE_SIZE,
    counts: { in_review: count('in_review'), sent_back: count('sent_back'), flags: openFlags.total },
    flags: openFlags.items,
  };
}

/**
 * POST /api/review/next: claims the oldest submission at the desk that matches the filters, that nobody holds
 * and that the moderator did not write, and answers with its id (null when none is left). Claiming is one statement
 * per candidate, so two moderators asking at once are handed different submissions.
 */
export function claimNext(deps: ReviewDeps, viewer: SessionUser, filters: ReviewQueueFilters, after?: number) {
  const now = deps.clock.now();
  const candidates = matching(deps, viewer, { ...filters, status: 'in_review' }).filter(
    (i) => i.authorId !== viewer.id && !i.claim && i.revisionId !== after,
  );
  for (const item of candidates) {
    const claim = tryClaim(deps.db, viewer, item.revisionId, now);
    if (claim) return { revisionId: item.revisionId, claim };
  }
  return { revisionId: null, claim: null };
}
