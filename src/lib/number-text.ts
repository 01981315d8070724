// Numbers as people type them: a decimal point or a decimal comma ("38,1"), lists separated by
// semicolons, spaces or a comma followed by a space. Every input that takes a number reads it here.

/** '' → undefined; "12,5" → 12.5; anything unreadable → NaN, so the caller names the field */
export function readNumber(text: string): number | undefined {
  const t = text.trim().replace(',', '.');
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
  return listItems(text).map((p) => Number(p.replace(',', '.')));
}
