import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { unified } from 'unified';
import remarkParse from 'remark-parse';
import remarkGfm from 'remark-gfm';
import type { Node, Parent } from 'unist';
import { MAX_MARKDOWN_DEPTH, markdownNesting } from '../../../shared/markdown-nesting';

// The estimate is checked against the parser the client renders with (remark-parse with GFM, the
// CommonMark and GFM specifications' reference behaviour for containers): it may be larger than the
// real nesting, never smaller.

const containers = new Set(['blockquote', 'listItem', 'footnoteDefinition']);

function realDepth(markdown: string): number {
  const tree = unified().use(remarkParse).use(remarkGfm).parse(markdown);
  let deepest = 0;
  const walk = (node: Node, depth: number) => {
    const d = containers.has(node.type) ? depth + 1 : depth;
    deepest = Math.max(deepest, d);
    for (const child of (node as Parent).children ?? []) walk(child, d);
  };
  walk(tree, 0);
  return deepest;
}

describe('markdown nesting estimate', () => {
  it('when containers nest in the usual ways, then the estimate is at least the real depth', () => {
    const samples = [
      '> a\n> > b\n> > > c',
      '- a\n  - b\n    - c\n      - d',
      '1. a\n   1. b\n      1. c',
      '-   a\n    -   b\n        -   c',
      '> - a\n>   - b\n>     > c',
      '- > - > - > x',
      '\t- a\n\t\t- b',
      '[^a]: note\n    [^b]: inner',
      '-\n  - b\n    -\n      - d',
    ];
    for (const s of samples) expect(markdownNesting(s).depth, s).toBeGreaterThanOrEqual(realDepth(s));
  });

  it('when random container prefixes, indentation and fences are mixed, then the estimate is never below the real depth', () => {
    const piece = fc.constantFrom(
      '>',
      '> ',
      '- ',
      '* ',
      '+ ',
      '1. ',
      '22) ',
      '[^n]: ',
      ' ',
      '  ',
      '   ',
      '\t',
      '-',
      'x',
      '```',
      '~~~~',
    );
    const line = fc.array(piece, { maxLength: 10 }).map((p) => p.join(''));
    const doc = fc.array(line, { minLength: 1, maxLength: 25 }).map((l) => l.join('\n'));
    fc.assert(
      fc.property(doc, (markdown) => markdownNesting(markdown).depth >= realDepth(markdown)),
      { numRuns: 300 },
    );
  }, 60_000);

  it('when a line holds 39,000 quote markers or 19,000 list markers, then the scan finds the depth and its line (no parser involved)', () => {
    const quotes = `intro\n\n${'>'.repeat(39_000)} x`;
    const lists = Array.from({ length: 19_000 }, () => '-').join(' ') + ' x';
    expect(markdownNesting(quotes)).toEqual({ depth: 39_000, line: 3 });
    expect(markdownNesting(lists).depth).toBeGreaterThanOrEqual(19_000);
  });

  it('when a long write-up nests lists four deep and holds a code block and a table, then it is within the limit', () => {
    const writeUp = [
      '## Fitting',
      '1. Remove the old caliper.',
      '   - Hang it from the spring, never by the hose.',
      '     - Check the hose for cracks.',
      '       > Replace it if in doubt.',
      '```',
      'torque = 85 # N·m',
      '```',
      '| Bolt | N·m |',
      '| --- | --- |',
      '| Caliper | 85 |',
    ].join('\n');
    const n = markdownNesting(writeUp);
    expect(n.depth).toBeGreaterThanOrEqual(realDepth(writeUp));
    expect(n.depth).toBeLessThanOrEqual(MAX_MARKDOWN_DEPTH);
  });
});
