import { describe, expect, it } from 'vitest';
import { neutraliseFormatting, neutraliseSingleLine, singleLine } from '../../../shared/schemas/text';
import { submissionReceived } from '../../../server/mail/messages';

// The characters named here are from the Unicode Standard: the bidi controls of UAX #9 (Unicode
// Bidirectional Algorithm, §2.1–2.6: LRE, RLE, PDF, LRO, RLO, LRI, RLI, FSI, PDI, LRM, RLM, ALM) and
// other members of General_Category Cf (format) that render as nothing.
const bidiControls = [0x202a, 0x202b, 0x202c, 0x202d, 0x202e, 0x2066, 0x2067, 0x2068, 0x2069, 0x200e, 0x200f, 0x061c];
const otherInvisible = [0x200b, 0x2060, 0xfeff, 0x00ad, 0x180e, 0x2061, 0x206a, 0xfff9, 0xe0001, 0xe0041, 0xe007f];

describe('neutralising invisible formatting', () => {
  it('when a line holds any bidi control or invisible format character, then each is removed', () => {
    for (const cp of [...bidiControls, ...otherInvisible]) {
      const ch = String.fromCodePoint(cp);
      expect(neutraliseSingleLine(`a${ch}b`), `U+${cp.toString(16)}`).toBe('ab');
      expect(neutraliseFormatting(`a${ch}b`), `U+${cp.toString(16)}`).toBe('ab');
    }
  });

  it('when text uses joiners, right-to-left scripts or emoji sequences, then it is kept as written', () => {
    const kept = ['עברית', 'العربية', 'क्‍ष', 'می‌خواهم', '👩‍🔧', 'Lathe & Lug'];
    for (const s of kept) expect(neutraliseSingleLine(s)).toBe(s);
  });

  it('when a single line has line breaks or control characters, then they become spaces; multi-line text keeps its breaks', () => {
    expect(neutraliseSingleLine('one\ntwo\r\nthree\u2028four\u0007five')).toBe('one two  three four five');
    expect(neutraliseFormatting('one\ntwo\r\n\tthree\u0007')).toBe('one\ntwo\r\n\tthree');
  });

  it('when the zod helper checks a length, then it counts what is left after cleaning', () => {
    const schema = singleLine().trim().min(2).max(5);
    expect(schema.parse(' \u202Eab\u2069 ')).toBe('ab');
    expect(schema.safeParse('\u202E\u202E\u202Ea').success).toBe(false);
  });

  it('when a stored title still carries an override, then the e-mail subject does not', () => {
    const built = submissionReceived({
      appUrl: 'http://x',
      name: 'Rosa',
      title: '\u202EVela\u2066 swap',
      revisionId: 1,
      number: 1,
    });
    expect(built.subject).toBe('At the review desk: Vela swap');
  });
});
