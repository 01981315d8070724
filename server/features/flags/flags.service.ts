import { and, asc, desc, eq, inArray, isNull, lte, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/sqlite-core';
import type { Db, DbTransaction } from '../../db/client';
import { flags, revisions, swaps, users } from '../../db/schema/index';
import { AppError } from '../../lib/app-error';
import { stripHtml } from '../../lib/sanitize';
import { flagOutcomes as flagOutcomesMessage } from '../../mail/messages';
import type { SessionUser } from '../../middleware/require-role';
import type { SubmissionDeps } from '../submissions/submissions.service';
import { personRef } from '../swaps/swap-views';
import { FLAG_PAGE_SIZE, type FlagItem, type FlagPage } from '../../../shared/schemas/submissions';
import {
  FLAG_GIST_LENGTH,
  flagOutcomeLabels,
  safetyFlagKinds,
  type FlagKind,
  type FlagOutcome,
  type OpenSafetyFlag,
} from '../../../shared/schemas/flags';

export type FlagDeps = SubmissionDeps;
type Tx = DbTransaction;
type Reader = Db | Tx;

/** A reporter hears about flag outcomes at most once in this long; what is settled meanwhile waits for the next message. */
export const FLAG_MAIL_INTERVAL_MS = 24 * 60 * 60 * 1000;

const correction = alias(revisions, 'correction');

function flagItems(db: Reader, where: SQL, page?: { limit: number; offset: number }): FlagItem[] {
  const query = db
    .select({
      flag: flags,
      slug: swaps.slug,
      title: sql<string | null>`json_extract(${revisions.data}, '$.title')`,
      reporter: users,
      correction: { revisionId: correction.id, number: correction.number, status: correction.status },
    })
    .from(flags)
    .innerJoin(swaps, eq(swaps.id, flags.swapId))
    .leftJoin(revisions, eq(revisions.id, swaps.currentRevisionId))
    .innerJoin(users, eq(users.id, flags.reporterId))
    .leftJoin(correction, eq(correction.id, flags.correctionRevisionId))
    .where(where)
    .orderBy(asc(flags.createdAt), asc(flags.id))
    .$dynamic();
  const rows = (page ? query.limit(page.limit).offset(page.offset) : query).all();
  const candidates = correctionsOf(
    db,
    rows.map((r) => r.flag.swapId),
  );
  return rows.map((r) => ({
    id: r.flag.id,
    swapSlug: r.slug,
    title: r.title ?? r.slug,
    kind: r.flag.kind,
    reason: r.flag.reason,
    reporter: personRef(r.reporter),
    status: r.flag.status,
    createdAt: r.flag.createdAt.toISOString(),
    outcome: r.flag.outcome,
    resolutionNote: r.flag.resolutionNote,
    correction: r.correction?.revisionId ? r.correction : null,
    corrections: candidates
      .filter((c) => c.swapId === r.flag.swapId && answers(r.flag, c))
      .map((c) => ({ revisionId: c.revisionId, number: c.number, status: c.status })),
  }));
}

/** Corrections of the swaps (at the desk, back for rework or published), newest first; `answers` picks a flag's. */
function correctionsOf(db: Reader, swapIds: number[]) {
  if (swapIds.length === 0) return [];
  return db
    .select({
      swapId: revisions.swapId,
      revisionId: revisions.id,
      number: revisions.number,
      status: revisions.status,
      reviewedAt: revisions.reviewedAt,
    })
    .from(revisions)
    .where(
      and(
        inArray(revisions.swapId, [...new Set(swapIds)]),
        inArray(revisions.status, ['in_review', 'sent_back', 'approved', 'superseded']),
        sql`${revisions.number} > 1`,
      ),
    )
    .orderBy(desc(revisions.number))
    .all();
}

const flagById = (db: Reader, id: number) => flagItems(db, eq(flags.id, id))[0];

/** GET /api/review/flags: open flags a page at a time, oldest first, with how many are open. */
export function flagPage(db: Db, page: number): FlagPage {
  const total = db
    .select({ n: sql<number>`count(*)` })
    .from(flags)
    .where(eq(flags.status, 'open'))
    .get()!.n;
  const items = flagItems(db, eq(flags.status, 'open'), { limit: FLAG_PAGE_SIZE, offset: (page - 1) * FLAG_PAGE_SIZE });
  return { items, total, page, pageSize: FLAG_PAGE_SIZE };
}

/** Any signed-in member may flag a public swap, saying what kind of problem it is. */
export function createFlag(deps: FlagDeps, user: SessionUser, slug: string, input: { kind: FlagKind; reason: string }): FlagItem {
  const { db, clock } = deps;
  const swap = db.select({ id: swaps.id, current: swaps.currentRevisionId }).from(swaps).where(eq(swaps.slug, slug)).get();
  if (!swap || swap.current === null) throw AppError.notFound('That swap');
  const clean = stripHtml(input.reason).trim();
  if (clean.length < 5)
    throw AppError.invalid('Say what is wrong (at least 5 characters).', {
      reason: 'Say what is wrong (at least 5 characters).',
    });
  const now = clock.now();
  let id: number;
  try {
    id = db
      .insert(flags)
      .values({ swapId: swap.id, reporterId: user.id, kind: input.kind, reason: clean, createdAt: now, updatedAt: now })
      .returning({ id: flags.id })
      .get().id;
  } catch (err) {
    // one open flag per member and swap: the partial unique index decides
    if (err instanceof Error && err.message.includes('UNIQUE constraint failed: flags.swap_id, flags.reporter_id'))
      throw new AppError(
        'open_flag',
        'You have already flagged this swap and a moderator has not resolved it yet; they will read what you wrote.',
        409,
        { reason: 'You already flagged this swap.' },
      );
    throw err;
  }
  return flagById(db, id);
}

/**
 * The open flags about a safety figure on a swap, as its readers see them: the kind and the gist of what
 * was said (one line, cut short), never who said it.
 */
export function openSafetyFlags(db: Db, swapId: number): OpenSafetyFlag[] {
  return db
    .select({ id: flags.id, kind: flags.kind, reason: flags.reason, at: flags.createdAt, correctionStatus: correction.status })
    .from(flags)
    .leftJoin(correction, eq(correction.id, flags.correctionRevisionId))
    .where(and(eq(flags.swapId, swapId), eq(flags.status, 'open'), inArray(flags.kind, [...safetyFlagKinds])))
    .orderBy(asc(flags.createdAt), asc(flags.id))
    .all()
    .map((f) => {
      const line = f.reason.replace(/\s+/g, ' ').trim();
      return {
        id: f.id,
        kind: f.kind as OpenSafetyFlag['kind'],
        gist: line.length > FLAG_GIST_LENGTH ? `${line.slice(0, FLAG_GIST_LENGTH - 1).trimEnd()}…` : line,
        raisedAt: f.at.toISOString(),
        correctionPending: f.correctionStatus === 'in_review',
      };
    });
}

type Answerable = { swapId: number; createdAt: Date };
type Candidate = { status: string; reviewedAt: Date | null; number: number };

/**
 * Whether a revision can answer a flag: a correction of the flagged swap at the desk, or published after
 * the flag was raised (the revision a reader flagged cannot be its own fix).
 */
const answers = (flag: Answerable, r: Candidate) =>
  r.number > 1 &&
  (r.status === 'in_review' ||
    r.status === 'sent_back' ||
    ((r.status === 'approved' || r.status === 'superseded') && r.reviewedAt !== null && r.reviewedAt >= flag.createdAt));

function answeringRevision(db: Reader, flag: Answerable, revisionId: number, field: string) {
  const row = db.select().from(revisions).where(eq(revisions.id, revisionId)).get();
  if (!row || row.swapId !== flag.swapId || !answers(flag, row))
    throw AppError.invalid('Link a correction of the flagged swap, at the desk or published since the flag was raised.', {
      [field]: 'Not a correction of this swap made after the flag',
    });
  return row;
}

/** POST /api/review/flags/:id/link: the correction that answers a flag (or none); approving it resolves the flag. */
export function linkCorrection(deps: FlagDeps, id: number, revisionId: number | null): FlagItem {
  const { db, clock } = deps;
  const flag = db.select().from(flags).where(eq(flags.id, id)).get();
  if (!flag) throw AppError.notFound('That flag');
  if (flag.status !== 'open') throw AppError.conflict('This flag is already resolved.');
  if (revisionId !== null) answeringRevision(db, flag, revisionId, 'revisionId');
  db.update(flags).set({ correctionRevisionId: revisionId, updatedAt: clock.now() }).where(eq(flags.id, id)).run();
  return flagById(db, id);
}

/** A correction sent to the desk names the open flags it answers; they must be open flags of its own swap. */
export function answerFlags(tx: Tx, swapId: number, revisionId: number, flagIds: number[], now: Date) {
  if (flagIds.length === 0) return;
  const rows = tx.select().from(flags).where(inArray(flags.id, flagIds)).all();
  const fields: Record<string, string> = {};
  flagIds.forEach((id, i) => {
    const row = rows.find((r) => r.id === id);
    if (!row || row.swapId !== swapId || row.status !== 'open')
      fields[`answersFlagIds.${i}`] = `Flag ${id} is not open on this swap`;
  });
  if (Object.keys(fields).length) throw AppError.invalid('Only open flags of this swap can be answered.', fields);
  tx.update(flags).set({ correctionRevisionId: revisionId, updatedAt: now }).where(inArray(flags.id, flagIds)).run();
}

type Resolution = { outcome: FlagOutcome; note: string; correctionRevisionId?: number | null };

const outcomeNeedsCorrection = (flag: typeof flags.$inferSelect, r: Resolution, db: Reader, field: string) => {
  const revisionId = r.correctionRevisionId ?? flag.correctionRevisionId;
  if (revisionId === null || revisionId === undefined)
    throw AppError.invalid('Name the correction that fixed it.', { correctionRevisionId: 'Pick the published correction' });
  const revision = answeringRevision(db, flag, revisionId, field);
  if (revision.status !== 'approved' && revision.status !== 'superseded')
    throw new AppError(
      'correction_not_published',
      'That correction is not published yet; approving it resolves this flag.',
      409,
      { [field]: 'Not published yet' },
    );
  return revisionId;
};

function settle(
  tx: Tx,
  actor: SessionUser | null,
  ids: number[],
  r: Resolution & { correctionRevisionId?: number | null },
  now: Date,
) {
  tx.update(flags)
    .set({
      status: 'resolved',
      outcome: r.outcome,
      resolutionNote: r.note,
      ...(r.correctionRevisionId ? { correctionRevisionId: r.correctionRevisionId } : {}),
      resolvedById: actor?.id ?? null,
      resolvedAt: now,
      updatedAt: now,
    })
    .where(and(inArray(flags.id, ids), eq(flags.status, 'open')))
    .run();
}

/** POST /api/review/flags/:id/resolve: one outcome per flag; the reporter hears of it (at most one message a day). */
export function resolveFlag(deps: FlagDeps, actor: SessionUser, id: number, input: Resolution): FlagItem {
  const { db, clock } = deps;
  const note = stripHtml(input.note).trim();
  const now = clock.now();
  const flag = db.select().from(flags).where(eq(flags.id, id)).get();
  if (!flag) throw AppError.notFound('That flag');
  return db.transaction((tx) => {
    const current = tx.select().from(flags).where(eq(flags.id, id)).get()!;
    if (current.status !== 'open') throw AppError.conflict('This flag was already resolved.');
    const correctionRevisionId =
      input.outcome === 'fixed_by_correction' ? outcomeNeedsCorrection(current, input, tx, 'correctionRevisionId') : null;
    settle(tx, actor, [id], { ...input, note, correctionRevisionId }, now);
    notifyFlagOutcomes(deps, tx, flag.reporterId, now);
    return flagById(tx, id);
  });
}

/** Several flags settled with one outcome and note, all of them or none (a flood of spam, duplicates of one report). */
export function bulkResolveFlags(deps: FlagDeps, actor: SessionUser, ids: number[], input: Resolution): number[] {
  const { db, clock } = deps;
  const note = stripHtml(input.note).trim();
  const unique = [...new Set(ids)];
  const now = clock.now();
  if (input.outcome === 'fixed_by_correction')
    throw AppError.invalid('Flags fixed by a correction are resolved one at a time, each with its correction.', {
      outcome: 'Resolve these one at a time',
    });
  return db.transaction((tx) => {
    const rows = tx.select().from(flags).where(inArray(flags.id, unique)).all();
    const fields: Record<string, string> = {};
    unique.forEach((id, i) => {
      const row = rows.find((r) => r.id === id);
      if (!row) fields[`ids.${i}`] = `Flag ${id} was not found.`;
      else if (row.status !== 'open') fields[`ids.${i}`] = `Flag ${id} is already resolved.`;
    });
    if (Object.keys(fields).length)
      throw new AppError('not_resolvable', 'Some of these flags cannot be resolved; nothing was changed.', 409, fields);
    settle(tx, actor, unique, { ...input, note }, now);
    for (const reporterId of new Set(rows.map((r) => r.reporterId))) notifyFlagOutcomes(deps, tx, reporterId, now);
    return unique;
  });
}

/** Approving a correction resolves the open flags linked to it: it is the fix they asked for. */
export function resolveFlagsAnsweredBy(deps: FlagDeps, tx: Tx, revisionId: number, number: number, now: Date) {
  const answered = tx
    .select({ id: flags.id, reporterId: flags.reporterId })
    .from(flags)
    .where(and(eq(flags.correctionRevisionId, revisionId), eq(flags.status, 'open')))
    .all();
  if (answered.length === 0) return;
  settle(
    tx,
    null,
    answered.map((f) => f.id),
    { outcome: 'fixed_by_correction', note: `Revision ${number}, which answers this flag, is now published.` },
    now,
  );
  for (const reporterId of new Set(answered.map((f) => f.reporterId))) notifyFlagOutcomes(deps, tx, reporterId, now);
}

/**
 * Mails a reporter every outcome of theirs not yet told, in one message, unless they had one within the
 * last day; then the outcomes wait for `sendDueFlagOutcomes`. A flag settled as spam is not mailed about.
 */
function notifyFlagOutcomes(deps: FlagDeps, tx: Tx, reporterId: number, now: Date): boolean {
  const mine = and(eq(flags.reporterId, reporterId), eq(flags.status, 'resolved'));
  tx.update(flags)
    .set({ reporterNotifiedAt: now })
    .where(and(mine, isNull(flags.reporterNotifiedAt), eq(flags.outcome, 'spam')))
    .run();
  const last = tx
    .select({ at: sql<number | null>`max(${flags.reporterNotifiedAt})` })
    .from(flags)
    .where(and(mine, sql`${flags.outcome} is not 'spam'`))
    .get()?.at;
  if (last !== null && last !== undefined && now.getTime() - last < FLAG_MAIL_INTERVAL_MS) return false;
  const pending = flagItems(tx, and(mine, isNull(flags.reporterNotifiedAt))!);
  const reporter = tx.select().from(users).where(eq(users.id, reporterId)).get();
  if (pending.length === 0 || !reporter) return false;
  deps.mailer.queue(
    tx,
    reporter,
    flagOutcomesMessage({
      appUrl: deps.appUrl,
      name: reporter.name || reporter.login,
      flags: pending.map((f) => ({
        title: f.title,
        slug: f.swapSlug,
        reason: f.reason,
        outcome: flagOutcomeLabels[f.outcome!],
        note: f.resolutionNote ?? '',
      })),
    }),
  );
  tx.update(flags)
    .set({ reporterNotifiedAt: now })
    .where(
      inArray(
        flags.id,
        pending.map((f) => f.id),
      ),
    )
    .run();
  return true;
}

/** Sends the outcomes that waited for a reporter's daily message once their day has passed. Returns how many reporters were mailed. */
export function sendDueFlagOutcomes(deps: FlagDeps): number {
  const now = deps.clock.now();
  const waiting = deps.db
    .selectDistinct({ reporterId: flags.reporterId })
    .from(flags)
    .where(and(eq(flags.status, 'resolved'), isNull(flags.reporterNotifiedAt), lte(flags.resolvedAt, now)))
    .all();
  return waiting.filter(({ reporterId }) => deps.db.transaction((tx) => notifyFlagOutcomes(deps, tx, reporterId, now))).length;
}

/** Runs `sendDueFlagOutcomes` every hour in the server process. */
export function startFlagOutcomeMail(deps: FlagDeps, everyMs = 60 * 60 * 1000): () => void {
  const run = () => {
    try {
      const mailed = sendDueFlagOutcomes(deps);
      if (mailed) deps.logger.info({ event: 'flag_outcomes_mailed', reporters: mailed }, 'flag outcomes mailed');
    } catch (err) {
      deps.logger.error({ err }, 'flag outcome mail failed');
    }
  };
  const timer = setInterval(run, everyMs);
  timer.unref();
  return () => clearInterval(timer);
}
