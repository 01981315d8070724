// What an unsubscribe link answers with. Plain server HTML: it must work from any mail program, signed
// in or not, and a GET never changes anything (mail scanners open links to check them).

import { escapeHtml } from '../../lib/html';
import { plainPage } from '../../lib/plain-page';

export const ONE_CLICK_FIELD = 'List-Unsubscribe';
export const ONE_CLICK_VALUE = 'One-Click';

export function confirmUnsubscribePage(what: string, frequency: string) {
  return plainPage(
    'Stop these e-mails?',
    `<h1>Stop e-mails about ${escapeHtml(what)}?</h1>
<p>You get a digest ${escapeHtml(frequency)} when swaps are published for ${escapeHtml(what)}. Stopping it ends this follow; nothing else about your account changes.</p>
<form method="post">
<input type="hidden" name="${ONE_CLICK_FIELD}" value="${ONE_CLICK_VALUE}">
<button class="button" type="submit">Stop these e-mails</button>
<a class="button quiet" href="/me/following">Manage what I follow</a>
</form>`,
  );
}

export function unsubscribedPage(what: string | null) {
  return plainPage(
    'E-mails stopped',
    `<h1>Done — no more digests${what ? ` about ${escapeHtml(what)}` : ''}</h1>
<p>You no longer follow ${what ? escapeHtml(what) : 'this'}. You can follow it again from its page whenever you like.</p>
<p><a class="button" href="/me/following">What I follow</a><a class="button quiet" href="/">Swapyard home</a></p>`,
  );
}

export function nothingToStopPage() {
  return plainPage(
    'Already stopped',
    `<h1>These e-mails are already stopped</h1>
<p>This follow has ended, so there is nothing more to stop.</p>
<p><a class="button" href="/me/following">What I follow</a><a class="button quiet" href="/">Swapyard home</a></p>`,
  );
}

export function invalidUnsubscribePage() {
  return plainPage(
    'Link not valid',
    `<h1>We don’t recognise this link</h1>
<p>The address may have been cut short by your mail program. Open the link from the e-mail again, or manage what you follow after signing in.</p>
<p><a class="button" href="/me/following">What I follow</a></p>`,
  );
}

export function badUnsubscribeRequestPage() {
  return plainPage(
    'Nothing was changed',
    `<h1>Nothing was changed</h1>
<p>Use the button on the confirmation page to stop these e-mails.</p>`,
  );
}
