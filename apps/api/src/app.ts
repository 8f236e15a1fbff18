// Builds the Express app from its dependencies; listening happens in main.ts, so tests get the app.
import { existsSync } from 'node:fs';
import path from 'node:path';
import { constants as zlibConstants } from 'node:zlib';
import express, { type Express, type Router } from 'express';
import compression from 'compression';
import helmet from 'helmet';
import type { Logger } from 'pino';
import { ExpressAuth } from '@auth/express';
import type { Db } from '@bumperline/db/client';
import { InvalidCursorError } from '@bumperline/db/errors';
import { buildAuthConfig } from './auth/auth-config.ts';
import { sessionCookieReader } from './auth/session-cookie.ts';
import { loadActor } from './auth/load-actor.ts';
import { SignInLimiter } from './auth/sign-in-limiter.ts';
import { AccountMailLimiter } from './auth/account-mail-limiter.ts';
import { postgresCounter } from './http/rate-limit-counter.ts';
import { csrfGuard } from './http/csrf.ts';
import { requestLogger } from './http/logger.ts';
import { loopbackOnly } from './http/loopback-only.ts';
import { refuseNulBytes } from './http/nul-bytes.ts';
import { makeScoped } from './http/guards.ts';
import { notFoundHandler, problemHandler } from './http/problem-details.ts';
import { ValidationError } from './http/errors.ts';
import type { Mailer } from './services/mailer.ts';
import { accountRouter } from './routes/account.ts';
import { activityRouter, companyRouter } from './routes/company.ts';
import { gamesRouter, modelsRouter } from './routes/games.ts';
import { healthRouter } from './routes/health.ts';
import { invitationsRouter, teamRouter } from './routes/team.ts';
import { venuesRouter } from './routes/venues.ts';
import { callsRouter, techniciansRouter } from './routes/calls.ts';
import { settingsRouter } from './routes/settings.ts';
import { venueViewRouter } from './routes/venue-view.ts';
import type { PhotoStore } from './services/photo-store.ts';
import { smsWebhookRouter } from './routes/sms-webhook.ts';
import { publicTagsRouter } from './routes/public-tags.ts';
import { tagSheetRouter } from './routes/tag-sheet.ts';
import { boardsRouter } from './routes/boards.ts';
import { partsListsRouter } from './routes/parts-lists.ts';
import { benchTemplatesRouter } from './routes/bench-templates.ts';
import { benchJobsRouter } from './routes/bench-jobs.ts';
import { partsCatalogueRouter } from './routes/parts-catalogue.ts';
import { stockRouter } from './routes/stock.ts';
import { partsUsedRouter } from './routes/parts-used.ts';
import { routeDaysRouter } from './routes/route-days.ts';
import { carePlansRouter } from './routes/care-plans.ts';
import { workOrdersRouter } from './routes/work-orders.ts';
import { metersRouter } from './routes/meters.ts';

export interface AppDeps {
  db: Db;
  mailer: Mailer;
  logger: Logger;
  authSecret: string;
  appOrigin: string;
  /** Demo mode only (startup/demo.ts): the pages showing the fakes' mail and texts, mounted at /dev for loopback only. */
  devPages?: Router;
  /** Express "trust proxy": which proxies' X-Forwarded-For to believe for the client address (rate limits). */
  trustProxy?: boolean | number | string;
  /** The built web app (vite build) to serve, in production. */
  webDist?: string;
  signInLimiter?: SignInLimiter;
  photos: PhotoStore;
  /** Twilio auth token: validates the X-Twilio-Signature of inbound webhooks. */
  smsAuthToken: string;
}

// Case-insensitive, as Express's routing is.
const isApiPath = (p: string) => /^\/api(\/|$)/i.test(p);

