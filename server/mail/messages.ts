import { neutraliseSingleLine } from '../../shared/schemas/text';
import { formatDate } from '../../shared/dates';

// Builders of the messages the community loop sends. Each returns plain text and HTML; every string
// that came from a member (titles, reasons, notes, names) is HTML-escaped in the HTML part.

/**
 * `secret`: the message acts for its recipient (a sign-in link), so staff never read its body.
 * `headers`: extra headers it goes out with (List-Unsubscribe on a digest).
 */
export type BuiltMessage = { subject: string; text: string; html: string; secret?: boolean; headers?: Record<string, string> };

export function escapeHtml(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');
}

/** subjects are one line: no line breaks from user text can start a new header, no bidi control can reverse it */
const oneLine = (s: string) => neutraliseSingleLine(s).replace(/\s+/g, ' ').trim().slice(0, 140);

type Block = { text: string } | { quote: string } | { link: string; label: string };

function build(subject: string, greeting: string, blocks: Block[]): BuiltMessage {
  const text: string[] = [greeting, ''];
  const html: string[] = [`<p>${escapeHtml(greeting)}</p>`];
  for (const b of blocks) {
    if ('text' in b) {
      text.push(b.text, '');
      html.push(`<p>${escapeHtml(b.text)}</p>`);
    } else if ('quote' in b) {
      text.push(...b.quote.split('\n').map((l) => `> ${l}`), '');
      html.push(
        `<blockquote style="border-left:3px solid #b8892f;margin:0;padding-left:12px;white-space:pre-wrap">${escapeHtml(b.quote)}</blockquote>`,
      );
    } else {
      text.push(`${b.label}: ${b.link}`, '');
      html.push(`<p><a href="${escapeHtml(b.link)}">${escapeHtml(b.label)}</a></p>`);
    }
  }
  text.push('— Swapyard');
  html.push('<p style="color:#1d4d3a">— Swapyard</p>');
  return {
    subject: oneLine(subject),
    text: text.join('\n'),
    html: `<div style="font-family:sans-serif;color:#2b2b2b">${html.join('\n')}</div>`,
  };
}

type Base = { appUrl: string; name: string; title: string };
const hello = (name: string) => `Hello ${name},`;

export function submissionReceived(m: Base & { revisionId: number; number: number }): BuiltMessage {
  return build(`At the review desk: ${m.title}`, hello(m.name), [
    {
      text: `Thank you — your ${m.number > 1 ? `revision ${m.number} of “${m.title}”` : `swap “${m.title}”`} is now at the review desk. A moderator will look at it, usually within a few days; it stays locked while it is at the desk.`,
    },
    { link: `${m.appUrl}/me/submissions`, label: 'Your submissions' },
  ]);
}

export function submissionApproved(m: Base & { slug: string; number: number; note: string }): BuiltMessage {
  return build(`Published: ${m.title}`, hello(m.name), [
    {
      text: `Your ${m.number > 1 ? `revision ${m.number} of “${m.title}”` : `swap “${m.title}”`} passed the review desk and is now published and searchable.`,
    },
    ...(m.note ? [{ text: 'The moderator noted:' }, { quote: m.note }] : []),
    { link: `${m.appUrl}/swaps/${m.slug}`, label: 'Open the swap sheet' },
  ]);
}

export function submissionSentBack(m: Base & { revisionId: number; reasons: string }): BuiltMessage {
  return build(`Back for rework: ${m.title}`, hello(m.name), [
    { text: `A moderator looked at “${m.title}” and sends it back for rework before it can be published:` },
    { quote: m.reasons },
    { text: 'Edit the submission and send it again; nothing you entered was lost.' },
    { link: `${m.appUrl}/submissions/${m.revisionId}/edit`, label: 'Edit the submission' },
  ]);
}

/** `removed`: the submission proposed a new chassis, and it was removed with that chassis. */
export function submissionDeclined(m: Base & { reasons: string; removed?: boolean }): BuiltMessage {
  return build(`Not published: ${m.title}`, hello(m.name), [
    { text: `A moderator decided not to publish “${m.title}”, for this reason:` },
    { quote: m.reasons },
    ...(m.removed
      ? [
          {
            text: 'It proposed a new chassis, so the submission and the proposed chassis were removed; this message is the record of it. You can start again on a chassis from the catalogue.',
          },
        ]
      : []),
    { link: `${m.appUrl}/me/submissions`, label: 'Your submissions' },
  ]);
}

export function correctionApproved(m: Base & { slug: string; number: number; correctedBy: string }): BuiltMessage {
  return build(`Your swap was updated: ${m.title}`, hello(m.name), [
    {
      text: `${m.correctedBy} proposed a correction to your swap “${m.title}”. It passed the review desk and is published as revision ${m.number}; the earlier revisions stay readable in the swap's history.`,
    },
    { link: `${m.appUrl}/swaps/${m.slug}`, label: 'See the swap sheet' },
  ]);
}

