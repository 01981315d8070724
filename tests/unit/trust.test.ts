import { describe, expect, it } from 'vitest';
import { ESTABLISHED, TRUSTED, reportsGoLive, trustLevel } from '../../shared/trust';

// Thresholds are the project's own moderation policy (common practice, no source): they are read from
// the exported constants so the test follows the rule, and each edge is checked on both sides.

const member = (approvedRevisions: number, standingReports: number) => ({
  role: 'member' as const,
  approvedRevisions,
  standingReports,
});

describe('trustLevel', () => {
  it('when a member has nothing approved and no standing reports, then they are new and their reports are held', () => {
    expect(trustLevel(member(0, 0))).toBe('new');
    expect(reportsGoLive(trustLevel(member(0, 0)))).toBe(false);
  });

  it('when a member reaches the approved-revision threshold, then they are trusted; one short, they are not', () => {
    expect(trustLevel(member(TRUSTED.approvedRevisions, 0))).toBe('trusted');
    expect(trustLevel(member(TRUSTED.approvedRevisions - 1, 0))).toBe('new');
    expect(reportsGoLive(trustLevel(member(TRUSTED.approvedRevisions, 0)))).toBe(true);
  });

  it('when a member has enough standing fitted reports, then they are trusted without any approved revision', () => {
    expect(trustLevel(member(0, TRUSTED.standingReports))).toBe('trusted');
    expect(trustLevel(member(0, TRUSTED.standingReports - 1))).toBe('new');
  });

  it('when a member has both established thresholds, then they are established; missing either, trusted', () => {
    expect(trustLevel(member(ESTABLISHED.approvedRevisions, ESTABLISHED.standingReports))).toBe('established');
    expect(trustLevel(member(ESTABLISHED.approvedRevisions - 1, ESTABLISHED.standingReports))).toBe('trusted');
    expect(trustLevel(member(ESTABLISHED.approvedRevisions, ESTABLISHED.standingReports - 1))).toBe('trusted');
  });

  it('when a member has twice the established revisions, then they are established without reports', () => {
    expect(trustLevel(member(ESTABLISHED.approvedRevisions * 2, 0))).toBe('established');
    expect(trustLevel(member(ESTABLISHED.approvedRevisions * 2 - 1, 0))).toBe('trusted');
  });

  it('when the account is a moderator or admin, then it is established whatever it has written', () => {
    expect(trustLevel({ role: 'moderator', approvedRevisions: 0, standingReports: 0 })).toBe('established');
    expect(trustLevel({ role: 'admin', approvedRevisions: 0, standingReports: 0 })).toBe('established');
    // a shop account earns trust like a member
    expect(trustLevel({ role: 'shop', approvedRevisions: 0, standingReports: 0 })).toBe('new');
  });
});
