import fs from 'node:fs/promises';
import path from 'node:path';
import matter from 'gray-matter';
import { z } from 'zod';
import { eq, sql, count, isNotNull } from 'drizzle-orm';
import type { Db } from './client';
import * as t from './schema/index';
import {
  swapDataSchema,
  swapPartSchema,
  adapterSchema,
  caliperSchema,
  rotorSchema,
  spacerSchema,
  shimSchema,
  centringSchema,
  machiningStepSchema,
  fastenerSchema,
  torqueSpecSchema,
  wheelRequirementSchema,
  testedWheelSchema,
  brakeFiguresSchema,
  costLineSchema,
  discCornerSchema,
  drumCornerSchema,
  parkingBrakeSchema,
  type SwapData,
} from '../../shared/schemas/swap-data';
import {
  axleSchema,
  categorySchema,
  partKindSchema,
  revisionStatusSchema,
  type RevisionStatus,
} from '../../shared/schemas/enums';
import { can, roleSchema } from '../../shared/roles';
import { vehicleDataSchema } from '../../shared/schemas/vehicle';
import { chassisWheelFasteningSchema, threadDesignation } from '../../shared/schemas/wheel-fastening';
import { newFileId, type Storage } from '../storage/disk-storage';
import type { Clock } from '../lib/clock';
import { submissionReceived, submissionSentBack, type BuiltMessage } from '../mail/messages';
import { processPhoto } from '../features/photos/photo-processing';
import { thumbId } from '../features/photos/photo-files';
import { openingPeriodSchema, quotedPriceSchema, shopContactSchema } from '../../shared/schemas/shops';
import { flagKindSchema } from '../../shared/schemas/flags';

// Loads the demo scenario in content/ (chassis, parts, shops, members, swaps with their
// revisions, photos and fitted reports). Everything is read and checked before the one
// database transaction, so a bad file leaves the database as it was.

const defaultContentDir = path.resolve(import.meta.dirname, '../../content');

export type SeedCounts = Record<keyof typeof countedTables, number>;
export type SeedResult = { seeded: boolean; counts: SeedCounts };

export class SeedContentError extends Error {}

// ---------- content file schemas ----------

const slug = z.string().regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, 'lowercase words joined by hyphens');
const login = z.string().regex(/^[a-z0-9_]{2,39}$/, 'a demo login');
const date = z.coerce.date();
const text = (max: number) => z.string().trim().max(max);

const shopsFileSchema = z.array(
  z.strictObject({
    slug,
    name: text(120).min(2),
    town: text(120),
    website: z.url({ protocol: /^https$/ }).refine((u) => new URL(u).hostname.endsWith('.example'), 'demo sites end in .example'),
    about: text(2000),
    contact: shopContactSchema.default({ phone: '', email: '', address: '', hoursNote: '' }),
    openingHours: z.array(openingPeriodSchema).default([]),
    links: z
      .array(
        z.strictObject({
          code: z.string().regex(/^[a-z0-9-]{4,32}$/),
          swap: slug,
          revision: z.number().int().positive(),
          createdBy: login,
          /** shown to everyone who opens the link */
          publicNote: text(2000).default(''),
          /** the shop's own record */
          privateNote: text(2000).default(''),
          customerRef: text(120).default(''),
          quotedPrice: quotedPriceSchema.nullable().default(null),
          createdAt: date,
        }),
      )
      .default([]),
  }),
);

const carSchema = z.strictObject({
  chassis: slug,
  nickname: text(60).min(1),
  wheelDiameterIn: z.number().min(10).max(24),
  wheelWidthIn: z.number().min(4).max(13),
  wheelOffsetMm: z.number().min(-80).max(80),
  tyre: text(40).default(''),
  spacerMm: z.number().min(0).max(60).default(0),
  vehicle: vehicleDataSchema.optional(),
  /** approved swaps already fitted to the car, by slug */
  fitted: z.array(slug).default([]),
  otherChanges: text(1000).default(''),
});

/** a member's build plan; `car` names one of their cars by nickname */
const planSchema = z.strictObject({
  id: z.string().regex(/^[A-Za-z0-9_-]{10,32}$/),
  title: text(80),
  car: text(60).optional(),
  swaps: z.array(slug).min(1),
  at: date,
});

const usersFileSchema = z.array(
  z.strictObject({
    login,
    name: text(120).min(1),
    email: z.email().refine((e) => e.endsWith('@example.com'), 'demo addresses are @example.com'),
    role: roleSchema,
    shop: slug.optional(),
    joinedAt: date,
    cars: z.array(carSchema).default([]),
    plans: z.array(planSchema).default([]),
  }),
);

const brakeCornerContent = z.discriminatedUnion('kind', [
  discCornerSchema.extend({ description: text(400) }).strict(),
  drumCornerSchema.extend({ description: text(400) }).strict(),
]);

const chassisFileSchema = z.array(
  z.strictObject({
    slug,
    make: text(60).min(1),
    model: text(60).min(1),
    code: text(20).min(1),
    yearFrom: z.number().int().min(1900).max(2100),
    yearTo: z.number().int().min(1900).max(2100).nullable(),
    body: text(80),
    lugCount: z.number().int().min(3).max(10),
    pcdMm: z.number().positive().max(300),
    centreBoreMm: z.number().positive().max(200),
    wheelBoltThread: threadDesignation(),
    stockWheel: z.strictObject({
      diameterIn: z.number().min(10).max(24),
      widthIn: z.number().min(4).max(13),
      offsetMm: z.number().min(-80).max(80),
      tyre: text(40).min(1),
    }),
    stockBrakes: z.strictObject({ front: brakeCornerContent, rear: brakeCornerContent }),
    vehicle: vehicleDataSchema.optional(),
    wheelFastening: chassisWheelFasteningSchema.optional(),
    notes: text(2000).default(''),
  }),
);

