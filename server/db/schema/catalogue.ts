import { sqliteTable, text, integer, real, index } from 'drizzle-orm/sqlite-core';
import { timestamp, timestamps } from './columns';
import { users } from './users';
import { catalogueActions, catalogueSubjects } from '../../../shared/schemas/catalogue-admin';
import { partKinds } from '../../../shared/schemas/enums';
import type { StockBrakeCornerView } from '../../../shared/schemas/views';
import type { VehicleData } from '../../../shared/schemas/vehicle';
import type { ChassisWheelFastening } from '../../../shared/schemas/wheel-fastening';

export const chassis = sqliteTable('chassis', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  slug: text('slug').notNull().unique(),
  make: text('make').notNull(),
  model: text('model').notNull(),
  code: text('code').notNull(),
  yearFrom: integer('year_from').notNull(),
  yearTo: integer('year_to'),
  body: text('body').notNull().default(''),
  lugCount: integer('lug_count').notNull(),
  pcdMm: real('pcd_mm').notNull(),
  centreBoreMm: real('centre_bore_mm').notNull(),
  wheelBoltThread: text('wheel_bolt_thread').notNull(),
  /** { diameterIn, widthIn, offsetMm, tyre } */
  stockWheel: text('stock_wheel', { mode: 'json' }).$type<StockWheel>().notNull(),
  /** { front: BrakeCorner & { description }, rear: … } */
  stockBrakes: text('stock_brakes', { mode: 'json' }).$type<StockBrakes>().notNull(),
  /** stock figures for the brake-distribution analysis (masses, weight split, centre of gravity, valve); null when unknown */
  vehicle: text('vehicle', { mode: 'json' }).$type<VehicleData>(),
  /** the factory wheel fastener and the hubs it screws into; null when nobody has recorded it */
  wheelFastening: text('wheel_fastening', { mode: 'json' }).$type<ChassisWheelFastening>(),
  notes: text('notes').notNull().default(''),
  /** proposed with a submission and not yet approved */
  proposed: integer('proposed', { mode: 'boolean' }).notNull().default(false),
  ...timestamps,
});

export type StockWheel = { diameterIn: number; widthIn: number; offsetMm: number; tyre: string };
export type StockBrakeCorner = StockBrakeCornerView;
export type StockBrakes = { front: StockBrakeCorner; rear: StockBrakeCorner };

export const parts = sqliteTable(
  'parts',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    slug: text('slug').notNull().unique(),
    kind: text('kind', { enum: partKinds }).notNull(),
    name: text('name').notNull(),
    maker: text('maker').notNull().default(''),
    partNumbers: text('part_numbers', { mode: 'json' }).$type<string[]>().notNull(),
    /** specs by kind, e.g. caliper { pistonsPerSideMm, mounting, opposed }, rotor { diameterMm, thicknessMm, vented } */
    specs: text('specs', { mode: 'json' }).$type<Record<string, unknown>>().notNull(),
    cameOn: text('came_on', { mode: 'json' }).$type<string[]>().notNull(),
    notes: text('notes').notNull().default(''),
    ...timestamps,
  },
  (t) => [index('parts_kind_idx').on(t.kind)],
);

/**
 * Who changed the catalogue and how, one row per changed field (edits), per merge or per approval. The
 * subject is named as it was at the time, since a merge removes the record it folded away.
 */
export const catalogueChanges = sqliteTable(
  'catalogue_changes',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    subject: text('subject', { enum: catalogueSubjects }).notNull(),
    /** the chassis or part changed, or (for a merge) the one kept */
    subjectId: integer('subject_id').notNull(),
    subjectLabel: text('subject_label').notNull(),
    actorId: integer('actor_id').references(() => users.id, { onDelete: 'set null' }),
    action: text('action', { enum: catalogueActions }).notNull(),
    field: text('field'),
    fromValue: text('from_value'),
    toValue: text('to_value'),
    at: timestamp('at').notNull(),
  },
  (t) => [index('catalogue_changes_subject_idx').on(t.subject, t.subjectId), index('catalogue_changes_at_idx').on(t.at)],
);
