import crypto from 'node:crypto';
import { and, count, eq, gte, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { emailSignInTokens, users } from '../db/schema/users';
import type { Clock } from '../lib/clock';
import type { Mailer } from '../mail/mailer';
import { emailSignInLink } from '../mail/messages';
import { freeLogin, loadSessionUser, type SignInResult } from './sign-in.service';

// Sign-in for people without an account at the OAuth provider: a one-time link by e-mail, through
// the outbox like every other message. The answer to a request never says whether the address is
// known, and only a hash of each token is stored.

export const EMAIL_LINK_MINUTES = 15;
/** links asked for one address per hour; beyond it requests are dropped without telling the asker */
export const EMAIL_LINKS_PER_ADDRESS_PER_HOUR = 5;

export const normaliseEmail = (email: string) => email.trim().toLowerCase();
const hashOf = (token: string) => crypto.createHash('sha256').update(token).digest('hex');

function accountFor(db: Db, email: string) {
  return db
    .select()
    .from(users)
    .where(sql`lower(${users.email}) = ${email}`)
    .orderBy(users.id)
    .get();
}

export type EmailLinkRequest = { email: string; returnTo: string | null };
type Deps = { db: Db; mailer: Mailer; clock: Clock; appUrl: string };

/** Writes the token and its message in one transaction; returns false when the address's hourly allowance is spent. */
export function requestEmailLink({ db, mailer, clock, appUrl }: Deps, input: EmailLinkRequest): boolean {
  const email = normaliseEmail(input.email);
  const now = clock.now();
  return db.transaction((tx) => {
    const recent = tx
      .select({ n: count() })
      .from(emailSignInTokens)
      .where(and(eq(emailSignInTokens.email, email), gte(emailSignInTokens.createdAt, new Date(now.getTime() - 3_600_000))))
      .get()!.n;
    if (recent >= EMAIL_LINKS_PER_ADDRESS_PER_HOUR) return false;
    const token = crypto.randomBytes(32).toString('base64url');
    tx.insert(emailSignInTokens)
      .values({
        tokenHash: hashOf(token),
        email,
        returnTo: input.returnTo,
        createdAt: now,
        expiresAt: new Date(now.getTime() + EMAIL_LINK_MINUTES * 60_000),
      })
      .run();
    const account = accountFor(db, email);
    const link = `${appUrl}/auth/email/callback?token=${token}`;
    mailer.queue(tx, { id: account?.id ?? null, email }, emailSignInLink({ link, minutes: EMAIL_LINK_MINUTES, known: Boolean(account) }));
    return true;
  });
}

/** A login for an account made from an address: its local part, tidied to the characters logins use. */
function loginFrom(email: string): string {
  const local = email.split('@')[0].replace(/[^a-z0-9_-]+/g, '-').replace(/^-+|-+$/g, '');
  return (local || 'member').slice(0, 32);
}

export type EmailSignInResult = (SignInResult & { returnTo?: string | null }) | { ok: false; reason: 'link' };

/**
 * Uses a link: a token that is unknown, used or past its time signs nobody in. The account with that
 * address signs in (whichever provider made it); an unknown address becomes a new member.
 */
export function redeemEmailLink(db: Db, clock: Clock, token: string): EmailSignInResult {
  const now = clock.now();
  return db.transaction((tx) => {
    const row = tx.select().from(emailSignInTokens).where(eq(emailSignInTokens.tokenHash, hashOf(token))).get();
    if (!row || row.usedAt || row.expiresAt <= now) return { ok: false as const, reason: 'link' as const };
    tx.update(emailSignInTokens).set({ usedAt: now }).where(eq(emailSignInTokens.id, row.id)).run();
    const existing = accountFor(db, row.email);
    if (existing?.suspendedAt) return { ok: false as const, reason: 'suspended' as const, userId: existing.id };
    if (existing) {
      tx.update(users).set({ lastSignInAt: now, updatedAt: now }).where(eq(users.id, existing.id)).run();
      return { ok: true as const, user: loadSessionUser(db, existing.id)!, created: false, returnTo: row.returnTo };
    }
    const login = freeLogin(db, loginFrom(row.email), null);
    const inserted = tx
      .insert(users)
      .values({
        provider: 'email',
        providerId: row.email,
        login,
        name: login,
        email: row.email,
        role: 'member',
        lastSignInAt: now,
        createdAt: now,
        updatedAt: now,
      })
      .returning({ id: users.id })
      .get();
    return { ok: true as const, user: loadSessionUser(db, inserted.id)!, created: true, returnTo: row.returnTo };
  });
}
