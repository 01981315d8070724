import { z } from 'zod';
import { multiLine } from './text';
import type { PersonRef } from './views';

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

export type FittedReportView = {
  id: number;
  member: PersonRef;
  revisionNumber: number;
  wheel: FittedWheelView;
  note: string;
  photo: { url: string; thumbUrl: string } | null;
  createdAt: string;
  updatedAt: string;
  /** only moderators and the member see their hidden report */
  hidden: boolean;
};

/** GET /api/swaps/:slug/fitted-reports */
export type FittedReportsView = {
  /** visible reports; the same number as the swap's fitted count */
  count: number;
  reports: FittedReportView[];
  /** each wheel size members run, most common first */
  wheels: { wheel: FittedWheelView; members: number }[];
  verification: { reviewed: boolean; fittedBy: number; withPhotos: number };
  /** the viewer's own report (even when hidden) */
  mine: FittedReportView | null;
  /** why the viewer may not report, or null when they may */
  cannotReport: 'signed_out' | 'author' | 'not_allowed' | null;
  canModerate: boolean;
};
