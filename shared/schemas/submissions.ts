import { z } from 'zod';
import { markdownText, multiLine, singleLine } from './text';
import { axleSchema, categorySchema, type Axle, type Category, type MailStatus, type RevisionStatus } from './enums';
import { swapDataSchema, type SwapData } from './swap-data';
import type { PersonRef, PhotoView, ChassisView } from './views';
import { chassisWheelFasteningSchema, threadDesignation } from './wheel-fastening';
import type { TakedownItem } from './takedowns';
import type { CheckOutcome, ReviewClaim } from './review-queue';
import type { TrustLevel } from '../trust';
import { flagKindSchema, flagOutcomeSchema, type FlagKind, type FlagOutcome } from './flags';

// API contract of the community loop: submissions, photos, review desk, flags, outbox.

/** a chassis proposed with a submission, when it is not in the catalogue yet */
export const newChassisSchema = z.object({
  make: singleLine().trim().min(1, 'Give the make').max(60),
  model: singleLine().trim().min(1, 'Give the model').max(60),
  code: singleLine().trim().min(1, 'Give the chassis code').max(20),
  yearFrom: z.number().int('A whole year').min(1900, 'A year from 1900 on').max(2100, 'A year up to 2100'),
  yearTo: z.number().int('A whole year').min(1900, 'A year from 1900 on').max(2100, 'A year up to 2100').nullable().default(null),
  body: singleLine().trim().max(60).default(''),
  lugCount: z
    .number()
    .int('A whole number of bolts')
    .min(3, 'A hub has 3 to 10 wheel bolts')
    .max(10, 'A hub has 3 to 10 wheel bolts'),
  pcdMm: z.number().positive('The bolt circle is more than 0 mm').max(300, 'The bolt circle is at most 300 mm'),
  centreBoreMm: z.number().positive('The centre bore is more than 0 mm').max(200, 'The centre bore is at most 200 mm'),
  /** metric with its pitch (M12x1.5) or unified with threads per inch (1/2-20 UNF) */
  wheelBoltThread: threadDesignation(),
  /** how the wheels are held, as far as the proposer knows it */
  wheelFastening: chassisWheelFasteningSchema.optional(),
  /** the wheel and tyre the chassis left the factory on; when absent, the submission's smallest wheel stands in */
  stockWheel: z
    .object({
      diameterIn: z.number().min(10).max(24),
      widthIn: z.number().min(4).max(13),
      offsetMm: z.number().min(-80).max(80),
      tyre: singleLine().trim().max(40).default(''),
    })
    .optional(),
  notes: multiLine().trim().max(1000).default(''),
});
export type NewChassis = z.infer<typeof newChassisSchema>;

const markdownBody = markdownText().max(40_000, 'The write-up may be at most 40,000 characters').default('');

/** the form's lists whose rows a draft may keep half-filled */
export const incompleteRowLists = [
  'parts',
  'calipers',
  'rotors',
  'shims',
  'spacers',
  'machining',
  'fasteners',
  'testedWheels',
  'costs',
] as const;
export type IncompleteRowList = (typeof incompleteRowLists)[number];

/**
 * A row of a draft that does not read yet (a fastener without its torque): kept as the author typed
 * it, beside the valid record, so a save never waits for it and it is never dropped. Only its
 * author sees it; a draft holding one cannot be sent for review.
 */
export const incompleteRowSchema = z.object({
  list: z.enum(incompleteRowLists),
  /** where the row stands in its list on the form */
  index: z.number().int().min(0).max(200),
  row: z
    .record(z.string().max(60), z.unknown())
    .refine((r) => JSON.stringify(r).length <= 8000, 'This row is too long to keep (at most 8,000 characters)'),
});
export type IncompleteRow = z.infer<typeof incompleteRowSchema>;
const incompleteRows = z.array(incompleteRowSchema).max(60).default([]);
/** a correction's "what changed and why"; required when a correction goes to review */
const changeNote = multiLine().trim().max(2000, 'At most 2,000 characters').optional();
export const CHANGE_NOTE_MIN = 10;

