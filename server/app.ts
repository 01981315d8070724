import express, { type RequestHandler } from 'express';
import helmet from 'helmet';
import compression from 'compression';
import { pinoHttp } from 'pino-http';
import type { Db } from './db/client';
import type { Mailer } from './mail/mailer';
import type { Storage } from './storage/disk-storage';
import type { Clock } from './lib/clock';
import type { Config } from './config';
import { httpLogSerializers, type Logger } from './lib/logger';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { healthRouter } from './features/health/health.router';
import { SqliteSessionStore, sessionCookie, sessionMiddleware } from './auth/session-store';
import { createPassport } from './auth/passport';
import { authRateLimit, authRouter } from './auth/auth.router';
import { fakeAuthorizeRouter, startFakeProvider } from './auth/fake-provider';
import { refuseCrossSite, requireCsrfToken } from './middleware/csrf';
import { defaultCacheControl, noCookieOnSharedAnswers } from './middleware/shared-cache';
import { meRouter } from './features/me/me.router';
import { adminRouter } from './features/admin/admin.router';
import { swapPagesRouter, swapsRouter } from './features/swaps/swaps.router';
import { catalogueAdminRouter } from './features/catalogue/catalogue-admin.router';
import { cataloguePagesRouter, catalogueRouter } from './features/catalogue/catalogue.router';
import { mediaRouter } from './features/photos/media.router';
import { searchIndexRouter } from './features/search-index/search-index.router';
import { submissionsRouter } from './features/submissions/submissions.router';
import { reviewRouter } from './features/review/review.router';
import { flagsRouter } from './features/flags/flags.router';
import { takedownsRouter } from './features/takedowns/takedowns.router';
import { outboxRouter } from './features/outbox/outbox.router';
import { fittedReportsRouter } from './features/fitted-reports/fitted-reports.router';
import { carsRouter } from './features/cars/cars.router';
import { plansRouter } from './features/plans/plans.router';
import { shopLinkRedirectRouter, shopPagesRouter, shopsRouter } from './features/shops/shops.router';
import { followingRouter, unsubscribeRouter } from './features/following/following.router';
import { graphRouter } from './features/graph/graph.router';
import { exportRouter } from './features/export/export.router';
import { openApiRouter } from './features/openapi/openapi.router';
import { pageHeadsRouter, shareRouter } from './features/share/share.router';
import { serviceWorkerSwitch } from './features/offline/service-worker-switch';

export type AppDeps = {
  db: Db;
  mailer: Mailer;
  storage: Storage;
  clock: Clock;
  config: Config;
  logger: Logger;
  /** serves the client: Vite middleware in development, the built files in production; absent in API tests */
  client?: RequestHandler[];
};