export function createApp(deps: AppDeps): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', deps.trustProxy ?? 'loopback');
  app.set('query parser', 'simple');
  app.use(requestLogger(deps.logger));
  // gzip/deflate for text answers (the app's bundles, JSON, HTML); images are left as they are. The app's
  // files get zlib's default level (the smallest bundles); API answers are made per request, so they get
  // the fastest level (below, on the API router): a 30 KB list costs half the CPU for ~13% more bytes.
  const compressFiles = compression();
  app.use((req, res, next) => (isApiPath(req.path) ? next() : compressFiles(req, res, next)));
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'img-src': ["'self'", 'data:', 'blob:', 'https:'],
          'connect-src': ["'self'"],
          'upgrade-insecure-requests': null,
        },
      },
    }),
  );

  const signInLimiter = deps.signInLimiter ?? new SignInLimiter(postgresCounter(deps.db));
  const secureCookies = deps.appOrigin.startsWith('https:');
  const authConfig = buildAuthConfig({ db: deps.db, secret: deps.authSecret, secureCookies, limiter: signInLimiter });
  // Auth.js reads the client address from this header for rate limiting; never trust the client's own.
  app.use('/auth', (req, _res, next) => {
    req.headers['x-bumperline-client-ip'] = req.ip ?? 'unknown';
    next();
  });
  app.use('/auth', ExpressAuth(authConfig));

  // Provider webhooks (form-encoded, signed) come before our JSON parser and CSRF guard.
  app.use('/webhooks/sms', smsWebhookRouter({ db: deps.db, authToken: deps.smsAuthToken, publicOrigin: deps.appOrigin }));
  // Public game-tag pages: no sign-in, plain HTML forms that work without JavaScript.
  app.use(publicTagsRouter({ db: deps.db, photos: deps.photos, appOrigin: deps.appOrigin }));

  // A whole parts list is saved in one request: a few hundred rows outgrow the general limit.
  app.use('/api/boards/:boardId/parts', express.json({ limit: '1mb' }));
  app.use(express.json({ limit: '100kb' }));
  app.use(refuseNulBytes);
  app.use(loadActor(deps.db, sessionCookieReader({ secret: deps.authSecret, secureCookies })));

  const scoped = makeScoped(deps.db);
  const api = express.Router();
  api.use(compression({ level: zlibConstants.Z_BEST_SPEED }));
  api.use('/health', healthRouter(deps.db));
  api.use(csrfGuard(deps.appOrigin));
  api.use(
    '/account',
    accountRouter({
      db: deps.db,
      mailer: deps.mailer,
      appOrigin: deps.appOrigin,
      signInLimiter,
      mailLimiter: new AccountMailLimiter(postgresCounter(deps.db)),
    }),
  );
  api.use('/invitations', invitationsRouter(deps.db));
  api.use('/company', companyRouter(scoped));
  api.use('/activity', activityRouter(scoped));
  api.use('/team', teamRouter({ scoped, mailer: deps.mailer, appOrigin: deps.appOrigin }));
  api.use('/venues', venuesRouter(scoped));
  api.use('/games', gamesRouter(scoped));
  api.use('/models', modelsRouter(scoped));
  api.use('/calls', callsRouter({ scoped, appOrigin: deps.appOrigin, photos: deps.photos }));
  api.use('/technicians', techniciansRouter(scoped));
  api.use('/settings', settingsRouter(scoped));
  api.use('/venue-view', venueViewRouter({ scoped, appOrigin: deps.appOrigin }));
  api.use(tagSheetRouter({ scoped, appOrigin: deps.appOrigin }));
  api.use(boardsRouter(scoped));
  api.use(partsListsRouter(scoped));
  api.use('/bench-templates', benchTemplatesRouter(scoped));
  api.use('/bench-jobs', benchJobsRouter({ scoped, photos: deps.photos }));
  api.use(partsCatalogueRouter(scoped));
  api.use('/stock', stockRouter(scoped));
  api.use(partsUsedRouter(scoped));
  api.use(routeDaysRouter({ scoped, appOrigin: deps.appOrigin }));
  api.use('/care-plans', carePlansRouter(scoped));
  api.use('/work-orders', workOrdersRouter(scoped));
  api.use(metersRouter(scoped));
  api.use(notFoundHandler);
  app.use('/api', api);

  if (deps.devPages) app.use('/dev', loopbackOnly, deps.devPages);

  if (deps.webDist && existsSync(path.join(deps.webDist, 'index.html'))) {
    const index = path.join(deps.webDist, 'index.html');
    // Bundles under /assets carry a content hash in their names: a browser may keep them for good.
    app.use('/assets', express.static(path.join(deps.webDist, 'assets'), { immutable: true, maxAge: '1y' }));
    // The service worker and its manifest keep their names across releases: always revalidated, so a new
    // release reaches the phones on their next load instead of an hour later.
    const revalidated = /(^|\/)(sw\.js|manifest\.webmanifest)$/;
    app.use(
      express.static(deps.webDist, {
        index: false,
        maxAge: '1h',
        setHeaders: (res, file) => {
          if (revalidated.test(file)) res.setHeader('Cache-Control', 'no-cache');
        },
      }),
    );
    // Client-side routes: every other GET gets the app shell — but a missing file under /assets (a source
    // map, an old bundle) is a 404, not a page, and so is /dev/… wherever the demo's pages are not mounted.
    app.get('/{*path}', (req, res, next) =>
      /^\/(assets|dev)\//.test(req.path) ? next() : res.sendFile(index, { headers: { 'Cache-Control': 'no-cache' } }),
    );
  }

  app.use(notFoundHandler);
  app.use(((err, req, res, next) => {
    if (err instanceof InvalidCursorError)
      return problemHandler(new ValidationError([{ field: 'cursor', message: err.message }]), req, res, next);
    return problemHandler(err, req, res, next);
  }) as express.ErrorRequestHandler);
  return app;
}