/** POST /api/submissions — a new swap (chassis + axle + category) or, with `swapSlug`, a new revision of an approved swap */
export const createSubmissionSchema = z
  .object({
    swapSlug: z.string().max(120).optional(),
    /** with `swapSlug`: the approved revision the correction was copied from (the swap's current one when absent) */
    basedOnRevisionId: z.number().int().positive().optional(),
    chassisId: z.number().int().positive().optional(),
    newChassis: newChassisSchema.optional(),
    axle: axleSchema.optional(),
    category: categorySchema.optional(),
    data: swapDataSchema,
    body: markdownBody,
    incompleteRows,
    changeNote,
  })
  .superRefine((v, ctx) => {
    if (v.swapSlug) return;
    if (!v.chassisId && !v.newChassis)
      ctx.addIssue({ code: 'custom', path: ['chassisId'], message: 'Pick a chassis or propose a new one' });
    if (!v.axle) ctx.addIssue({ code: 'custom', path: ['axle'], message: 'Pick the axle' });
    if (!v.category) ctx.addIssue({ code: 'custom', path: ['category'], message: 'Pick a category' });
  });
export type CreateSubmission = z.infer<typeof createSubmissionSchema>;

/** PATCH /api/submissions/:id — autosave of a draft or a sent-back revision (whole data object each time) */
export const updateSubmissionSchema = z.object({
  chassisId: z.number().int().positive().optional(),
  newChassis: newChassisSchema.optional(),
  axle: axleSchema.optional(),
  category: categorySchema.optional(),
  data: swapDataSchema,
  body: markdownBody,
  incompleteRows,
  changeNote,
});
export type UpdateSubmission = z.infer<typeof updateSubmissionSchema>;

/** PATCH /api/submissions/:id/photos — captions and order */
export const photoOrderSchema = z.object({
  photos: z.array(z.object({ id: z.string().min(1).max(60), caption: singleLine().trim().max(300) })).max(12),
});

export type CheckResult = { id: string; label: string; status: 'pass' | 'fail' | 'attention'; detail: string; link?: string };

/** One revision as its author or a reviewer sees it (any status). */
export type SubmissionView = {
  id: number;
  swapId: number;
  swapSlug: string;
  number: number;
  status: RevisionStatus;
  /** true when this revision would replace an approved one */
  isCorrection: boolean;
  axle: Axle;
  category: Category;
  chassis: ChassisView;
  data: SwapData;
  body: string;
  /** a moderator took the write-up of this (published) revision down; its author and the desk still see it */
  bodyTakenDown: boolean;
  /** rows the author has not finished; only the author sees them (empty for anyone else) */
  incompleteRows: IncompleteRow[];
  photos: PhotoView[];
  author: PersonRef;
  reviewNote: string | null;
  submittedAt: string | null;
  reviewedAt: string | null;
  updatedAt: string;
  /** the author may edit it now (draft or sent back) */
  editable: boolean;
  /** an untouched draft the author was told about: when it will be removed unless saved or kept */
  expiresAt: string | null;
  /** for a correction: the approved revision it started from (null when not recorded) */
  basedOn: RevisionRef | null;
  /** a correction's "what changed and why", in its author's words */
  changeNote: string | null;
  /** open or resolved flags this correction answers */
  answersFlags: { id: number; kind: FlagKind; reason: string; status: 'open' | 'resolved' }[];
  /**
   * set while the swap's current revision is a newer one than this correction started from: it cannot be
   * approved (it would undo that revision) until its author brings it up to date
   */
  behind: { current: RevisionRef } | null;
};

export type RevisionRef = { revisionId: number; number: number };

/** GET /api/me/storage: bytes of the member's photos that count against their quota, and the quota */
export type StorageUse = { usedBytes: number; quotaBytes: number };

