// The two small pages GET /l/:code answers with when it cannot redirect. They are plain server HTML, so
// a customer scanning a QR code on a slow phone sees the answer at once.

import { escapeHtml } from '../../lib/html';
import { plainPage as page } from '../../lib/plain-page';

export function unknownLinkPage(code: string) {
  return page(
    'Link not found',
    `<h1>We don’t know this link</h1>
<p>No shop link has the code <strong>${escapeHtml(code)}</strong>. Check the address (codes are short, like <code>k7mpq2x</code>) or ask the shop that gave it to you for a new one.</p>
<p><a class="button" href="/search">Find a swap</a><a class="button quiet" href="/">Swapyard home</a></p>`,
  );
}

export function retiredLinkPage(shopName: string, swap: { slug: string; title: string } | null) {
  const more = swap
    ? `<p>The swap it pointed to is still here, at its latest reviewed revision:</p>
<p><a class="button" href="/swaps/${encodeURIComponent(swap.slug)}">${escapeHtml(swap.title)}</a></p>`
    : `<p><a class="button" href="/search">Find a swap</a></p>`;
  return page(
    'Link retired',
    `<h1>${escapeHtml(shopName)} has retired this link</h1>
<p>Shops retire a link when their quote has changed or the job is done. Nothing is wrong with your phone or the address. If you still need the shop’s current quote, ask ${escapeHtml(shopName)} for a new link.</p>
${more}`,
  );
}

export function tooManyLookupsPage(message: string) {
  return page(
    'Too many lookups',
    `<h1>Too many unknown links</h1>
<p>${escapeHtml(message)}</p>
<p><a class="button" href="/search">Find a swap</a><a class="button quiet" href="/">Swapyard home</a></p>`,
  );
}