const positive = z.number().positive();
const fastenerSpecs = z.looseObject({ thread: z.string().optional(), lengthMm: positive.optional(), seat: z.string().optional() });
const specSchemas: Record<z.infer<typeof partKindSchema>, z.ZodType> = {
  caliper: z.looseObject({
    pistonsPerSideMm: z.array(positive.max(80)).min(1).max(6),
    opposed: z.boolean(),
    mounting: z.enum(['radial', 'axial']),
    mountSpacingMm: positive,
    mountThread: z.string(),
    padHeightMm: positive,
    designRotorDiameterMm: positive,
    designRotorThicknessMm: z.tuple([positive, positive]),
  }),
  rotor: z.looseObject({
    diameterMm: positive,
    thicknessMm: positive,
    minThicknessMm: positive,
    vented: z.boolean(),
    directional: z.boolean(),
    hatHeightMm: positive,
    frictionRingInnerDiameterMm: positive,
    centreBoreMm: positive,
    drumInHatDiameterMm: positive.optional(),
  }),
  pad: z.looseObject({ padHeightMm: positive }),
  adapter: z.looseObject({}),
  shim: z.looseObject({ thicknessMm: positive.max(20), outerDiameterMm: positive }),
  spacer: z.looseObject({
    thicknessMm: positive.max(60),
    hubCentric: z.boolean(),
    mounting: z.enum(['slip_on', 'bolt_on']),
    material: z.enum(['aluminium', 'steel']),
    centreBoreMm: positive,
  }),
  line: z.looseObject({}),
  hose: z.looseObject({}),
  wheel: z.looseObject({
    diameterIn: positive.max(30).optional(),
    widthIn: positive.max(15).optional(),
    offsetMm: z.number().min(-100).max(100).optional(),
  }),
  wheel_fastener: fastenerSpecs,
  anti_roll_bar: z.looseObject({ diameterMm: positive.max(60).optional() }),
  bush: z.looseObject({ boreMm: positive.optional() }),
  thread_insert: fastenerSpecs,
  hardware: fastenerSpecs,
  other: z.looseObject({}),
};

const partsFileSchema = z.array(
  z
    .strictObject({
      slug,
      kind: partKindSchema,
      name: text(120).min(2),
      maker: text(80).default(''),
      partNumbers: z.array(text(40).min(1)).min(1).max(12),
      specs: z.record(z.string(), z.unknown()),
      cameOn: z.array(text(120).min(1)).max(20).default([]),
      notes: text(2000).default(''),
    })
    .superRefine((p, ctx) => {
      const r = specSchemas[p.kind].safeParse(p.specs);
      if (!r.success) {
        for (const issue of r.error.issues)
          ctx.addIssue({ code: 'custom', path: ['specs', ...issue.path], message: issue.message });
      }
    }),
);

const reasonsFileSchema = z.array(z.strictObject({ label: text(80).min(2), text: text(1000).min(5) }));

const photoRef = z.strictObject({
  file: z.string().regex(/^[a-z0-9-]+\.(png|jpe?g)$/, 'a file name in content/images'),
  caption: text(200).default(''),
});

const revisionFields = {
  status: revisionStatusSchema,
  submittedAt: date.optional(),
  reviewer: login.optional(),
  reviewedAt: date.optional(),
  reviewNote: z.string().trim().min(1).optional(),
  photos: z.array(photoRef).max(12).default([]),
};

const frontMatterSchema = z.strictObject({
  slug,
  chassis: slug,
  axle: axleSchema,
  category: categorySchema,
  author: login,
  /** author of the latest revision, when it is not the swap's author */
  revisionAuthor: login.optional(),
  ...revisionFields,
  /** earlier revisions, oldest first; their data replaces top-level keys of the latest data */
  revisions: z
    .array(
      z.strictObject({
        ...revisionFields,
        author: login.optional(),
        data: z.record(z.string(), z.unknown()).default({}),
        body: z.string().optional(),
      }),
    )
    .default([]),
  fittedBy: z
    .array(
      z.strictObject({
        login,
        wheel: z.strictObject({
          diameterIn: z.number().min(10).max(24),
          widthIn: z.number().min(4).max(13),
          offsetMm: z.number().min(-80).max(80),
          spacerMm: z.number().min(0).max(60).default(0),
        }),
        /** the smallest caliper-to-wheel gap the member measured, mm */
        clearanceMm: z.number().min(0).max(50).optional(),
        note: text(1000).default(''),
        at: date,
      }),
    )
    .default([]),
  flags: z
    .array(z.strictObject({ reporter: login, kind: flagKindSchema.default('other'), reason: text(1000).min(5), at: date }))
    .default([]),
  data: z.record(z.string(), z.unknown()),
});
type FrontMatter = z.infer<typeof frontMatterSchema>;

// ---------- loading and checking ----------

type Part = z.infer<typeof partsFileSchema>[number];
/** a content image after the same processing as an upload: WebP, metadata stripped, with a thumbnail */
type PhotoFile = { full: Buffer; thumb: Buffer; width: number; height: number; bytes: number; sha256: string };