/** GET /api/me/submissions */
export type MySubmissionItem = {
  id: number;
  swapSlug: string;
  number: number;
  title: string;
  status: RevisionStatus;
  reviewNote: string | null;
  updatedAt: string;
  submittedAt: string | null;
};

/** GET /api/review/queue?status=&q=&chassis=&category=&olderThanDays=&authorTrust=&checks=&page= (reviewQueueQuerySchema) */
export type ReviewQueueItem = {
  revisionId: number;
  swapSlug: string;
  title: string;
  author: PersonRef;
  /** the author's trust level, and the approved revisions it is partly counted from */
  authorTrust: TrustLevel;
  authorApproved: number;
  submittedAt: string | null;
  status: RevisionStatus;
  number: number;
  isCorrection: boolean;
  chassis: { slug: string; label: string };
  axle: Axle;
  category: Category;
  failedChecks: number;
  attentionChecks: number;
  checkOutcome: CheckOutcome;
  /** the moderator working on it, while their claim holds */
  claim: ReviewClaim | null;
};
export type ReviewQueue = {
  items: ReviewQueueItem[];
  /** how many match the filters, over all pages */
  total: number;
  page: number;
  pageSize: number;
  /** `flags` counts every open flag; the queue carries only their first page */
  counts: { in_review: number; sent_back: number; flags: number };
  flags: FlagItem[];
};
/** POST /api/review/next: the submission now claimed for the reader, or null when none is left in the filter */
export type NextResponse = { revisionId: number | null; claim: ReviewClaim | null };

export type FlagItem = {
  id: number;
  swapSlug: string;
  title: string;
  kind: FlagKind;
  reason: string;
  reporter: PersonRef;
  status: 'open' | 'resolved';
  createdAt: string;
  outcome: FlagOutcome | null;
  resolutionNote: string | null;
  /** the correction that answers it, when one is linked */
  correction: FlagCorrection | null;
  /** corrections of the swap (at the desk or published) a moderator may link it to, newest first */
  corrections: FlagCorrection[];
};
export type FlagCorrection = { revisionId: number; number: number; status: RevisionStatus };

/** GET /api/review/:revisionId */
export type ReviewDetail = {
  revision: SubmissionView;
  checks: CheckResult[];
  /** for a new revision of an approved swap: the current approved one to diff against */
  current: { number: number; data: SwapData; body: string } | null;
  /** when the correction is behind: the revision it started from, to show what the newer approval changed */
  basedOn: { number: number; data: SwapData; body: string } | null;
  history: { action: string; actor: PersonRef; note: string; at: string }[];
  canDecide: boolean;
  /** the moderator working on it, while their claim holds (only for a submission at the desk) */
  claim: ReviewClaim | null;
  /** takedowns of this revision's photos or write-up, newest first (published revisions only) */
  takedowns: TakedownItem[];
  /** the viewer may revert a takedown (admins) */
  canRevertTakedowns: boolean;
};

export const decisionNoteSchema = z.object({ note: multiLine().trim().max(4000).default('') });
export const requiredReasonSchema = z.object({
  note: multiLine().trim().min(3, 'Give the reason the member will read').max(4000),
});
export const bulkDeclineSchema = z.object({
  revisionIds: z.array(z.number().int().positive()).min(1).max(100),
  note: multiLine().trim().min(3, 'Give the reason').max(4000),
});
export const reasonTemplateSchema = z.object({
  label: singleLine().trim().min(2).max(60),
  text: multiLine().trim().min(3).max(2000),
});
export type ReasonTemplate = { id: number; label: string; text: string };

/** POST /api/swaps/:slug/flags */
export const flagSchema = z.object({
  kind: flagKindSchema,
  reason: multiLine().trim().min(5, 'Say what is wrong (at least 5 characters)').max(2000),
});
/**
 * POST /api/review/flags/:id/resolve — one outcome; `fixed_by_correction` names the published correction
 * (or uses the one linked to the flag). The note is for the reporter and optional.
 */
