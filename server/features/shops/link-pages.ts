// The two small pages GET /l/:code answers with when it cannot redirect. They are plain server HTML, so
// a customer scanning a QR code on a slow phone sees the answer at once.

import { escapeHtml } from '../../lib/html';

function page(title: string, body: string) {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex">
<title>${escapeHtml(title)} · Swapyard</title>
<style>
  body { margin: 0; font-family: "Nunito Sans", system-ui, sans-serif; background: #f7f4ec; color: #2b2f2c; }
  header { background: #1d4d3a; color: #f7f4ec; padding: 14px 20px; font-weight: 800; font-size: 18px; }
  header a { color: inherit; text-decoration: none; }
  main { max-width: 560px; margin: 0 auto; padding: 40px 20px; }
  h1 { color: #1d4d3a; font-size: 26px; line-height: 1.25; margin: 0 0 12px; }
  p { font-size: 17px; line-height: 1.55; }
  .card { background: #fffdf7; border: 1px solid rgba(29,77,58,.15); border-left: 4px solid #b8892f; border-radius: 10px; padding: 20px 22px; }
  a.button { display: inline-block; margin: 8px 12px 0 0; padding: 10px 16px; border-radius: 6px; background: #1d4d3a; color: #f7f4ec; font-weight: 700; text-decoration: none; }
  a.quiet { background: transparent; color: #1d4d3a; border: 1px solid rgba(29,77,58,.35); }
</style>
</head>
<body>
<header><a href="/">Swapyard</a></header>
<main><div class="card">${body}</div></main>
</body>
</html>`;
}

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
