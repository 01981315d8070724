import { createBrowserRouter, RouterProvider, type RouteObject } from 'react-router';
import { Shell } from './layout/shell';
import { RouteError } from './routes/route-error';
import HomePage from './routes/home';

/** Route modules load on demand; each default-exports its page component. */
const page = (load: () => Promise<{ default: React.ComponentType }>): Pick<RouteObject, 'lazy'> => ({
  lazy: async () => ({ Component: (await load()).default }),
});

export const routes: RouteObject[] = [
  {
    element: <Shell />,
    errorElement: <RouteError />,
    children: [
      { index: true, element: <HomePage /> },
      { path: 'search', ...page(() => import('./routes/search-route')) },
      { path: 'swaps/:slug', ...page(() => import('./routes/swap-sheet-route')) },
      { path: 'swaps/:slug/r/:n', ...page(() => import('./routes/swap-sheet-route')) },
      { path: 'swaps/:slug/compare', ...page(() => import('../features/swaps/components/swap-compare-page')) },
      { path: 'chassis/:slug', ...page(() => import('./routes/chassis-route')) },
      { path: 'parts/:id', ...page(() => import('./routes/part-route')) },
      { path: 'where-else', ...page(() => import('../features/graph/components/where-else-page')) },
      { path: 'tools', ...page(() => import('../features/calculators/components/calculators-page')) },
      { path: 'admin', ...page(() => import('./routes/admin')) },
      { path: 'signin', ...page(() => import('../features/account/components/sign-in-page')) },
      { path: 'signin-failed', ...page(() => import('../features/account/components/sign-in-failed-page')) },
      { path: 'submit', ...page(() => import('./routes/submit')) },
      { path: 'submissions/:id/edit', ...page(() => import('./routes/edit-submission')) },
      { path: 'me/submissions', ...page(() => import('./routes/my-submissions')) },
      { path: 'review', ...page(() => import('./routes/review-desk')) },
      { path: 'review/:revisionId', ...page(() => import('./routes/review-revision')) },
      { path: 'outbox', ...page(() => import('./routes/outbox')) },
      { path: 'me/cars', ...page(() => import('./routes/my-cars-route')) },
      { path: 'shops/:slug', ...page(() => import('../features/shops/components/shop-page')) },
      { path: 'shop/links', ...page(() => import('./routes/shop-links-route')) },
      { path: '*', ...page(() => import('./routes/not-found')) },
    ],
  },
];

const router = createBrowserRouter(routes);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