export const resolveFlagSchema = z.object({
  outcome: flagOutcomeSchema,
  note: multiLine().trim().max(2000).default(''),
  correctionRevisionId: z.number().int().positive().nullable().optional(),
});
/** POST /api/review/flags/bulk-resolve — all of them or none, with one outcome and note */
export const bulkResolveFlagsSchema = resolveFlagSchema.omit({ correctionRevisionId: true }).extend({
  ids: z.array(z.number().int().positive()).min(1, 'Pick at least one flag').max(100),
});
/** POST /api/review/flags/:id/link — the correction that answers the flag, or null to unlink */
export const linkFlagSchema = z.object({ revisionId: z.number().int().positive().nullable() });

/** POST /api/submissions/:id/submit — a correction says what changed and why, and may name the open flags it answers */
export const submitSubmissionSchema = z.object({
  changeNote: multiLine().trim().max(2000, 'At most 2,000 characters').optional(),
  answersFlagIds: z.array(z.number().int().positive()).max(20).default([]),
});
export type SubmitSubmission = z.infer<typeof submitSubmissionSchema>;
/** GET /api/review/flags?page= */
export const flagPageQuerySchema = z.object({ page: z.coerce.number().int().min(1).max(100_000).default(1) });
export const FLAG_PAGE_SIZE = 20;
export type FlagPage = { items: FlagItem[]; total: number; page: number; pageSize: number };
/** POST /api/review/flags/bulk-resolve */
export type BulkResolveResponse = { resolved: number[] };

/** One message of `GET /api/outbox`; `to` and `delivery` are filled for admins only. */
export type OutboxMessage = {
  id: number;
  /** the member's login (null when the account is gone) */
  recipient: string | null;
  /** the address it was sent to: admins only */
  to: string | null;
  subject: string;
  text: string;
  html: string;
  createdAt: string;
  status: MailStatus;
  sentAt: string | null;
  /** admins only: the delivery's details (the mail server's last answer may quote the address) */
  delivery: { messageId: string | null; attempts: number; lastError: string | null; nextAttemptAt: string | null } | null;
};
/** `GET /api/outbox`; `delivering` is false when no mail server is configured and messages are kept here. */
export type OutboxResponse = { items: OutboxMessage[]; delivering: boolean };

/** POST /api/review/:revisionId/{approve|send-back|decline} */
export type DecisionResponse = { revision: SubmissionView };
/** POST /api/review/bulk-decline */
export type BulkDeclineResponse = { declined: number[] };
/** POST (201), PATCH and DELETE /api/submissions/:id/photos…: the revision's photos in order */
export type PhotoListResponse = { photos: PhotoView[] };

/** POST /api/submissions/:id/rebase — settle each conflict; `currentRevisionId` is the revision the author merged with */
export const rebaseSubmissionSchema = z.object({
  currentRevisionId: z.number().int().positive(),
  choices: z
    .record(z.string().min(1).max(300), z.enum(['theirs', 'mine']))
    .refine((c) => Object.keys(c).length <= 2000, 'Too many choices')
    .default({}),
});
export type RebaseSubmission = z.infer<typeof rebaseSubmissionSchema>;

type MergeFieldView = { path: string; base: string | null; theirs: string | null; mine: string | null };
/** GET /api/submissions/:id/rebase — the three-way merge of a correction with the revision approved since it started */
export type RebasePreview = {
  revision: RevisionRef;
  base: RevisionRef & { data: SwapData; body: string };
  current: RevisionRef & { data: SwapData; body: string };
  /** the correction as it is now */
  mine: { data: SwapData; body: string };
  /** settled without asking: from the newer approval, kept from the correction, or (write-up) both */
  taken: (MergeFieldView & { from: 'theirs' | 'mine' | 'both' })[];
  /** changed differently on both sides: the author picks one per field */
  conflicts: MergeFieldView[];
};
