import sanitizeHtml from 'sanitize-html';

const options: sanitizeHtml.IOptions = { allowedTags: [], allowedAttributes: {}, disallowedTagsMode: 'discard' };

const unescapeBasic = (s: string) =>
  s
    .replace(/&lt;/g, '<')
    .replace(/&gt;/g, '>')
    .replace(/&quot;/g, '"')
    .replace(/&amp;/g, '&');

/**
 * Removes every HTML tag (and the content of script/style elements) from free text before it is stored,
 * keeping the text. sanitize-html hands text back entity-escaped; the escapes are undone so "Lathe & Lug"
 * stays readable as plain text, and the pass repeats until nothing changes, so text that only becomes a
 * tag once unescaped (`&lt;b&gt;`) is stripped too.
 */
export function stripHtml(text: string): string {
  let current = text;
  for (let i = 0; i < 8; i++) {
    const next = unescapeBasic(sanitizeHtml(current, options));
    if (next === current) return current;
    current = next;
  }
  // pathological nesting: keep the escaped form, which can never be read as markup
  return sanitizeHtml(current, options);
}

/** stripHtml on every string inside a JSON-like value (objects, arrays), leaving other values alone. */
export function stripHtmlDeep<T>(value: T): T {
  if (typeof value === 'string') return stripHtml(value) as T;
  if (Array.isArray(value)) return value.map((v) => stripHtmlDeep(v)) as T;
  if (value && typeof value === 'object') {
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, stripHtmlDeep(v)])) as T;
  }
  return value;
}