type PlannedRevision = {
  number: number;
  author: string;
  status: RevisionStatus;
  data: SwapData;
  /** catalogue slug per data.parts line (null for a part not in the catalogue) */
  partSlugs: (string | null)[];
  body: string;
  submittedAt: Date | null;
  reviewer: string | null;
  reviewedAt: Date | null;
  reviewNote: string | null;
  photos: { file: string; caption: string }[];
};

type PlannedSwap = {
  file: string;
  meta: FrontMatter;
  revisions: PlannedRevision[];
};

type Content = {
  shops: z.infer<typeof shopsFileSchema>;
  users: z.infer<typeof usersFileSchema>;
  chassis: z.infer<typeof chassisFileSchema>;
  parts: Part[];
  reasons: z.infer<typeof reasonsFileSchema>;
  swaps: PlannedSwap[];
  images: Map<string, PhotoFile>;
};

function fail(file: string, message: string): never {
  throw new SeedContentError(`content/${file}: ${message}`);
}

function parseWith<T extends z.ZodType>(schema: T, value: unknown, file: string): z.infer<T> {
  const r = schema.safeParse(value);
  if (!r.success) fail(file, `\n${z.prettifyError(r.error)}`);
  return r.data;
}

async function readJson(dir: string, name: string): Promise<unknown> {
  const raw = await fs.readFile(path.join(dir, name), 'utf8');
  try {
    return JSON.parse(raw);
  } catch (err) {
    fail(name, `not valid JSON (${(err as Error).message})`);
  }
}

function unique<T>(items: T[], key: (item: T) => string, file: string, what: string) {
  const seen = new Set<string>();
  for (const item of items) {
    const k = key(item);
    if (seen.has(k)) fail(file, `duplicate ${what} ${JSON.stringify(k)}`);
    seen.add(k);
  }
}

type Shape = Record<string, unknown>;
const isRecord = (v: unknown): v is Shape => typeof v === 'object' && v !== null && !Array.isArray(v);

/** zod drops unknown keys; in hand-written content an unknown key is a typo, so refuse it. */
function checkKeys(value: unknown, allowed: readonly string[], where: string, file: string) {
  if (!isRecord(value)) return;
  for (const key of Object.keys(value)) {
    if (!allowed.includes(key)) fail(file, `unknown key ${JSON.stringify(key)} in ${where} (allowed: ${allowed.join(', ')})`);
  }
}

function checkDataKeys(data: Shape, file: string) {
  const keysOf = (s: { shape: Record<string, unknown> }) => Object.keys(s.shape);
  checkKeys(data, keysOf(swapDataSchema), 'data', file);
  const each = (list: unknown, allowed: string[], where: string) => {
    if (Array.isArray(list)) list.forEach((item, i) => checkKeys(item, allowed, `${where}[${i}]`, file));
  };
  each(data.parts, [...keysOf(swapPartSchema), 'part'], 'data.parts');
  checkKeys(data.adapter, [...keysOf(adapterSchema), 'part'], 'data.adapter', file);
  each(data.calipers, [...keysOf(caliperSchema), 'part'], 'data.calipers');
  each(data.rotors, [...keysOf(rotorSchema), 'part'], 'data.rotors');
  each(data.spacers, [...keysOf(spacerSchema), 'part'], 'data.spacers');
  each(data.shims, keysOf(shimSchema), 'data.shims');
  checkKeys(data.centring, keysOf(centringSchema), 'data.centring', file);
  each(data.machining, keysOf(machiningStepSchema), 'data.machining');
  each(data.fasteners, keysOf(fastenerSchema), 'data.fasteners');
  each(data.torque, keysOf(torqueSpecSchema), 'data.torque');
  each(data.costs, keysOf(costLineSchema), 'data.costs');
  checkKeys(data.wheel, keysOf(wheelRequirementSchema), 'data.wheel', file);
  if (isRecord(data.wheel)) each(data.wheel.testedWheels, keysOf(testedWheelSchema), 'data.wheel.testedWheels');
  checkKeys(data.brakes, keysOf(brakeFiguresSchema), 'data.brakes', file);
  checkKeys(data.parkingBrake, keysOf(parkingBrakeSchema), 'data.parkingBrake', file);
}

type CaliperSpecs = {
  pistonsPerSideMm: number[];
  opposed: boolean;
  mounting: 'axial' | 'radial';
  mountSpacingMm: number;
  mountThread: string;
  padHeightMm: number;
  designRotorDiameterMm: number;
  designRotorThicknessMm: [number, number];
};
type RotorSpecs = {
  diameterMm: number;
  thicknessMm: number;
  minThicknessMm: number;
  vented: boolean;
  directional: boolean;
  hatHeightMm: number;
  frictionRingInnerDiameterMm: number;
  centreBoreMm: number;
  drumInHatDiameterMm?: number;
};

/** Placeholder id while checking; the real catalogue id is set inside the transaction. */
const PENDING_PART_ID = 1;

