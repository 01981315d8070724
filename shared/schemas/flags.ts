import { z } from 'zod';

// Flags: what a reader says is wrong with a swap sheet, and how a moderator settles it.

export const flagKinds = ['wrong_figure', 'unsafe_advice', 'duplicate', 'spam', 'other'] as const;
export const flagKindSchema = z.enum(flagKinds, { error: 'Pick what kind of problem it is' });
export type FlagKind = z.infer<typeof flagKindSchema>;
export const flagKindLabels: Record<FlagKind, string> = {
  wrong_figure: 'A figure looks wrong',
  unsafe_advice: 'Unsafe advice',
  duplicate: 'Duplicate of another sheet',
  spam: 'Spam or advertising',
  other: 'Something else',
};

/**
 * Kinds that question a safety figure or instruction: while one is open, the sheet tells its readers so,
 * since a wrong torque or clearance is a risk to whoever follows it.
 */
export const safetyFlagKinds = ['wrong_figure', 'unsafe_advice'] as const satisfies readonly FlagKind[];
export const isSafetyFlag = (kind: FlagKind) => (safetyFlagKinds as readonly FlagKind[]).includes(kind);

export const flagOutcomes = ['fixed_by_correction', 'not_a_problem', 'duplicate', 'spam'] as const;
export const flagOutcomeSchema = z.enum(flagOutcomes, { error: 'Pick how this flag was settled' });
export type FlagOutcome = z.infer<typeof flagOutcomeSchema>;
/** how the outcome reads to the desk and to the reporter */
export const flagOutcomeLabels: Record<FlagOutcome, string> = {
  fixed_by_correction: 'Fixed by a correction',
  not_a_problem: 'Not a problem',
  duplicate: 'Already reported',
  spam: 'Spam',
};

/** the longest a gist of a flag shown to readers runs, in characters */
export const FLAG_GIST_LENGTH = 200;

/** An open flag about a safety figure as a reader sees it on the sheet: what it says, never who said it. */
export type OpenSafetyFlag = {
  id: number;
  kind: (typeof safetyFlagKinds)[number];
  gist: string;
  raisedAt: string;
  /** a correction that answers it is waiting at the desk */
  correctionPending: boolean;
};
