import path from 'node:path';
import { existsSync } from 'node:fs';
import express, { Express, Router } from 'express';
import helmet from 'helmet';
import { adminRoutes } from './admin/admin.routes';
import { AnalysisJobs, jobTiming } from './analyses/analysis-jobs';
import { auditRoutes } from './audit/audit.routes';
import { analysesRoutes } from './analyses/analyses.routes';
import { plansRoutes } from './plans/plans.routes';
import { authRoutes } from './auth/auth.routes';
import { configurePassport } from './auth/passport';
import { sessionMiddleware } from './auth/session';
import type { Config } from './config';
import type { AppContext } from './context';
import type { Db } from './db/client';
import { healthRoutes } from './health/health.routes';
import { errorHandler, notFoundHandler } from './http/error-handler';
import { routerFrom, RouteSpec } from './http/routes';
import { controlCharacters } from './http/control-characters';
import { ReadCache, withReadCache } from './http/read-cache';
import { xsrfProtection } from './http/xsrf';
import { MailService } from './mail/mail-service';
import { releasesRoutes } from './releases/releases.routes';
import { signoffRoutes } from './signoff/signoff.routes';
import { specimensRoutes } from './specimens/specimens.routes';
import { studiesRoutes } from './studies/studies.routes';
import { uploadsRoutes } from './uploads/uploads.routes';

export interface CreatedApp { app: Express; ctx: AppContext; routes: RouteSpec[]; readCache: ReadCache | null }

/** Every API route of Parallax, with the roles each allows (the role-matrix test walks this list). */
export function apiRoutes(ctx: AppContext, passport: ReturnType<typeof configurePassport>): RouteSpec[] {
  return [
    ...healthRoutes(ctx), ...authRoutes(ctx, passport), ...adminRoutes(ctx), ...studiesRoutes(ctx), ...specimensRoutes(ctx), ...uploadsRoutes(ctx), ...analysesRoutes(ctx), ...plansRoutes(ctx),
    ...signoffRoutes(ctx), ...auditRoutes(ctx), ...releasesRoutes(ctx),
  ];
}

const CSP = {
  useDefaults: false,
  directives: {
    defaultSrc: ["'self'"],
    scriptSrc: ["'self'"],
    // Angular and ag-grid put component styles in <style> elements; no style comes from elsewhere.
    styleSrc: ["'self'", "'unsafe-inline'"],
    imgSrc: ["'self'", 'data:', 'blob:'],
    fontSrc: ["'self'"],
    connectSrc: ["'self'"],
    objectSrc: ["'none'"],
    baseUri: ["'self'"],
    formAction: ["'self'"],
    frameAncestors: ["'none'"],
  },
};

/** Builds the Express app (no listen; supertest uses it as it is). */
export function createApp(config: Config, database: Db): CreatedApp {
  const mail = new MailService(database.db, config.smtpUrl, config.mailFrom);
  const ctx: AppContext = { db: database.db, pool: database.pool, config, mail, jobs: new AnalysisJobs(database.db, config.databaseUrl, jobTiming(config.analysisStaleSeconds, config.analysisThreads)) };
  const passport = configurePassport(database.db);
  const app = express();
  app.set('trust proxy', 'loopback');
  app.disable('x-powered-by');
  app.use(helmet({ contentSecurityPolicy: CSP, crossOriginEmbedderPolicy: false }));
  app.use(express.json({ limit: '2mb' }));
  const api = Router();
  // No API answer (findings, rows, history) may be kept by a browser or proxy cache.
  api.use((_req, res, next) => { res.setHeader('Cache-Control', 'no-store'); next(); });
  api.use(xsrfProtection(config.sessionSecret, config.cookieSecure));
  api.use(controlCharacters);
  // Repeated reads of a few pure GET routes are answered from memory, keyed by the laboratory's change counter.
  const readCache = config.readCacheBytes > 0 ? new ReadCache(config.readCacheBytes) : null;
  const routes = withReadCache(apiRoutes(ctx, passport), readCache);
  api.use(routerFrom(routes.filter((r) => r.sessionless)));
  api.use(sessionMiddleware(database.pool, config));
  api.use(passport.session());
  api.use(routerFrom(routes.filter((r) => !r.sessionless)));
  api.use(notFoundHandler);
  app.use('/api/v1', api);
  app.use('/api', notFoundHandler);
  serveClient(app, config);
  app.use(notFoundHandler);
  app.use(errorHandler);
  return { app, ctx, routes, readCache };
}

/** The built client, if there is one (looked up per request, so a build finishing later is served). */
function serveClient(app: Express, config: Config): void {
  const dir = config.clientDir ?? path.resolve(__dirname, '../dist/client/browser');
  app.use(express.static(dir, { index: false, maxAge: '1h' }));
  app.get(['/', '/*splat'], (req, res, next) => {
    if (path.extname(req.path) || !existsSync(path.join(dir, 'index.html'))) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(path.join(dir, 'index.html'));
  });
}
