// Numbers as people type them: a decimal point or a decimal comma ("38,1"), lists separated by
// semicolons, spaces or a comma followed by a space. Every input that takes a number reads it here.

/** a typographic minus ("−5", as the app writes it and some keyboards type it) or a dash reads as a minus sign */
const signText = (t: string) => t.replace(/^[\u2212\u2013]/, '-');

/** '' → undefined; "12,5" → 12.5; anything unreadable → NaN, so the caller names the field */
export function readNumber(text: string): number | undefined {
  const t = signText(text.trim()).replace(',', '.');
  if (t === '') return undefined;
  return Number(t);
}

/** the items of a typed list: a comma between two digits is a decimal comma, never a separator */
export const listItems = (text: string): string[] =>
  text
    .split(/;|\s+|,(?=\s|$)/)
    .map((p) => p.trim())
    .filter(Boolean);

/** "40; 44", "40 44" or "40, 44" → [40, 44]; "38,1; 42" → [38.1, 42] */
export function numberList(text: string): number[] {
  return listItems(text).map((p) => Number(signText(p).replace(',', '.')));
}

/**
 * The keyboard a number field asks a phone for. Common phones' decimal keypads have no minus key, so a field that
 * may be negative (an offset, an inset, a point of a profile) asks for the full keyboard instead; every number
 * field takes its `inputMode` from here.
 */
export function numberKeyboard(signed = false) {
  return signed
    ? ({ inputMode: 'text', autoCapitalize: 'off', autoCorrect: 'off', spellCheck: false } as const)
    : ({ inputMode: 'decimal' } as const);
}
