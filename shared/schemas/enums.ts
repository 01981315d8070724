import { z } from 'zod';

export const axles = ['front', 'rear'] as const;
export const axleSchema = z.enum(axles);
export type Axle = z.infer<typeof axleSchema>;

export const categories = ['brakes', 'wheels_tyres', 'suspension', 'drivetrain', 'repair'] as const;
export const categorySchema = z.enum(categories);
export type Category = z.infer<typeof categorySchema>;
export const categoryLabels: Record<Category, string> = {
  brakes: 'Brakes',
  wheels_tyres: 'Wheels & tyres',
  suspension: 'Suspension',
  drivetrain: 'Drivetrain',
  repair: 'Repair',
};

export const partKinds = [
  'caliper',
  'rotor',
  'pad',
  'adapter',
  'shim',
  'spacer',
  'line',
  'hose',
  'wheel',
  'wheel_fastener',
  'anti_roll_bar',
  'bush',
  'thread_insert',
  'hardware',
  'other',
] as const;
export const partKindSchema = z.enum(partKinds);
export type PartKind = z.infer<typeof partKindSchema>;
export const partKindLabels: Record<PartKind, string> = {
  caliper: 'Caliper',
  rotor: 'Rotor',
  pad: 'Pads',
  adapter: 'Adapter bracket',
  shim: 'Shim',
  spacer: 'Wheel spacer',
  line: 'Brake line',
  hose: 'Hose',
  wheel: 'Wheel',
  wheel_fastener: 'Wheel bolt / stud / nut',
  anti_roll_bar: 'Anti-roll bar',
  bush: 'Bush',
  thread_insert: 'Thread insert',
  hardware: 'Hardware',
  other: 'Other',
};

export const costRoutes = ['as_built', 'budget', 'new_kit'] as const;
export const costRouteSchema = z.enum(costRoutes);
export type CostRoute = z.infer<typeof costRouteSchema>;
export const costRouteLabels: Record<CostRoute, string> = {
  as_built: 'As built',
  budget: 'Budget',
  new_kit: 'New kit',
};

/** a fitted report is `held` for a moderator when a new member wrote it, `live` otherwise */
export const fittedReportStates = ['held', 'live'] as const;
export type FittedReportState = (typeof fittedReportStates)[number];

export const revisionStatuses = ['draft', 'in_review', 'approved', 'sent_back', 'declined', 'superseded'] as const;
export const revisionStatusSchema = z.enum(revisionStatuses);
export type RevisionStatus = z.infer<typeof revisionStatusSchema>;
/** the words people read for a revision's status (the stored values above stay as they are) */
export const revisionStatusLabels: Record<RevisionStatus, string> = {
  draft: 'Draft',
  in_review: 'At the desk',
  approved: 'Published',
  sent_back: 'Back for rework',
  declined: 'Not published',
  superseded: 'Replaced',
};

/** the words of the automatic checks on the review desk, by result */
export const checkStatusLabels = { pass: 'In order', fail: 'Fix needed', attention: 'Look closer' } as const;

export const machiningOperations = ['grind', 'machine', 'drill', 'trim'] as const;
export const machiningLevels = ['none', 'minor', 'major', 'structural'] as const;
export type MachiningLevel = (typeof machiningLevels)[number];
export const machiningLevelLabels: Record<MachiningLevel, string> = {
  none: 'No machining',
  minor: 'Minor machining',
  major: 'Major machining',
  structural: 'Structural work',
};

export const unitSystems = ['metric', 'imperial'] as const;
export const unitSystemSchema = z.enum(unitSystems);
export type UnitSystem = z.infer<typeof unitSystemSchema>;

/**
 * Delivery of one outbox message: `kept` (no mail server configured: it stays in the outbox),
 * `pending` (not tried yet), `sending`, `retrying` (failed, tried again later), `sent`, `failed` (given up).
 */
export const mailStatuses = ['kept', 'pending', 'sending', 'retrying', 'sent', 'failed'] as const;
export type MailStatus = (typeof mailStatuses)[number];
export const mailStatusLabels: Record<MailStatus, string> = {
  kept: 'Kept here (no mail server)',
  pending: 'Waiting to be sent',
  sending: 'Being sent',
  retrying: 'Will try again',
  sent: 'Sent',
  failed: 'Not delivered',
};