function resolveData(raw: Shape, parts: Map<string, Part>, file: string): { data: SwapData; partSlugs: (string | null)[] } {
  checkDataKeys(raw, file);
  const lookup = (ref: unknown, kind: Part['kind'], where: string): Part | null => {
    if (!isRecord(ref) || ref.part === undefined) return null;
    const part = parts.get(String(ref.part));
    if (!part) fail(file, `${where} refers to unknown part ${JSON.stringify(ref.part)}`);
    if (kind && part.kind !== kind) fail(file, `${where}: part ${part.slug} is a ${part.kind}, not a ${kind}`);
    return part;
  };
  const partSlugs: (string | null)[] = [];
  const data: Shape = { ...raw };
  if (Array.isArray(raw.parts)) {
    data.parts = raw.parts.map((line, i) => {
      if (!isRecord(line) || line.part === undefined) {
        partSlugs.push(null);
        return line;
      }
      const part = parts.get(String(line.part));
      if (!part) fail(file, `data.parts[${i}] refers to unknown part ${JSON.stringify(line.part)}`);
      partSlugs.push(part.slug);
      const { part: _ref, ...overrides } = line;
      return {
        partId: PENDING_PART_ID,
        kind: part.kind,
        name: part.name,
        maker: part.maker,
        partNumbers: part.partNumbers,
        cameOn: part.cameOn,
        ...overrides,
      };
    });
  }
  const adapter = lookup(raw.adapter, 'adapter', 'data.adapter');
  if (adapter && isRecord(raw.adapter)) {
    const { part: _ref, ...rest } = raw.adapter;
    data.adapter = { name: adapter.name, maker: adapter.maker, partNumber: adapter.partNumbers[0], ...rest };
  }
  if (Array.isArray(raw.calipers)) {
    data.calipers = raw.calipers.map((c, i) => {
      const part = lookup(c, 'caliper', `data.calipers[${i}]`);
      if (!part || !isRecord(c)) return c;
      const { part: _ref, ...rest } = c;
      const s = part.specs as CaliperSpecs;
      const sides = s.opposed ? (['inboard', 'outboard'] as const) : (['inboard'] as const);
      return {
        name: part.name,
        type: s.opposed ? 'fixed' : 'floating',
        pistons: sides.flatMap((side) => s.pistonsPerSideMm.map((diameterMm) => ({ diameterMm, side }))),
        mount: { type: s.mounting, spacingMm: s.mountSpacingMm, thread: s.mountThread },
        designRotor: {
          diameterMm: s.designRotorDiameterMm,
          thicknessMinMm: s.designRotorThicknessMm[0],
          thicknessMaxMm: s.designRotorThicknessMm[1],
        },
        padHeightMm: s.padHeightMm,
        ...rest,
      };
    });
  }
  if (Array.isArray(raw.rotors)) {
    data.rotors = raw.rotors.map((r, i) => {
      const part = lookup(r, 'rotor', `data.rotors[${i}]`);
      if (!part || !isRecord(r)) return r;
      const { part: _ref, ...rest } = r;
      const s = part.specs as RotorSpecs;
      return {
        diameterMm: s.diameterMm,
        thicknessMm: s.thicknessMm,
        minThicknessMm: s.minThicknessMm,
        hatHeightMm: s.hatHeightMm,
        frictionRingInnerDiameterMm: s.frictionRingInnerDiameterMm,
        centreBoreMm: s.centreBoreMm,
        vented: s.vented,
        directional: s.directional,
        ...(s.drumInHatDiameterMm ? { parkingDrumDiameterMm: s.drumInHatDiameterMm } : {}),
        partNumber: part.partNumbers[0],
        ...rest,
      };
    });
  }
  if (Array.isArray(raw.spacers)) {
    data.spacers = raw.spacers.map((sp, i) => {
      const part = lookup(sp, 'spacer', `data.spacers[${i}]`);
      if (!part || !isRecord(sp)) return sp;
      const { part: _ref, ...rest } = sp;
      const s = part.specs as { thicknessMm: number; hubCentric: boolean; mounting: 'slip_on' | 'bolt_on'; material: string };
      return { thicknessMm: s.thicknessMm, hubCentric: s.hubCentric, mounting: s.mounting, material: s.material, ...rest };
    });
  }
  const parsed = swapDataSchema.safeParse(data);
  if (!parsed.success) fail(file, `data does not match the swap schema:\n${z.prettifyError(parsed.error)}`);
  return { data: parsed.data, partSlugs };
}

const reviewedStatuses: RevisionStatus[] = ['approved', 'superseded', 'sent_back', 'declined'];

