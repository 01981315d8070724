/// <reference lib="webworker" />
import { unified } from 'unified';
import remarkParse from 'remark-parse';
import remarkGfm from 'remark-gfm';

// Parses markdown off the page's thread, with the same parser and extensions the renderer uses, and
// answers when done. The page gives it a time budget and stops it if the budget runs out, so text that
// would take the parser seconds or minutes never freezes the page.

const parser = unified().use(remarkParse).use(remarkGfm);

self.onmessage = (e: MessageEvent<{ text: string }>) => {
  parser.parse(e.data.text);
  self.postMessage('parsed');
};
