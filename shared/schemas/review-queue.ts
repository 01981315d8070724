import { z } from 'zod';
import { categorySchema } from './enums';
import { singleLine } from './text';
import { slugSchema } from './params';
import type { PersonRef } from './views';
import { trustLevels } from '../trust';

// The review desk's queue: its filters as a query string (the router parses them, the page reads its own address
// with the same schema), the claims moderators hold, and what a queue page carries.

/** How long a claim holds before another moderator may take the submission: long enough to read a brake record through. */
export const CLAIM_MINUTES = 30;
export const QUEUE_PAGE_SIZE = 50;

/** `clear`: no check needs a fix or a closer look · `attention`: something to look at, nothing to fix · `fail`: a fix needed */
export const checkOutcomes = ['fail', 'attention', 'clear'] as const;
export type CheckOutcome = (typeof checkOutcomes)[number];
export const checkOutcomeLabels: Record<CheckOutcome, string> = {
  fail: 'A fix needed',
  attention: 'Something to look closer at',
  clear: 'All in order',
};

export const queueStatuses = ['in_review', 'sent_back'] as const;

/** an empty value in the address means "any", so a cleared select or search box never fails the parse */
const optional = <T extends z.ZodType>(schema: T) => z.preprocess((v) => (v === '' ? undefined : v), schema.optional());

/** GET /api/review/queue and POST /api/review/next: the desk's filters, as they stand in the page's address */
export const reviewQueueQuerySchema = z.object({
  status: optional(z.enum(queueStatuses)).transform((s) => s ?? 'in_review'),
  /** words to find in the title, summary, parts and part numbers, author and chassis; every word must match */
  q: optional(singleLine().trim().max(100)),
  chassis: optional(slugSchema),
  category: optional(categorySchema),
  olderThanDays: optional(z.coerce.number().int().min(0).max(3650)),
  /** the author's trust level (shared/trust.ts) */
  authorTrust: optional(z.enum(trustLevels)),
  checks: optional(z.enum(checkOutcomes)),
  page: optional(z.coerce.number().int().min(1).max(10_000)).transform((p) => p ?? 1),
});
export type ReviewQueueQuery = z.infer<typeof reviewQueueQuerySchema>;
/** the filters without the page: what "open the next" searches */
export type ReviewQueueFilters = Omit<ReviewQueueQuery, 'page'>;

/** The query string for a set of filters, leaving out what is at its default; the page and the API client share it. */
export function reviewQueueSearch(query: Partial<ReviewQueueQuery>): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value === undefined || value === '' || value === null) continue;
    if ((key === 'status' && value === 'in_review') || (key === 'page' && value === 1)) continue;
    params.set(key, String(value));
  }
  return params.toString();
}

/** A moderator's hold on a submission; `mine` when the reader holds it. */
export type ReviewClaim = { by: PersonRef; claimedAt: string; expiresAt: string; mine: boolean };

/** POST /api/review/:revisionId/claim and DELETE (release) answer with the claim as it now stands */
export type ClaimResponse = { claim: ReviewClaim | null };