function planSwap(
  file: string,
  raw: string,
  ctx: { parts: Map<string, Part>; users: Map<string, Content['users'][number]>; chassis: Set<string>; images: Set<string> },
): PlannedSwap {
  let parsed: matter.GrayMatterFile<string>;
  try {
    parsed = matter(raw);
  } catch (err) {
    fail(file, `front matter is not valid YAML (${(err as Error).message})`);
  }
  const meta = parseWith(frontMatterSchema, parsed.data, file);
  const expectedFile = `swaps/${meta.slug}.md`;
  if (file !== expectedFile) fail(file, `slug ${meta.slug} does not match the file name (expected ${expectedFile})`);
  if (!ctx.chassis.has(meta.chassis)) fail(file, `unknown chassis ${meta.chassis}`);
  const userOf = (name: string, where: string) => {
    const u = ctx.users.get(name);
    if (!u) fail(file, `${where}: unknown member ${name}`);
    return u;
  };
  userOf(meta.author, 'author');

  const latestBody = parsed.content.trim();
  const entries = [
    ...meta.revisions.map((r) => ({
      ...r,
      author: r.author ?? meta.author,
      rawData: { ...meta.data, ...r.data },
      body: (r.body ?? latestBody).trim(),
    })),
    {
      status: meta.status,
      submittedAt: meta.submittedAt,
      reviewer: meta.reviewer,
      reviewedAt: meta.reviewedAt,
      reviewNote: meta.reviewNote,
      photos: meta.photos,
      author: meta.revisionAuthor ?? meta.author,
      rawData: meta.data,
      body: latestBody,
    },
  ];

  const revisions = entries.map((e, i): PlannedRevision => {
    const number = i + 1;
    const where = `revision ${number}`;
    const author = userOf(e.author, `${where} author`);
    if (/<[a-z!/?]/i.test(e.body)) fail(file, `${where}: the write-up contains raw HTML; use markdown only`);
    if (e.body.length < 40) fail(file, `${where}: the write-up is missing or too short`);
    if (e.status !== 'draft' && !e.submittedAt) fail(file, `${where}: ${e.status} needs submittedAt`);
    if (reviewedStatuses.includes(e.status)) {
      if (!e.reviewer || !e.reviewedAt) fail(file, `${where}: ${e.status} needs reviewer and reviewedAt`);
      const reviewer = userOf(e.reviewer, `${where} reviewer`);
      if (!can(reviewer.role, 'review')) fail(file, `${where}: ${e.reviewer} may not review (role ${reviewer.role})`);
      if (e.reviewer === author.login) fail(file, `${where}: ${e.reviewer} cannot review their own revision`);
      if (e.submittedAt && e.reviewedAt < e.submittedAt) fail(file, `${where}: reviewedAt is before submittedAt`);
    } else if (e.reviewer || e.reviewedAt) {
      fail(file, `${where}: a ${e.status} revision has no reviewer yet`);
    }
    if ((e.status === 'sent_back' || e.status === 'declined') && !e.reviewNote)
      fail(file, `${where}: ${e.status} needs a reviewNote with the reasons`);
    for (const p of e.photos) if (!ctx.images.has(p.file)) fail(file, `${where}: photo ${p.file} is not in content/images`);
    const { data, partSlugs } = resolveData(e.rawData, ctx.parts, file);
    return {
      number,
      author: author.login,
      status: e.status,
      data,
      partSlugs,
      body: e.body,
      submittedAt: e.submittedAt ?? null,
      reviewer: e.reviewer ?? null,
      reviewedAt: e.reviewedAt ?? null,
      reviewNote: e.reviewNote ?? null,
      photos: e.photos.map((p) => ({ file: p.file, caption: p.caption })),
    };
  });

  const approvedAt = revisions.findIndex((r) => r.status === 'approved');
  if (revisions.filter((r) => r.status === 'approved').length > 1)
    fail(file, 'more than one approved revision; the older ones are superseded');
  revisions.forEach((r, i) => {
    if (r.status === 'superseded' && (approvedAt === -1 || i > approvedAt)) {
      fail(file, `revision ${r.number} is superseded but no later revision is approved`);
    }
    if (i > 0 && r.submittedAt && revisions[i - 1].submittedAt && r.submittedAt < revisions[i - 1].submittedAt!) {
      fail(file, `revision ${r.number} was submitted before revision ${r.number - 1}`);
    }
  });
  unique(meta.fittedBy, (f) => f.login, file, 'fitted report by');
  for (const f of meta.fittedBy) {
    userOf(f.login, 'fittedBy');
    if (!revisionLiveAt(revisions, f.at)) fail(file, `fitted report by ${f.login} is dated before any revision was approved`);
  }
  for (const fl of meta.flags) userOf(fl.reporter, 'flag reporter');
  return { file, meta, revisions };
}

/** The approved (or later superseded) revision a reader saw at a moment. */
function revisionLiveAt(revisions: PlannedRevision[], at: Date): PlannedRevision | undefined {
  return revisions
    .filter((r) => (r.status === 'approved' || r.status === 'superseded') && r.reviewedAt && r.reviewedAt <= at)
    .at(-1);
}

