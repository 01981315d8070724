import { z } from 'zod';
import { photoIdSchema } from './params';
import { multiLine } from './text';
import type { PersonRef } from './views';

// API contract of takedowns: a moderator takes a published revision's photo or write-up down; an admin
// may revert it. Both are recorded.

const reason = multiLine().trim().min(3, 'Say why it comes down (other moderators and admins read this)').max(2000);

/** POST /api/review/revisions/:revisionId/takedowns */
export const takedownSchema = z.discriminatedUnion('target', [
  z.object({ target: z.literal('photo'), photoId: photoIdSchema, reason }),
  z.object({ target: z.literal('body'), reason }),
]);
export type TakedownInput = z.infer<typeof takedownSchema>;

export type TakedownItem = {
  id: number;
  swapSlug: string;
  revisionId: number;
  revisionNumber: number;
  target: 'photo' | 'body';
  /** the photo the moderator pointed at (every copy of it in the swap is down with it) */
  photo: { url: string; thumbUrl: string } | null;
  reason: string;
  createdBy: PersonRef;
  createdAt: string;
  revertedAt: string | null;
  revertedBy: PersonRef | null;
};
