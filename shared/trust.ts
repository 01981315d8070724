import type { Role } from './roles';

/**
 * A member's trust level: earned by approved work, it decides whether their fitted reports go live at
 * once or wait for a moderator.
 *
 * - `new`: below the thresholds; fitted reports (and their photos) are held for a moderator.
 * - `trusted`: at least TRUSTED.approvedRevisions approved revision, or TRUSTED.standingReports fitted
 *   reports a moderator let stand; reports go live at once.
 * - `established`: at least ESTABLISHED.approvedRevisions approved revisions and
 *   ESTABLISHED.standingReports standing reports, or ESTABLISHED.approvedRevisions × 2 approved revisions.
 *
 * Moderators and admins are `established` by role. Hidden reports and reports still held count for nothing.
 */
export const trustLevels = ['new', 'trusted', 'established'] as const;
export type TrustLevel = (typeof trustLevels)[number];

export const TRUSTED = { approvedRevisions: 1, standingReports: 3 } as const;
export const ESTABLISHED = { approvedRevisions: 3, standingReports: 5 } as const;

export type TrustRecord = {
  role: Role;
  /** revisions this member wrote that a moderator approved (still current or since replaced) */
  approvedRevisions: number;
  /** fitted reports of theirs that are live and not hidden */
  standingReports: number;
};

export function trustLevel({ role, approvedRevisions, standingReports }: TrustRecord): TrustLevel {
  if (role === 'moderator' || role === 'admin') return 'established';
  if (
    (approvedRevisions >= ESTABLISHED.approvedRevisions && standingReports >= ESTABLISHED.standingReports) ||
    approvedRevisions >= ESTABLISHED.approvedRevisions * 2
  )
    return 'established';
  if (approvedRevisions >= TRUSTED.approvedRevisions || standingReports >= TRUSTED.standingReports) return 'trusted';
  return 'new';
}

/** Whether this level's fitted reports go live without a moderator. */
export const reportsGoLive = (level: TrustLevel) => level !== 'new';

export const trustLevelLabels: Record<TrustLevel, string> = {
  new: 'New member',
  trusted: 'Trusted member',
  established: 'Established member',
};