async function loadContent(dir: string): Promise<Content> {
  const shops = parseWith(shopsFileSchema, await readJson(dir, 'shops.json'), 'shops.json');
  const users = parseWith(usersFileSchema, await readJson(dir, 'users.json'), 'users.json');
  const chassis = parseWith(chassisFileSchema, await readJson(dir, 'chassis.json'), 'chassis.json');
  const parts = parseWith(partsFileSchema, await readJson(dir, 'parts.json'), 'parts.json');
  const reasons = parseWith(reasonsFileSchema, await readJson(dir, 'review-reasons.json'), 'review-reasons.json');
  unique(shops, (s) => s.slug, 'shops.json', 'shop');
  unique(users, (u) => u.login, 'users.json', 'login');
  unique(chassis, (c) => c.slug, 'chassis.json', 'chassis');
  unique(parts, (p) => p.slug, 'parts.json', 'part');

  const shopSlugs = new Set(shops.map((s) => s.slug));
  const chassisSlugs = new Set(chassis.map((c) => c.slug));
  for (const u of users) {
    if (u.shop && !shopSlugs.has(u.shop)) fail('users.json', `${u.login}: unknown shop ${u.shop}`);
    if (u.role === 'shop' && !u.shop) fail('users.json', `${u.login}: a shop account needs a shop`);
    for (const c of u.cars)
      if (!chassisSlugs.has(c.chassis)) fail('users.json', `${u.login}: car on unknown chassis ${c.chassis}`);
  }

  const imageDir = path.join(dir, 'images');
  const imageNames = new Set((await fs.readdir(imageDir)).filter((f) => /\.(png|jpe?g)$/.test(f)));
  const ctx = {
    parts: new Map(parts.map((p) => [p.slug, p])),
    users: new Map(users.map((u) => [u.login, u])),
    chassis: chassisSlugs,
    images: imageNames,
  };
  const swapFiles = (await fs.readdir(path.join(dir, 'swaps'))).filter((f) => f.endsWith('.md')).sort();
  const swaps: PlannedSwap[] = [];
  for (const name of swapFiles) {
    const file = `swaps/${name}`;
    swaps.push(planSwap(file, await fs.readFile(path.join(dir, file), 'utf8'), ctx));
  }
  unique(swaps, (s) => s.meta.slug, 'swaps', 'swap slug');
  // ids follow the order the swaps were first submitted, as they would in use
  const firstAt = (s: PlannedSwap) => s.revisions[0].submittedAt?.getTime() ?? Number.MAX_SAFE_INTEGER;
  swaps.sort((a, b) => firstAt(a) - firstAt(b));

  const swapBySlug = new Map(swaps.map((s) => [s.meta.slug, s]));
  for (const shop of shops) {
    for (const link of shop.links) {
      const swap = swapBySlug.get(link.swap);
      const rev = swap?.revisions.find((r) => r.number === link.revision);
      if (!rev || (rev.status !== 'approved' && rev.status !== 'superseded')) {
        fail('shops.json', `link ${link.code}: ${link.swap} has no approved revision ${link.revision}`);
      }
      const creator = users.find((u) => u.login === link.createdBy);
      if (creator?.shop !== shop.slug)
        fail('shops.json', `link ${link.code}: ${link.createdBy} is not an account of ${shop.slug}`);
    }
  }

  const used = new Set(swaps.flatMap((s) => s.revisions.flatMap((r) => r.photos.map((p) => p.file))));
  const images = new Map<string, PhotoFile>();
  for (const name of used) {
    const buffer = await fs.readFile(path.join(imageDir, name));
    let processed;
    try {
      processed = await processPhoto(buffer);
    } catch (err) {
      fail(`images/${name}`, `not a usable photo (${(err as Error).message})`);
    }
    images.set(name, { ...processed, bytes: processed.full.length });
  }
  return { shops, users, chassis, parts, reasons, swaps, images };
}

// ---------- database ----------

/** Children before parents; tables not listed here (added later) are emptied too. */
const deleteOrder = [
  'sessions',
  'mail_outbox',
  'user_changes',
  'plan_swaps',
  'plans',
  'car_fitted_swaps',
  'shop_links',
  'flags',
  'fitted_reports',
  'cars',
  'review_events',
  'revision_photos',
  'revisions',
  'swaps',
  'review_reason_templates',
  'parts',
  'chassis',
  'users',
  'shops',
];

export function isDatabaseEmpty(db: Db): boolean {
  const row = db.select({ n: count() }).from(t.users).get();
  return (row?.n ?? 0) === 0;
}

const countedTables = {
  shops: t.shops,
  users: t.users,
  chassis: t.chassis,
  parts: t.parts,
  swaps: t.swaps,
  revisions: t.revisions,
  revisionPhotos: t.revisionPhotos,
  reviewEvents: t.reviewEvents,
  reviewReasonTemplates: t.reviewReasonTemplates,
  fittedReports: t.fittedReports,
  flags: t.flags,
  cars: t.cars,
  shopLinks: t.shopLinks,
};

export function countRows(db: Db): SeedCounts {
  const counts = {} as SeedCounts;
  for (const [name, table] of Object.entries(countedTables)) {
    counts[name as keyof SeedCounts] = db.select({ n: count() }).from(table).get()?.n ?? 0;
  }
  return counts;
}
type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

function clearAll(tx: Tx) {
  // the swaps ↔ revisions reference runs both ways; check all foreign keys at commit instead
  tx.run(sql.raw('PRAGMA defer_foreign_keys = ON'));
  const tables = tx
    .all<{ name: string }>(
      sql`SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' AND name NOT LIKE '__drizzle%'`,
    )
    .map((r) => r.name);
  const ordered = [
    ...deleteOrder.filter((name) => tables.includes(name)),
    ...tables.filter((name) => !deleteOrder.includes(name)),
  ];
  for (const name of ordered) tx.run(sql.raw(`DELETE FROM "${name.replace(/"/g, '""')}"`));
  const hasSequence = tx.all<{ name: string }>(sql`SELECT name FROM sqlite_master WHERE name = 'sqlite_sequence'`).length > 0;
  if (hasSequence) tx.run(sql.raw('DELETE FROM sqlite_sequence'));
}

function storedFileIds(db: Db): string[] {
  const photos = db.select({ id: t.revisionPhotos.fileId }).from(t.revisionPhotos).all();
  const fitted = db
    .select({ id: t.fittedReports.photoFileId })
    .from(t.fittedReports)
    .where(isNotNull(t.fittedReports.photoFileId))
    .all();
  return [...photos.map((p) => p.id), ...fitted.map((f) => f.id!)].flatMap((id) => [id, thumbId(id)]);
}

type StoredPhoto = { fileId: string; file: string };

