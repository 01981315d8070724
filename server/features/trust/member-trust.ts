import { and, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { fittedReports, revisions } from '../../db/schema/index';
import { trustLevel, type TrustLevel, type TrustRecord } from '../../../shared/trust';
import type { Role } from '../../../shared/roles';

type Member = { id: number; role: Role };

/** What each member has earned: approved revisions they wrote and their live, unhidden fitted reports. */
export function trustRecords(db: Db, members: Member[]): Map<number, TrustRecord> {
  const ids = [...new Set(members.map((m) => m.id))];
  const records = new Map<number, TrustRecord>();
  if (ids.length === 0) return records;
  const approved = db
    .select({ userId: revisions.authorId, n: sql<number>`count(*)` })
    .from(revisions)
    .where(and(inArray(revisions.authorId, ids), inArray(revisions.status, ['approved', 'superseded'])))
    .groupBy(revisions.authorId)
    .all();
  const standing = db
    .select({ userId: fittedReports.userId, n: sql<number>`count(*)` })
    .from(fittedReports)
    .where(and(inArray(fittedReports.userId, ids), eq(fittedReports.state, 'live'), isNull(fittedReports.hiddenAt)))
    .groupBy(fittedReports.userId)
    .all();
  for (const m of members)
    records.set(m.id, {
      role: m.role,
      approvedRevisions: approved.find((a) => a.userId === m.id)?.n ?? 0,
      standingReports: standing.find((s) => s.userId === m.id)?.n ?? 0,
    });
  return records;
}

/** Trust levels of several members at once (the desk's queue, a list of reports). */
export function trustLevelsOf(db: Db, members: Member[]): Map<number, TrustLevel> {
  return new Map([...trustRecords(db, members)].map(([id, record]) => [id, trustLevel(record)]));
}

export function trustLevelOf(db: Db, member: Member): TrustLevel {
  return trustLevelsOf(db, [member]).get(member.id)!;
}
