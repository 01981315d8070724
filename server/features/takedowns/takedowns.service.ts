import { and, desc, eq, inArray, isNull, or, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/sqlite-core';
import type { Db } from '../../db/client';
import { revisionPhotos, revisions, swaps, takedowns, users } from '../../db/schema/index';
import type { Clock } from '../../lib/clock';
import { AppError } from '../../lib/app-error';
import { stripHtml } from '../../lib/sanitize';
import type { SessionUser } from '../../middleware/require-role';
import type { TakedownInput, TakedownItem } from '../../../shared/schemas/takedowns';
import { personRef } from '../swaps/swap-views';

type Deps = { db: Db; clock: Clock };

const revertedBy = alias(users, 'reverted_by');

function items(db: Db, where?: SQL): TakedownItem[] {
  return db
    .select({
      takedown: takedowns,
      slug: swaps.slug,
      number: revisions.number,
      by: users,
      revertedBy: { login: revertedBy.login, name: revertedBy.name, avatarUrl: revertedBy.avatarUrl },
    })
    .from(takedowns)
    .innerJoin(swaps, eq(swaps.id, takedowns.swapId))
    .innerJoin(revisions, eq(revisions.id, takedowns.revisionId))
    .innerJoin(users, eq(users.id, takedowns.createdById))
    .leftJoin(revertedBy, eq(revertedBy.id, takedowns.revertedById))
    .where(where)
    .orderBy(desc(takedowns.createdAt), desc(takedowns.id))
    .limit(200)
    .all()
    .map((r) => ({
      id: r.takedown.id,
      swapSlug: r.slug,
      revisionId: r.takedown.revisionId,
      revisionNumber: r.number,
      target: r.takedown.target,
      photo: r.takedown.photoFileId
        ? { url: `/media/${r.takedown.photoFileId}`, thumbUrl: `/media/${r.takedown.photoFileId}?size=thumb` }
        : null,
      reason: r.takedown.reason,
      createdBy: personRef(r.by),
      createdAt: r.takedown.createdAt.toISOString(),
      revertedAt: r.takedown.revertedAt ? r.takedown.revertedAt.toISOString() : null,
      revertedBy: r.revertedBy ? personRef(r.revertedBy) : null,
    }));
}

/**
 * GET /api/review/takedowns (newest first), or those that touch one revision for its review page: its own,
 * and those of a photo it carries a copy of (taken down from another revision of the swap).
 */
export function listTakedowns(db: Db, revisionId?: number): TakedownItem[] {
  if (revisionId === undefined) return items(db);
  return items(
    db,
    or(
      eq(takedowns.revisionId, revisionId),
      and(
        eq(takedowns.target, 'photo'),
        sql`${takedowns.swapId} = (select swap_id from ${revisions} where id = ${revisionId})`,
        inArray(
          takedowns.photoSha256,
          db.select({ sha: revisionPhotos.sha256 }).from(revisionPhotos).where(eq(revisionPhotos.revisionId, revisionId)),
        ),
      ),
    ),
  );
}

/**
 * A moderator takes down a photo or the write-up of a published (approved or superseded) revision. What
 * is not published has no readers to protect: the desk sends it back instead.
 */
export function createTakedown({ db, clock }: Deps, actor: SessionUser, revisionId: number, input: TakedownInput): TakedownItem {
  const revision = db.select().from(revisions).where(eq(revisions.id, revisionId)).get();
  if (!revision || revision.status === 'draft') throw AppError.notFound('That revision');
  if (revision.status !== 'approved' && revision.status !== 'superseded')
    throw AppError.conflict('Only a published revision can be taken down; send this one back or decline it instead.');
  let sha = '';
  let photoFileId: string | null = null;
  if (input.target === 'photo') {
    const photo = db
      .select()
      .from(revisionPhotos)
      .where(and(eq(revisionPhotos.revisionId, revisionId), eq(revisionPhotos.fileId, input.photoId)))
      .get();
    if (!photo)
      throw AppError.invalid('That photo is not part of this revision.', { photoId: 'Pick one of this revision’s photos.' });
    sha = photo.sha256;
    photoFileId = photo.fileId;
  }
  const already = db
    .select({ id: takedowns.id })
    .from(takedowns)
    .where(
      and(
        eq(takedowns.swapId, revision.swapId),
        eq(takedowns.target, input.target),
        isNull(takedowns.revertedAt),
        input.target === 'photo' ? eq(takedowns.photoSha256, sha) : eq(takedowns.revisionId, revisionId),
      ),
    )
    .get();
  if (already)
    throw AppError.conflict(
      input.target === 'photo' ? 'This photo is already taken down.' : 'This write-up is already taken down.',
    );
  const id = db
    .insert(takedowns)
    .values({
      swapId: revision.swapId,
      revisionId,
      target: input.target,
      photoSha256: sha,
      photoFileId,
      reason: stripHtml(input.reason).trim(),
      createdById: actor.id,
      createdAt: clock.now(),
    })
    .returning({ id: takedowns.id })
    .get().id;
  return items(db, eq(takedowns.id, id))[0]!;
}

/** An admin puts a taken-down photo or write-up back; the record keeps both decisions. */
export function revertTakedown({ db, clock }: Deps, actor: SessionUser, id: number): TakedownItem {
  const row = db.select().from(takedowns).where(eq(takedowns.id, id)).get();
  if (!row) throw AppError.notFound('That takedown');
  const changed = db
    .update(takedowns)
    .set({ revertedAt: clock.now(), revertedById: actor.id })
    .where(and(eq(takedowns.id, id), isNull(takedowns.revertedAt)))
    .run().changes;
  if (!changed) throw AppError.conflict('This takedown was already reverted.');
  return items(db, eq(takedowns.id, id))[0]!;
}