function insertContent(tx: Tx, content: Content, stored: Map<PlannedRevision, StoredPhoto[]>, now: Date, appUrl: string) {
  const stamp = (at: Date = now) => ({ createdAt: at, updatedAt: at });

  const shopIds = new Map<string, number>();
  for (const s of content.shops) {
    const row = tx
      .insert(t.shops)
      .values({
        slug: s.slug,
        name: s.name,
        town: s.town,
        website: s.website,
        about: s.about,
        ...s.contact,
        openingHours: s.openingHours,
        ...stamp(),
      })
      .returning({ id: t.shops.id })
      .get();
    shopIds.set(s.slug, row.id);
  }

  const userIds = new Map<string, number>();
  for (const u of content.users) {
    const row = tx
      .insert(t.users)
      .values({
        provider: 'github',
        providerId: `demo-${u.login}`,
        login: u.login,
        name: u.name,
        email: u.email,
        role: u.role,
        shopId: u.shop ? shopIds.get(u.shop)! : null,
        ...stamp(u.joinedAt),
      })
      .returning({ id: t.users.id })
      .get();
    userIds.set(u.login, row.id);
  }
  const userId = (login: string) => userIds.get(login)!;

  const chassisIds = new Map<string, number>();
  for (const c of content.chassis) {
    const row = tx
      .insert(t.chassis)
      .values({ ...c, ...stamp() })
      .returning({ id: t.chassis.id })
      .get();
    chassisIds.set(c.slug, row.id);
  }

  const partIds = new Map<string, number>();
  for (const p of content.parts) {
    const row = tx
      .insert(t.parts)
      .values({ ...p, ...stamp() })
      .returning({ id: t.parts.id })
      .get();
    partIds.set(p.slug, row.id);
  }

  for (const r of content.reasons)
    tx.insert(t.reviewReasonTemplates)
      .values({ ...r, ...stamp() })
      .run();

  const revisionIds = new Map<string, Map<number, number>>();
  for (const swap of content.swaps) {
    const { meta, revisions } = swap;
    const first = revisions[0];
    const lastAt = revisions
      .flatMap((r) => [r.submittedAt, r.reviewedAt])
      .filter((d): d is Date => d !== null)
      .reduce((a, b) => (b > a ? b : a), first.submittedAt ?? now);
    const swapRow = tx
      .insert(t.swaps)
      .values({
        slug: meta.slug,
        chassisId: chassisIds.get(meta.chassis)!,
        axle: meta.axle,
        category: meta.category,
        authorId: userId(meta.author),
        fittedCount: 0,
        createdAt: first.submittedAt ?? now,
        updatedAt: lastAt,
      })
      .returning({ id: t.swaps.id })
      .get();

    const ids = new Map<number, number>();
    revisionIds.set(meta.slug, ids);
    const nextApproval = (i: number) => revisions.slice(i + 1).find((r) => r.status === 'approved' || r.status === 'superseded');
    revisions.forEach((rev, i) => {
      const data: SwapData = {
        ...rev.data,
        parts: rev.data.parts.map((line, j) => {
          const ref = rev.partSlugs[j];
          return ref ? { ...line, partId: partIds.get(ref)! } : line;
        }),
      };
      const created = rev.submittedAt ?? now;
      const revRow = tx
        .insert(t.revisions)
        .values({
          swapId: swapRow.id,
          number: rev.number,
          authorId: userId(rev.author),
          status: rev.status,
          data,
          body: rev.body,
          submittedAt: rev.submittedAt,
          reviewedAt: rev.reviewedAt,
          reviewedById: rev.reviewer ? userId(rev.reviewer) : null,
          reviewNote: rev.reviewNote,
          createdAt: created,
          updatedAt: rev.reviewedAt ?? created,
        })
        .returning({ id: t.revisions.id })
        .get();
      ids.set(rev.number, revRow.id);

      (stored.get(rev) ?? []).forEach((photo, position) => {
        const img = content.images.get(photo.file)!;
        tx.insert(t.revisionPhotos)
          .values({
            revisionId: revRow.id,
            fileId: photo.fileId,
            caption: rev.photos[position].caption,
            position,
            width: img.width,
            height: img.height,
            bytes: img.bytes,
            sha256: img.sha256,
            createdAt: created,
          })
          .run();
      });

      const event = (action: (typeof t.reviewEvents.$inferInsert)['action'], actor: string, at: Date, note = '') =>
        tx
          .insert(t.reviewEvents)
          .values({ revisionId: revRow.id, actorId: userId(actor), action, note, at })
          .run();
      if (rev.submittedAt) event('submitted', rev.author, rev.submittedAt);
      if (rev.status === 'approved' || rev.status === 'superseded')
        event('approved', rev.reviewer!, rev.reviewedAt!, rev.reviewNote ?? '');
      if (rev.status === 'sent_back') event('sent_back', rev.reviewer!, rev.reviewedAt!, rev.reviewNote ?? '');
      if (rev.status === 'declined') event('declined', rev.reviewer!, rev.reviewedAt!, rev.reviewNote ?? '');
      if (rev.status === 'superseded') {
        const by = nextApproval(i)!;
        event('superseded', by.reviewer!, by.reviewedAt!, `Replaced by revision ${by.number}`);
      }

      // the messages the review loop would have sent, so the demo outbox is not empty
      const author = content.users.find((u) => u.login === rev.author);
      const mail = (at: Date, m: BuiltMessage) =>
        author?.email &&
        tx
          .insert(t.mailOutbox)
          .values({ to: author.email, ...m, createdAt: at, sentAt: null })
          .run();
      const who = { appUrl, name: author?.name ?? rev.author, title: rev.data.title };
      if (rev.status === 'in_review')
        mail(rev.submittedAt!, submissionReceived({ ...who, revisionId: revRow.id, number: rev.number }));
      if (rev.status === 'sent_back')
        mail(rev.reviewedAt!, submissionSentBack({ ...who, revisionId: revRow.id, reasons: rev.reviewNote ?? '' }));
    });

    const current = revisions.find((r) => r.status === 'approved');
    for (const f of meta.fittedBy) {
      const seen = revisionLiveAt(revisions, f.at)!;
      tx.insert(t.fittedReports)
        .values({
          swapId: swapRow.id,
          userId: userId(f.login),
          revisionId: ids.get(seen.number)!,
          wheel: f.wheel,
          clearanceMm: f.clearanceMm ?? null,
          note: f.note,
          ...stamp(f.at),
        })
        .run();
    }
    for (const fl of meta.flags) {
      tx.insert(t.flags)
        .values({
          swapId: swapRow.id,
          reporterId: userId(fl.reporter),
          kind: fl.kind,
          reason: fl.reason,
          status: 'open',
          ...stamp(fl.at),
        })
        .run();
    }
    tx.update(t.swaps)
      .set({ currentRevisionId: current ? ids.get(current.number)! : null, fittedCount: meta.fittedBy.length })
      .where(eq(t.swaps.id, swapRow.id))
      .run();
  }

  /** an approved swap by slug; the content names only approved swaps as fitted or planned */
  const approvedSwap = (slug: string, where: string) => {
    const row = tx.select().from(t.swaps).where(eq(t.swaps.slug, slug)).get();
    if (!row || row.currentRevisionId === null) fail('users.json', `${where}: ${slug} is not an approved swap`);
    return row!;
  };
  for (const u of content.users) {
    const carIds = new Map<string, number>();
    for (const car of u.cars) {
      const { chassis: chassisSlug, fitted, ...rest } = car;
      const carRow = tx
        .insert(t.cars)
        .values({ userId: userId(u.login), chassisId: chassisIds.get(chassisSlug)!, ...rest, ...stamp(u.joinedAt) })
        .returning()
        .get();
      carIds.set(car.nickname, carRow.id);
      fitted.forEach((swapSlug, position) => {
        const swap = approvedSwap(swapSlug, `${u.login}'s ${car.nickname}`);
        tx.insert(t.carFittedSwaps)
          .values({
            carId: carRow.id,
            swapId: swap.id,
            revisionId: swap.currentRevisionId!,
            position,
            createdAt: new Date(u.joinedAt),
          })
          .run();
      });
    }
    for (const plan of u.plans) {
      const carId =
        plan.car === undefined ? null : (carIds.get(plan.car) ?? fail('users.json', `${plan.id}: no car ${plan.car}`));
      const swaps = plan.swaps.map((swapSlug) => approvedSwap(swapSlug, `plan ${plan.id}`));
      tx.insert(t.plans)
        .values({
          id: plan.id,
          title: plan.title,
          chassisId: swaps[0]!.chassisId,
          carId,
          ownerId: userId(u.login),
          ...stamp(plan.at),
        })
        .run();
      swaps.forEach((swap, position) =>
        tx.insert(t.planSwaps).values({ planId: plan.id, swapId: swap.id, revisionId: swap.currentRevisionId!, position }).run(),
      );
    }
  }

  for (const shop of content.shops) {
    for (const link of shop.links) {
      tx.insert(t.shopLinks)
        .values({
          code: link.code,
          shopId: shopIds.get(shop.slug)!,
          swapId: tx.select({ id: t.swaps.id }).from(t.swaps).where(eq(t.swaps.slug, link.swap)).get()!.id,
          revisionId: revisionIds.get(link.swap)!.get(link.revision)!,
          createdById: userId(link.createdBy),
          publicNote: link.publicNote,
          note: link.privateNote,
          customerRef: link.customerRef,
          quotedPriceMinor: link.quotedPrice?.amountMinor ?? null,
          quotedCurrency: link.quotedPrice?.currency ?? null,
          ...stamp(link.createdAt),
        })
        .run();
    }
  }
}