export function createApp(deps: AppDeps) {
  const { config, logger } = deps;
  const app = express();
  app.disable('x-powered-by');
  // ETags over the exact bytes, so a cache in front may use them for ranges and as validators of anything
  app.set('etag', 'strong');
  app.set('trust proxy', 'loopback');
  // read by `validated` handlers, which retry while another process holds the database
  app.locals.dbBusyWaitMs = config.dbBusyWaitMs;

  app.use(
    pinoHttp({
      logger,
      autoLogging: { ignore: (req) => !req.url?.startsWith('/api') && !req.url?.startsWith('/auth') },
      // a member's id on the line that reports their request; nothing to bind for a visitor (nor before
      // sign-in is read), which spares every anonymous request a child logger
      customProps: (req) => signedInAs(req as express.Request) as object,
      serializers: httpLogSerializers,
    }),
  );
  app.use(helmet({ contentSecurityPolicy: { directives: contentSecurityPolicy(config) } }));
  // Sheets read the same for every reader and are stored compressed: they are answered here, before
  // compression, body parsing and sessions, so the most-read answer costs none of that work.
  app.use('/api', swapsRouter(deps));
  app.use(compression());
  app.use(express.json({ limit: '256kb' }));
  // answers depend on the reader unless a route says otherwise; sign-in pages are never stored
  app.use('/api', defaultCacheControl('private, no-cache'));
  app.use('/auth', defaultCacheControl('no-store'));
  app.use(noCookieOnSharedAnswers);
  app.use('/api', healthRouter());

  // --- sessions, sign-in, CSRF ---
  const sessionStore = new SqliteSessionStore(deps.db, deps.clock);
  const endSessions = (userId: number) => sessionStore.destroyAllFor(userId);
  const withSession = sessionMiddleware({ store: sessionStore, secret: config.sessionSecret, appUrl: config.appUrl });
  const passport = createPassport({ db: deps.db, clock: deps.clock, config });
  app.use(passport.initialize());
  const restoreUser = passport.session();
  const cookieName = sessionCookie(config.appUrl).name;
  // No session for a visitor until sign-in starts one: a request without the cookie has none to
  // restore, and making one would write a row per anonymous visit. Hashed assets never need one.
  const needsSession = (req: express.Request) =>
    !req.path.startsWith('/assets/') &&
    (req.path.startsWith('/auth/') || Boolean(req.headers.cookie?.includes(`${cookieName}=`)));
  app.use((req, res, next) => (needsSession(req) ? withSession(req, res, () => restoreUser(req, res, next)) : next()));
  app.use(refuseCrossSite);
  app.use('/api', requireCsrfToken);
  app.use('/auth', authRateLimit(config.auth.rateLimit));
  if (config.auth.mode === 'fake') {
    startFakeProvider();
    app.use('/auth/fake', fakeAuthorizeRouter({ db: deps.db, config }));
  }
  app.use(
    '/auth',
    authRouter({ passport, appUrl: config.appUrl, endSessions, db: deps.db, mailer: deps.mailer, clock: deps.clock }),
  );

  // --- feature routers ---
  app.use('/api', meRouter(deps));
  app.use('/api', catalogueAdminRouter(deps));
  app.use('/api', adminRouter({ db: deps.db, clock: deps.clock, endSessions }));
  app.use('/api', catalogueRouter(deps));
  app.use('/api', searchIndexRouter(deps));
  app.use('/api', submissionsRouter(deps));
  // before the review router, whose /review/:revisionId would read "takedowns" as a revision id
  app.use('/api', takedownsRouter(deps));
  // before the review router: its /review/:revisionId would take /review/flags
  app.use('/api', flagsRouter(deps));
  app.use('/api', reviewRouter(deps));
  app.use('/api', outboxRouter(deps));
  app.use('/api', fittedReportsRouter(deps));
  app.use('/api', carsRouter(deps));
  app.use('/api', followingRouter(deps));
  app.use('/api', plansRouter(deps));
  app.use('/api', shopsRouter(deps));
  app.use('/api', graphRouter(deps));
  app.use('/api', exportRouter(deps));
  app.use('/api', openApiRouter(deps));

  app.use(mediaRouter(deps));
  app.use(shopLinkRedirectRouter(deps));
  app.use(unsubscribeRouter(deps));
  // the daily open-data dumps (npm run export:dump), for mirrors; a file is only ever renamed into place whole
  app.use(
    '/dumps',
    express.static(config.dumpDir, {
      index: false,
      dotfiles: 'ignore',
      setHeaders: (res) => res.set('Cache-Control', 'public, max-age=3600'),
    }),
  );
  app.use(shareRouter(deps));
  if (!config.serviceWorker) app.use(serviceWorkerSwitch());

  app.use('/api', apiNotFound);
  // pages in front of the client, so an address naming nothing answers 404
  if (deps.client)
    app.use(swapPagesRouter(deps), cataloguePagesRouter(deps), shopPagesRouter(deps), pageHeadsRouter(deps), ...deps.client);
  app.use(errorHandler(logger));
  return app;
}

const signedInAs = (req: express.Request) => (req.user ? { userId: req.user.id } : undefined);

function contentSecurityPolicy(config: Config) {
  // only Vite's dev server needs the looser rules; the built client runs under the strict ones
  const dev = config.serveClient === 'vite';
  return {
    defaultSrc: ["'self'"],
    // Vite's dev server injects an inline module preamble and a websocket for hot reload
    scriptSrc: dev ? ["'self'", "'unsafe-inline'"] : ["'self'"],
    styleSrc: ["'self'", "'unsafe-inline'"],
    // members' avatars come from the sign-in provider
    imgSrc: ["'self'", 'data:', 'blob:', 'https://avatars.githubusercontent.com'],
    fontSrc: ["'self'", 'data:'],
    connectSrc: dev ? ["'self'", 'ws:'] : ["'self'"],
    workerSrc: ["'self'", 'blob:'],
    objectSrc: ["'none'"],
    baseUri: ["'none'"],
    frameAncestors: ["'none'"],
    formAction: ["'self'"],
    upgradeInsecureRequests: config.appUrl.startsWith('https:') ? [] : null,
  };
}