/** Several flags of one member resolved at once: one message, not one per flag. */
/**
 * What became of a member's flags: one message for every outcome since their last one, so a member who
 * flagged many sheets hears at most once a day.
 */
export function flagOutcomes(m: {
  appUrl: string;
  name: string;
  flags: { title: string; slug: string; reason: string; outcome: string; note: string }[];
}): BuiltMessage {
  const excerpt = (r: string) => (r.length > 200 ? `${r.slice(0, 200)}…` : r);
  const [only] = m.flags;
  const subject =
    m.flags.length === 1 && only ? `Your flag on “${only.title}”: ${only.outcome}` : `What became of ${m.flags.length} of your flags`;
  return build(subject, hello(m.name), [
    {
      text:
        m.flags.length === 1
          ? 'A moderator looked at the sheet you flagged. Thank you for taking the time.'
          : `Moderators looked at ${m.flags.length} sheets you flagged. Thank you for taking the time.`,
    },
    ...m.flags.flatMap((f): Block[] => [
      { text: `“${f.title}” — ${f.outcome}. ${m.appUrl}/swaps/${f.slug}` },
      { quote: excerpt(f.reason) },
      ...(f.note ? [{ text: `The moderator’s note: ${f.note}` }] : []),
    ]),
  ]);
}

/** The one-time sign-in link. It says what to do if nobody here asked for it. */
export function emailSignInLink(m: { link: string; minutes: number; known: boolean }): BuiltMessage {
  const message = build('Your Swapyard sign-in link', 'Hello,', [
    {
      text: m.known
        ? 'Someone asked to sign in to Swapyard with this address. If it was you, open the link below.'
        : 'Someone asked to sign in to Swapyard with this address. If it was you, open the link below: it makes your member account on the way in.',
    },
    { link: m.link, label: 'Sign in to Swapyard' },
    {
      text: `The link works once, for ${m.minutes} minutes, in any browser. If you did not ask for it, ignore this message: nothing happens without the link.`,
    },
  ]);
  return { ...message, secret: true };
}

const longDate = (d: Date) => formatDate(d, { long: true, timeZone: 'UTC' });

/** An untouched draft is about to be removed; the member can keep it. */
export function draftExpiring(m: Base & { revisionId: number; lastChanged: Date; removeOn: Date; photos: number }): BuiltMessage {
  return build(`Your draft will be removed: ${m.title}`, hello(m.name), [
    {
      text: `Your draft “${m.title}” has not changed since ${longDate(m.lastChanged)}. Drafts nobody works on are removed after a while${m.photos ? `, with their photos (this one has ${m.photos})` : ''}, so they do not take up space for good.`,
    },
    {
      text: `It will be removed on ${longDate(m.removeOn)} unless you keep it: open it and choose “Keep this draft”, or save any change.`,
    },
    { link: `${m.appUrl}/submissions/${m.revisionId}/edit`, label: 'Open the draft' },
  ]);
}

/** one swap in a follow digest */
export type DigestSwap = { slug: string; title: string; axle: 'front' | 'rear'; revisionNumber: number; isNew: boolean };

/**
 * The digest of what was published for something a member follows. It carries List-Unsubscribe with
 * List-Unsubscribe-Post (RFC 8058), so a mail program can stop it in one step without a sign-in.
 */
export function followDigest(m: {
  appUrl: string;
  name: string;
  followed: { kind: 'chassis'; chassis: string; slug: string } | { kind: 'car'; nickname: string; chassis: string };
  frequency: 'daily' | 'weekly';
  swaps: DigestSwap[];
  unsubscribeUrl: string;
}): BuiltMessage {
  const what =
    m.followed.kind === 'car' ? `your car “${m.followed.nickname}” (${m.followed.chassis})` : `the ${m.followed.chassis}`;
  const count = m.swaps.length === 1 ? 'a swap' : `${m.swaps.length} swaps`;
  const period = m.frequency === 'daily' ? 'day' : 'week';
  const message = build(
    m.followed.kind === 'car'
      ? `For your ${m.followed.nickname}: ${count} published`
      : `New for the ${m.followed.chassis}: ${count} published`,
    hello(m.name),
    [
      { text: `Since your last digest, the review desk published ${count} for ${what}:` },
      ...m.swaps.map((s): Block => ({
        link: `${m.appUrl}/swaps/${s.slug}`,
        label: `${s.title} (${s.axle} axle) — ${s.isNew ? 'new swap' : `updated to revision ${s.revisionNumber}`}`,
      })),
      {
        text: 'Check each sheet against your own car before buying parts: torque every fastener to spec, bleed and bed in the brakes, and have a qualified person inspect brake and wheel work.',
      },
      { text: `You get this once a ${period} when something is published. Change it or stop following on your following page.` },
      { link: `${m.appUrl}/me/following`, label: 'What you follow' },
      { link: m.unsubscribeUrl, label: 'Stop these e-mails' },
    ],
  );
  return {
    ...message,
    headers: { 'List-Unsubscribe': `<${m.unsubscribeUrl}>`, 'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click' },
  };
}
