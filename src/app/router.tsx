import { createBrowserRouter, RouterProvider, type RouteObject } from 'react-router';
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

const router = createBrowserRouter(routes);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
