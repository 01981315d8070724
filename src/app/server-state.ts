import type { DehydratedState } from '@tanstack/react-query';

/** What the server hands a page it rendered: the query cache it rendered from, dehydrated. */
export type ServerState = { queries: DehydratedState };

/** The element id of the JSON the server writes after the page's HTML (JSON, not script: the CSP runs no inline code). */
export const SERVER_STATE_ID = 'server-state';

export function readServerState(): ServerState | null {
  const el = document.getElementById(SERVER_STATE_ID);
  if (!el?.textContent) return null;
  return JSON.parse(el.textContent) as ServerState;
}
