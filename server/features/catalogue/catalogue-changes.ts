import { and, desc, eq } from 'drizzle-orm';
import { alias } from 'drizzle-orm/sqlite-core';
import type { Db } from '../../db/client';
import { catalogueChanges, users } from '../../db/schema/index';
import { chassisLabel } from '../../../shared/chassis-label';
import type { CatalogueAction, CatalogueChange, CatalogueSubject } from '../../../shared/schemas/catalogue-admin';

export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

export type ChangeRow = {
  subject: CatalogueSubject;
  subjectId: number;
  subjectLabel: string;
  action: CatalogueAction;
  field?: string | null;
  from?: string | null;
  to?: string | null;
};

/** A part as an admin tells it apart from its duplicates: kind, name, maker and numbers. */
export const partLabel = (p: { id: number; name: string; maker: string; partNumbers: string[] }) =>
  `#${p.id} ${p.name}${p.maker ? ` · ${p.maker}` : ''}${p.partNumbers.length ? ` · ${p.partNumbers.join(', ')}` : ''}`;

export const chassisRecordLabel = (c: Parameters<typeof chassisLabel>[0] & { id: number }) => `#${c.id} ${chassisLabel(c)}`;

/** A stored value as the record shows it: lists joined, nothing for null. */
export const changeValue = (v: unknown): string | null =>
  v === null || v === undefined ? null : Array.isArray(v) ? v.join(', ') : String(v);

/** Writes who changed what in the same transaction as the change (the pattern of `user_changes`). */
export function recordChanges(tx: Tx, actorId: number, at: Date, rows: ChangeRow[]) {
  if (rows.length === 0) return;
  tx.insert(catalogueChanges)
    .values(
      rows.map((r) => ({
        subject: r.subject,
        subjectId: r.subjectId,
        subjectLabel: r.subjectLabel,
        actorId,
        action: r.action,
        field: r.field ?? null,
        fromValue: r.from ?? null,
        toValue: r.to ?? null,
        at,
      })),
    )
    .run();
}

const recentLimit = 100;

/** The newest changes, of one record when a subject and id are given. */
export function listCatalogueChanges(db: Db, of?: { subject: CatalogueSubject; id: number }): CatalogueChange[] {
  const actor = alias(users, 'actor');
  return db
    .select({
      id: catalogueChanges.id,
      subject: catalogueChanges.subject,
      subjectId: catalogueChanges.subjectId,
      subjectLabel: catalogueChanges.subjectLabel,
      action: catalogueChanges.action,
      field: catalogueChanges.field,
      from: catalogueChanges.fromValue,
      to: catalogueChanges.toValue,
      at: catalogueChanges.at,
      actorLogin: actor.login,
      actorName: actor.name,
    })
    .from(catalogueChanges)
    .leftJoin(actor, eq(actor.id, catalogueChanges.actorId))
    .where(of ? and(eq(catalogueChanges.subject, of.subject), eq(catalogueChanges.subjectId, of.id)) : undefined)
    .orderBy(desc(catalogueChanges.at), desc(catalogueChanges.id))
    .limit(recentLimit)
    .all()
    .map(({ actorLogin, actorName, at, ...c }) => ({
      ...c,
      at: at.toISOString(),
      actor: actorLogin !== null ? { login: actorLogin, name: actorName || actorLogin } : null,
    }));
}