/**
 * Loads the demo scenario. Does nothing when members already exist, unless `reset`,
 * which first empties every table and removes the stored photo files.
 */
export async function seedDemo(
  db: Db,
  { storage, clock }: { storage: Storage; clock: Clock },
  {
    reset = false,
    contentDir = defaultContentDir,
    appUrl = 'http://localhost:3000',
  }: { reset?: boolean; contentDir?: string; /** links in the demo's e-mails */ appUrl?: string } = {},
): Promise<SeedResult> {
  if (!reset && !isDatabaseEmpty(db)) return { seeded: false, counts: countRows(db) };

  const content = await loadContent(contentDir);
  const previousFiles = reset ? storedFileIds(db) : [];

  const stored = new Map<PlannedRevision, StoredPhoto[]>();
  const written: string[] = [];
  try {
    for (const swap of content.swaps) {
      for (const rev of swap.revisions) {
        const list: StoredPhoto[] = [];
        for (const p of rev.photos) {
          const fileId = newFileId();
          const img = content.images.get(p.file)!;
          written.push(fileId, thumbId(fileId));
          await storage.put(fileId, img.full);
          await storage.put(thumbId(fileId), img.thumb);
          list.push({ fileId, file: p.file });
        }
        stored.set(rev, list);
      }
    }
    const now = clock.now();
    db.transaction((tx) => {
      if (reset) clearAll(tx);
      insertContent(tx, content, stored, now, appUrl);
    });
  } catch (err) {
    await Promise.all(written.map((id) => storage.remove(id).catch(() => undefined)));
    throw err;
  }
  await Promise.all(previousFiles.map((id) => storage.remove(id).catch(() => undefined)));
  return { seeded: true, counts: countRows(db) };
}
