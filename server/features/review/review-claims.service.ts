import { and, eq, gt, inArray, or, sql } from 'drizzle-orm';
import type { Db, DbTransaction } from '../../db/client';
import { reviewClaims, revisions, users } from '../../db/schema/index';
import { AppError } from '../../lib/app-error';
import type { SessionUser } from '../../middleware/require-role';
import { CLAIM_MINUTES, type ReviewClaim } from '../../../shared/schemas/review-queue';
import { personRef } from '../swaps/swap-views';

// A moderator claims a submission while working on it, so two people do not review the same brake record at once.
// A claim lapses after CLAIM_MINUTES; any moderator may release one; a decision ends it. Deciding on a submission
// someone else holds is refused until their claim is released or lapses.

type Reader = Db | DbTransaction;
const CLAIM_MS = CLAIM_MINUTES * 60 * 1000;

const time = (d: Date) => `${d.toISOString().slice(11, 16)} UTC`;

/** Unexpired claims on these revisions, by revision id, in the reader's view. */
export function claimsOn(db: Reader, revisionIds: number[], viewerId: number, now: Date): Map<number, ReviewClaim> {
  const out = new Map<number, ReviewClaim>();
  if (revisionIds.length === 0) return out;
  const rows = db
    .select({ claim: reviewClaims, by: users })
    .from(reviewClaims)
    .innerJoin(users, eq(users.id, reviewClaims.moderatorId))
    .where(and(inArray(reviewClaims.revisionId, revisionIds), gt(reviewClaims.expiresAt, now)))
    .all();
  for (const { claim, by } of rows)
    out.set(claim.revisionId, {
      by: personRef(by),
      claimedAt: claim.claimedAt.toISOString(),
      expiresAt: claim.expiresAt.toISOString(),
      mine: claim.moderatorId === viewerId,
    });
  return out;
}

/** The 409 for acting on a submission another moderator holds, or null when nobody else does. */
export function heldByOther(db: Reader, actor: SessionUser, revisionId: number, now: Date): AppError | null {
  const claim = claimsOn(db, [revisionId], actor.id, now).get(revisionId);
  if (!claim || claim.mine) return null;
  const message = `@${claim.by.login} is working on this submission until ${time(new Date(claim.expiresAt))}. Wait for them, or release their claim first.`;
  return new AppError('claimed', message, 409, { claim: message });
}

/** Ends any claim on the revision: it was decided or withdrawn. */
export function endClaim(tx: Reader, revisionId: number) {
  tx.delete(reviewClaims).where(eq(reviewClaims.revisionId, revisionId)).run();
}

/**
 * Takes (or renews) the claim on a revision at the desk, in one statement: a claim another moderator holds and
 * that has not lapsed stays theirs, and the answer says so. Returns null when someone else holds it.
 */
export function tryClaim(db: Reader, actor: SessionUser, revisionId: number, now: Date): ReviewClaim | null {
  const expiresAt = new Date(now.getTime() + CLAIM_MS);
  const changes = db
    .insert(reviewClaims)
    .values({ revisionId, moderatorId: actor.id, claimedAt: now, expiresAt })
    .onConflictDoUpdate({
      target: reviewClaims.revisionId,
      set: {
        moderatorId: actor.id,
        // a renewal keeps when the work began
        claimedAt: sql`case when ${reviewClaims.moderatorId} = ${actor.id} then ${reviewClaims.claimedAt} else excluded.claimed_at end`,
        expiresAt,
      },
      setWhere: or(eq(reviewClaims.moderatorId, actor.id), sql`${reviewClaims.expiresAt} <= ${now.getTime()}`),
    })
    .run().changes;
  if (changes === 0) return null;
  return claimsOn(db, [revisionId], actor.id, now).get(revisionId) ?? null;
}

function claimable(db: Db, actor: SessionUser, revisionId: number) {
  const row = db
    .select({ status: revisions.status, authorId: revisions.authorId })
    .from(revisions)
    .where(eq(revisions.id, revisionId))
    .get();
  if (!row || row.status === 'draft') throw AppError.notFound('That submission');
  if (row.authorId === actor.id)
    throw AppError.forbidden('You cannot claim your own submission; another moderator has to review it.');
  if (row.status !== 'in_review') throw AppError.conflict('Only a submission at the review desk can be claimed.');
}

/** POST /api/review/:revisionId/claim */
export function claimRevision(db: Db, actor: SessionUser, revisionId: number, now: Date): ReviewClaim {
  claimable(db, actor, revisionId);
  const claim = tryClaim(db, actor, revisionId, now);
  if (!claim) throw heldByOther(db, actor, revisionId, now) ?? AppError.conflict('Someone claimed this a moment ago.');
  return claim;
}

/** DELETE /api/review/:revisionId/claim: any moderator may release a claim, their own or one a colleague left behind. */
export function releaseClaim(db: Db, revisionId: number, now: Date): { releasedFrom: string | null } {
  const held = db
    .select({ login: users.login })
    .from(reviewClaims)
    .innerJoin(users, eq(users.id, reviewClaims.moderatorId))
    .where(and(eq(reviewClaims.revisionId, revisionId), gt(reviewClaims.expiresAt, now)))
    .get();
  endClaim(db, revisionId);
  return { releasedFrom: held?.login ?? null };
}
