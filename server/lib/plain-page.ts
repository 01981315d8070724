// A small page the server writes itself, in the product's colours: for answers that must work at once,
// without the client (a shop link's QR code on a slow phone, an unsubscribe link opened from a mail program).

import { escapeHtml } from './html';

export function plainPage(title: string, body: string) {
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
  a.button, button.button { display: inline-block; border: 0; font: inherit; cursor: pointer; margin: 8px 12px 0 0; padding: 10px 16px; border-radius: 6px; background: #1d4d3a; color: #f7f4ec; font-weight: 700; text-decoration: none; }
  a.quiet, button.quiet { background: transparent; color: #1d4d3a; border: 1px solid rgba(29,77,58,.35); }
</style>
</head>
<body>
<header><a href="/">Swapyard</a></header>
<main><div class="card">${body}</div></main>
</body>
</html>`;
}
