import { z } from 'zod';
import { multiLine } from './text';
import type { PersonRef } from './views';
import type { FittedReportState } from './enums';
import type { TrustLevel } from '../trust';

// API contract of fitted reports: "I fitted this too", with the wheel the member runs.

/** JSON sends numbers; a multipart form (when a photo comes along) sends text. */
const num = (schema: z.ZodNumber, whenEmpty?: number) =>
  z.preprocess(
    (v) =>
      typeof v === 'string' ? (v.trim() === '' ? whenEmpty : Number(v.replace(',', '.'))) : v === undefined ? whenEmpty : v,
    schema,
  );
const flag = z.preprocess(
  (v) => (v === 'true' || v === '1' ? true : v === 'false' || v === '0' || v === '' ? false : v),
  z.boolean(),
);

const reportShape = {
  /** the revision the member followed; the current one when not given */
  revisionNumber: num(z.number().int().min(1).max(100000)).optional(),
  diameterIn: num(
    z.number({ error: 'Enter the wheel diameter' }).min(10, 'Between 10 and 24 in').max(24, 'Between 10 and 24 in'),
  ),
  widthIn: num(z.number({ error: 'Enter the wheel width' }).min(4, 'Between 4 and 13 in').max(13, 'Between 4 and 13 in')),
  offsetMm: num(z.number({ error: 'Enter the offset (ET)' }).min(-80, 'Between −80 and 80 mm').max(80, 'Between −80 and 80 mm')),
  spacerMm: num(z.number().min(0, 'Between 0 and 60 mm').max(60, 'Between 0 and 60 mm')),
  /** the smallest gap the member measured between caliper and wheel (barrel or spokes), in mm */
  clearanceMm: num(
    z
      .number({ error: 'Enter the gap in millimetres, or leave it empty' })
      .min(0, 'Between 0 and 50 mm')
      .max(50, 'Between 0 and 50 mm'),
  )
    .nullable()
    .optional(),
  note: multiLine().trim().max(1000, 'A note may be at most 1,000 characters'),
};

/** POST /api/swaps/:slug/fitted-reports (JSON, or multipart with an optional `photo`) */
export const createFittedReportSchema = z.object({
  ...reportShape,
  spacerMm: num(z.number().min(0, 'Between 0 and 60 mm').max(60, 'Between 0 and 60 mm'), 0),
  note: reportShape.note.default(''),
});
export type CreateFittedReport = z.infer<typeof createFittedReportSchema>;

/** PATCH /api/swaps/:slug/fitted-reports/mine — only what is sent changes; `removePhoto` drops the photo */
export const updateFittedReportSchema = z.object({ ...reportShape, removePhoto: flag.optional() }).partial();
export type UpdateFittedReport = z.infer<typeof updateFittedReportSchema>;

export type FittedWheelView = { diameterIn: number; widthIn: number; offsetMm: number; spacerMm: number };

/** What stands behind a report, strongest first: a measured clearance with a photo, a measurement, a photo, the member's word. */
export const evidenceKinds = ['measured_with_photo', 'measured', 'photo', 'word'] as const;
export type EvidenceKind = (typeof evidenceKinds)[number];
export const evidenceLabels: Record<EvidenceKind, string> = {
  measured_with_photo: 'Measured clearance with photo',
  measured: 'Measured clearance',
  photo: 'Photo of the fitted parts',
  word: 'Member’s word only',
};
export function evidenceOf(report: { clearanceMm: number | null; hasPhoto: boolean }): EvidenceKind {
  const measured = report.clearanceMm !== null;
  if (measured && report.hasPhoto) return 'measured_with_photo';
  if (measured) return 'measured';
  return report.hasPhoto ? 'photo' : 'word';
}

export type FittedReportView = {
  id: number;
  member: PersonRef;
  revisionNumber: number;
  wheel: FittedWheelView;
  note: string;
  photo: { url: string; thumbUrl: string } | null;
  /** the member's measured caliper-to-wheel gap, mm */
  clearanceMm: number | null;
  evidence: EvidenceKind;
  createdAt: string;
  updatedAt: string;
  /** only moderators and the member see their hidden report */
  hidden: boolean;
  /** `held`: waiting for a moderator (a new member's report); only moderators and the member see it */
  state: FittedReportState;
};

/** GET /api/swaps/:slug/fitted-reports */
export type FittedReportsView = {
  /** visible reports; the same number as the swap's fitted count */
  count: number;
  reports: FittedReportView[];
  /** each wheel size members run, most common first */
  wheels: { wheel: FittedWheelView; members: number }[];
  verification: Verification;
  /** the viewer's own report (even when hidden) */
  mine: FittedReportView | null;
  /** why the viewer may not report, or null when they may */
  cannotReport: 'signed_out' | 'author' | 'not_allowed' | null;
  canModerate: boolean;
};

/**
 * How far a record is verified, by the kind of evidence behind it. Only public reports (live, not hidden)
 * count. `strongest` is the best evidence any report gives, or null when nobody reported fitting it.
 */
export type Verification = {
  reviewed: boolean;
  fittedBy: number;
  withPhotos: number;
  byEvidence: Record<EvidenceKind, number>;
  strongest: EvidenceKind | null;
};

/** GET /api/fitted-reports?show=held|hidden (moderators) — reports waiting for a moderator, or hidden ones */
export const moderationListQuerySchema = z.object({ show: z.enum(['held', 'hidden']).default('held') });
export type ModerationReportItem = FittedReportView & {
  swap: { slug: string; title: string };
  memberTrust: TrustLevel;
};
export type ModerationReportList = {
  show: 'held' | 'hidden';
  items: ModerationReportItem[];
  counts: { held: number; hidden: number };
};
