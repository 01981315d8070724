import { z } from 'zod';
import { MAX_MARKDOWN_DEPTH, markdownNesting } from '../markdown-nesting';

// Text members write is shown to other people: on the desk, in e-mail subjects, on sheets. Bidi controls
// (embeddings, overrides, isolates, marks) and the other invisible format characters (Unicode category Cf:
// zero-width space, word joiner, soft hyphen, byte-order mark, tag characters…) can reverse a line or hide
// what it says, so they are removed before anything is checked or stored. The zero-width joiner and
// non-joiner stay: several scripts and emoji sequences need them, and neither can reorder text.

const invisibleFormat = /(?![\u200C\u200D])\p{Cf}|[\u3164\uFFA0]/gu;
// eslint-disable-next-line no-control-regex
const controlsButLineBreaks = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F]/g;
// eslint-disable-next-line no-control-regex
const anyLineBreakOrControl = /[\u0000-\u001F\u007F-\u009F\u2028\u2029]/g;

/** Multi-line text (write-ups, notes, reasons): invisible format characters and stray controls go; line breaks and tabs stay. */
export function neutraliseFormatting(text: string): string {
  return text.replace(invisibleFormat, '').replace(controlsButLineBreaks, '');
}

/** One line (titles, names, labels): as above, and every line break or control becomes a space. */
export function neutraliseSingleLine(text: string): string {
  return text.replace(invisibleFormat, '').replace(anyLineBreakOrControl, ' ');
}

/** A user-written single-line field; chain `.trim().min().max()` as usual (they run after the cleaning). */
export const singleLine = () => z.string().overwrite(neutraliseSingleLine);

/** A user-written multi-line field (plain text or markdown). */
export const multiLine = () => z.string().overwrite(neutraliseFormatting);

/**
 * A user-written markdown field (write-up, shop description, link note): multi-line text whose quotes and
 * lists nest no deeper than the renderer can take. Chain `.trim().max()` as usual.
 */
export const markdownText = () =>
  multiLine().superRefine((text, ctx) => {
    const { depth, line } = markdownNesting(text);
    if (depth > MAX_MARKDOWN_DEPTH)
      ctx.addIssue({
        code: 'custom',
        message: `Quotes and lists are nested too deeply: line ${line} goes ${depth.toLocaleString('en-GB')} levels deep, and at most ${MAX_MARKDOWN_DEPTH} are allowed. Flatten them.`,
      });
  });

/** neutraliseFormatting on every string inside a JSON-like value. */
export function neutraliseDeep<T>(value: T): T {
  if (typeof value === 'string') return neutraliseFormatting(value) as T;
  if (Array.isArray(value)) return value.map((v) => neutraliseDeep(v)) as T;
  if (value && typeof value === 'object') {
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, neutraliseDeep(v)])) as T;
  }
  return value;
}
