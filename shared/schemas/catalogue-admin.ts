import type { ChassisView } from './views';
import { z } from 'zod';
import { partKindSchema, type PartKind } from './enums';
import { multiLine, singleLine } from './text';
import { newChassisSchema } from './submissions';

/** what an admin changed in the catalogue */
export const catalogueSubjects = ['chassis', 'part'] as const;
export type CatalogueSubject = (typeof catalogueSubjects)[number];
export const catalogueActions = ['edit', 'merge', 'approve'] as const;
export type CatalogueAction = (typeof catalogueActions)[number];

export const catalogueIdParamsSchema = z.object({
  id: z.coerce.number().int().positive('An id is a positive whole number').max(Number.MAX_SAFE_INTEGER),
});

export const adminCatalogueQuerySchema = z.object({
  q: singleLine().trim().max(80, 'A search is at most 80 characters').default(''),
});

const nonEmpty = (v: object) => Object.values(v).some((x) => x !== undefined);

const given = newChassisSchema.shape;

/** the chassis figures an admin may correct (no defaults: a field not sent is left alone); the stock wheel, brakes and vehicle figures have their own editors */
export const chassisPatchSchema = z
  .object({
    make: given.make,
    model: given.model,
    code: given.code,
    yearFrom: given.yearFrom,
    yearTo: given.yearTo.unwrap(),
    body: given.body.unwrap(),
    lugCount: given.lugCount,
    pcdMm: given.pcdMm,
    centreBoreMm: given.centreBoreMm,
    wheelBoltThread: given.wheelBoltThread,
    notes: multiLine().trim().max(2000, 'Notes are at most 2,000 characters'),
  })
  .partial()
  .strict()
  .refine(nonEmpty, { message: 'Send at least one field to change' });
export type ChassisPatch = z.infer<typeof chassisPatchSchema>;

const listOf = (max: number, each: number, what: string) =>
  z
    .array(singleLine().trim().min(1, `An empty ${what} is not allowed`).max(each, `A ${what} is at most ${each} characters`))
    .max(max, `At most ${max} ${what}s`);

export const partPatchSchema = z
  .object({
    kind: partKindSchema,
    name: singleLine().trim().min(2, 'Name the part').max(120, 'A name is at most 120 characters'),
    maker: singleLine().trim().max(80, 'A maker is at most 80 characters'),
    partNumbers: listOf(24, 40, 'part number').min(1, 'Keep at least one part number'),
    cameOn: listOf(20, 120, 'vehicle'),
    notes: multiLine().trim().max(2000, 'Notes are at most 2,000 characters'),
  })
  .partial()
  .strict()
  .refine(nonEmpty, { message: 'Send at least one field to change' });
export type PartPatch = z.infer<typeof partPatchSchema>;

export const mergeBodySchema = z
  .object({ intoId: z.number().int().positive('Choose the record to keep').max(Number.MAX_SAFE_INTEGER) })
  .strict();

/** a chassis as the catalogue desk lists it: the public fields it edits, whether it is public yet, and what uses it */
export type AdminChassis = Pick<
  ChassisView,
  | 'id'
  | 'slug'
  | 'make'
  | 'model'
  | 'code'
  | 'yearFrom'
  | 'yearTo'
  | 'body'
  | 'lugCount'
  | 'pcdMm'
  | 'centreBoreMm'
  | 'wheelBoltThread'
  | 'notes'
> & {
  proposed: boolean;
  swapCount: number;
  carCount: number;
};

export type AdminPart = {
  id: number;
  slug: string;
  kind: PartKind;
  name: string;
  maker: string;
  partNumbers: string[];
  cameOn: string[];
  notes: string;
  /** revisions that list the part */
  revisionCount: number;
};

export type CatalogueChange = {
  id: number;
  subject: CatalogueSubject;
  subjectId: number;
  subjectLabel: string;
  action: CatalogueAction;
  field: string | null;
  from: string | null;
  to: string | null;
  at: string;
  actor: { login: string; name: string } | null;
};

export type AdminChassisListResponse = { chassis: AdminChassis[] };
export type AdminPartListResponse = { parts: AdminPart[] };
export type AdminChassisResponse = { chassis: AdminChassis };
export type AdminPartResponse = { part: AdminPart };
export type CatalogueChangesResponse = { changes: CatalogueChange[] };
/** what a merge moved onto the record kept */
export type MergeResponse<T> = { kept: T; moved: Record<string, number> };
