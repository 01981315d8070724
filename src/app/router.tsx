import { useEffect } from 'react';
import { createBrowserRouter, matchRoutes, RouterProvider, type RouteObject } from 'react-router';
import { pageRoutes, type PageName } from '@shared/page-routes';
import { Shell } from './layout/shell';
import { RouteError } from './routes/route-error';
import HomePage from './routes/home';

type PageModule = () => Promise<{ default: React.ComponentType }>;

/** Route modules load on demand; each default-exports its page component. */
const page = (load: PageModule): Pick<RouteObject, 'lazy'> => ({
  lazy: async () => ({ Component: (await load()).default }),
});

// one module per page of the shared table; a page added there without one here does not compile
const pageModules: Record<Exclude<PageName, 'home'>, PageModule> = {
  search: () => import('./routes/search-route'),
  swap: () => import('./routes/swap-sheet-route'),
  swapRevision: () => import('./routes/swap-sheet-route'),
  swapCompare: () => import('../features/swaps/components/swap-compare-page'),
  chassis: () => import('./routes/chassis-route'),
  part: () => import('./routes/part-route'),
  whereElse: () => import('../features/graph/components/where-else-page'),
  openData: () => import('../features/open-data/components/open-data-page'),
  apiDocs: () => import('../features/open-data/components/api-docs-page'),
  tools: () => import('../features/calculators/components/calculators-page'),
  admin: () => import('./routes/admin'),
  adminCatalogue: () => import('./routes/admin-catalogue'),
  signIn: () => import('../features/account/components/sign-in-page'),
  signInFailed: () => import('../features/account/components/sign-in-failed-page'),
  submit: () => import('./routes/submit'),
  editSubmission: () => import('./routes/edit-submission'),
  updateSubmission: () => import('./routes/update-submission'),
  mySubmissions: () => import('./routes/my-submissions'),
  review: () => import('./routes/review-desk'),
  reportModeration: () => import('./routes/report-moderation'),
  reviewRevision: () => import('./routes/review-revision'),
  outbox: () => import('./routes/outbox'),
  myCars: () => import('./routes/my-cars-route'),
  myFollowing: () => import('./routes/my-following-route'),
  myPlans: () => import('./routes/my-plans-route'),
  plan: () => import('./routes/plan-route'),
  shop: () => import('../features/shops/components/shop-page'),
  shopLinks: () => import('./routes/shop-links-route'),
};

export const routes: RouteObject[] = [
  {
    element: <Shell />,
    // the first page's module is still loading: the frame with a loading line, not a blank page
    hydrateFallbackElement: <Shell loading />,
    errorElement: <RouteError />,
    children: [
      { path: pageRoutes.home, element: <HomePage /> },
      ...Object.entries(pageModules).map(([name, load]) => ({ path: pageRoutes[name as keyof typeof pageModules], ...page(load) })),
      { path: '*', ...page(() => import('./routes/not-found')) },
    ],
  },
];

/**
 * The browser's router. A page the server rendered is hydrated: its route modules are loaded first, so the
 * first render draws the page the HTML holds instead of the loading frame.
 */
export async function createAppRouter({ hydrating }: { hydrating: boolean }) {
  if (hydrating) {
    const lazyMatches = matchRoutes(routes, window.location)?.filter((m) => m.route.lazy) ?? [];
    await Promise.all(
      lazyMatches.map(async (m) => {
        const loaded = await (m.route.lazy as () => Promise<Partial<RouteObject>>)();
        Object.assign(m.route, { ...loaded, lazy: undefined });
      }),
    );
  }
  return createBrowserRouter(routes);
}

export function AppRouter({ router }: { router: Awaited<ReturnType<typeof createAppRouter>> }) {
  // after the first commit (hydration included) the page answers clicks: browser tests wait for this mark
  useEffect(() => {
    document.documentElement.dataset.hydrated = 'true';
  }, []);
  return <RouterProvider router={router} />;
}
