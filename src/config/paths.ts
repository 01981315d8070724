/** Every client route in one place; links are built with these, never typed inline. */
export const paths = {
  home: () => '/',
  search: (query = '') => (query ? `/search?${query}` : '/search'),
  swap: (slug: string) => `/swaps/${slug}`,
  swapRevision: (slug: string, n: number) => `/swaps/${slug}/r/${n}`,
  swapCompare: (slug: string, a: number, b: number) => `/swaps/${slug}/compare?a=${a}&b=${b}`,
  chassis: (slug: string) => `/chassis/${slug}`,
  part: (id: number) => `/parts/${id}`,
  whereElse: (number = '') => (number ? `/where-else?number=${encodeURIComponent(number)}` : '/where-else'),
  openData: () => '/open-data',
  apiDocs: () => '/api-docs',
  tools: () => '/tools',
  submit: () => '/submit',
  editSubmission: (id: number) => `/submissions/${id}/edit`,
  /** a correction behind the swap's current revision, merged with it */
  updateSubmission: (id: number) => `/submissions/${id}/update`,
  mySubmissions: () => '/me/submissions',
  myCars: () => '/me/cars',
  review: () => '/review',
  reviewRevision: (id: number) => `/review/${id}`,
  shop: (slug: string) => `/shops/${slug}`,
  shopLinks: () => '/shop/links',
  outbox: () => '/outbox',
  admin: () => '/admin',
  /** the page offering both ways in */
  signIn: (returnTo: string) => `/signin?returnTo=${encodeURIComponent(returnTo)}`,
  providerSignIn: (returnTo: string) => `/auth/github?returnTo=${encodeURIComponent(returnTo)}`,
} as const;
