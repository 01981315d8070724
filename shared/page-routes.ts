import { matchPath } from 'react-router';

/**
 * Every page of the client, by name. The browser's router is built from this table, and the server
 * reads it to answer an address outside it with 404 (and, later, to render pages itself), so a page
 * added here is known to both at once.
 */
export const pageRoutes = {
  home: '/',
  search: '/search',
  swap: '/swaps/:slug',
  swapRevision: '/swaps/:slug/r/:n',
  swapCompare: '/swaps/:slug/compare',
  chassis: '/chassis/:slug',
  part: '/parts/:id',
  whereElse: '/where-else',
  openData: '/open-data',
  apiDocs: '/api-docs',
  tools: '/tools',
  admin: '/admin',
  adminCatalogue: '/admin/catalogue',
  signIn: '/signin',
  signInFailed: '/signin-failed',
  submit: '/submit',
  editSubmission: '/submissions/:id/edit',
  updateSubmission: '/submissions/:id/update',
  mySubmissions: '/me/submissions',
  review: '/review',
  // before the revision page: /review/:revisionId would take it
  reportModeration: '/review/reports',
  reviewRevision: '/review/:revisionId',
  outbox: '/outbox',
  myCars: '/me/cars',
  myFollowing: '/me/following',
  myPlans: '/me/plans',
  plan: '/plans/:id',
  shop: '/shops/:slug',
  shopLinks: '/shop/links',
} as const;

export type PageName = keyof typeof pageRoutes;

export type PageMatch = { name: PageName; params: Record<string, string | undefined> };

const names = Object.keys(pageRoutes) as PageName[];

/** The page an address opens (matched the way the browser's router matches it), or null when there is none. */
export function matchPage(pathname: string): PageMatch | null {
  for (const name of names) {
    const m = matchPath({ path: pageRoutes[name], end: true }, pathname);
    if (m) return { name, params: m.params };
  }
  return null;
}
