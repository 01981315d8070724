// How deeply markdown nests its containers (block quotes, list items, footnote definitions), measured
// in one pass over the lines without parsing. Parsers and renderers recurse per level: 39,000 `>` in a
// row take the markdown parser close to a minute and overflow the renderer's stack, so the depth is
// checked before any parser sees the text.

/** The most nesting a write-up, note or shop description may have (as this estimate counts it). */
export const MAX_MARKDOWN_DEPTH = 16;

export type Nesting = { depth: number; line: number };

const ordered = /^\d{1,9}[.)]/;
const footnote = /^\[\^[^\]\s]{1,40}\]:/;

/**
 * An upper bound of the deepest container nesting in `text`, and the (1-based) line where it is reached.
 * Every container a line opens has a marker on that line (`>`, `-`, `*`, `+`, `1.`, `[^x]:`), every
 * block quote it continues repeats its `>`, and every list item it continues needs at least two columns
 * of indentation, so markers + whitespace columns / 2 can never be less than the real depth. Code blocks
 * are counted like any other line: telling where one ends takes a parser, and a write-up rarely needs them
 * deeper than the limit.
 */
export function markdownNesting(text: string): Nesting {
  let deepest: Nesting = { depth: 0, line: 0 };
  let lineNo = 0;
  for (const line of text.split(/\r\n|\r|\n/)) {
    lineNo++;
    const depth = lineDepth(line);
    if (depth > deepest.depth) deepest = { depth, line: lineNo };
  }
  return deepest;
}

function lineDepth(line: string): number {
  let i = 0;
  let column = 0;
  let markers = 0;
  let whitespace = 0;
  const n = line.length;
  while (i < n) {
    const c = line[i]!;
    if (c === ' ' || c === '\t') {
      const width = c === '\t' ? 4 - (column % 4) : 1;
      whitespace += width;
      column += width;
      i++;
      continue;
    }
    if (c === '>') {
      markers++;
      i++;
      column++;
      continue;
    }
    const next = line[i + 1];
    const endsMarker = (at: number) => at >= n || line[at] === ' ' || line[at] === '\t';
    if ((c === '-' || c === '*' || c === '+') && endsMarker(i + 1)) {
      markers++;
      i++;
      column++;
      continue;
    }
    if (c >= '0' && c <= '9') {
      const m = ordered.exec(line.slice(i, i + 11));
      if (m && endsMarker(i + m[0].length)) {
        markers++;
        i += m[0].length;
        column += m[0].length;
        continue;
      }
    }
    if (c === '[' && next === '^') {
      const m = footnote.exec(line.slice(i, i + 48));
      if (m) {
        markers++;
        i += m[0].length;
        column += m[0].length;
        continue;
      }
    }
    break;
  }
  return markers + Math.floor(whitespace / 2);
}
