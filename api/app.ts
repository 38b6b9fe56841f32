/**
 * Builds the Express app without listening (tests drive it with supertest;
 * api/server.ts listens). Order: security headers → JSON body (1 MB) →
 * session (MariaDB) → CSRF → current user → routes (each behind its access
 * check, see routes/route-table.ts) → 404 → the one error handler.
 */
import compression from 'compression';
import express, { type Application } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import { randomBytes } from 'node:crypto';
import { existsSync } from 'node:fs';
import path from 'node:path';
import type { AppDeps, MailDeps } from './app-deps';
import { loadCurrentUser } from './auth/current-user';
import { SessionStore } from './auth/session-store';
import { createCsrf } from './middleware/csrf';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { createRateLimits, DEFAULT_RATE_LIMITS } from './middleware/rate-limits';
import { addAuthRoutes } from './routes/auth/router';
import { addCampaignRoutes } from './routes/campaigns/router';
import { addHealthRoutes } from './routes/health/router';
import { addInvitationRoutes } from './routes/invitations/router';
import { addJobRoutes } from './routes/jobs/router';
import { addNotificationRoutes } from './routes/notifications/router';
import { addObservatoryRoutes } from './routes/observatories/router';
import { addOutboxRoutes } from './routes/outbox/router';
import { addPulsarRoutes } from './routes/pulsars/router';
import { addFitRunRoutes } from './routes/fit-runs/router';
import { addRevisionRoutes } from './routes/revisions/router';
import { addSearchRunRoutes } from './routes/search-runs/router';
import { RouteTable } from './routes/route-table';
import { addExclusionRoutes } from './routes/exclusions/router';
import { addToaBatchRoutes } from './routes/toa-batches/router';
import { addToaRoutes } from './routes/toas/router';
import { addUserRoutes } from './routes/users/router';
import { addComparisonRoutes } from './routes/comparisons/router';
import { addAuditLogRoutes } from './routes/audit-log/router';

export const SESSION_COOKIE_NAME = 'pk.sid';
export const SESSION_IDLE_MS = 8 * 60 * 60 * 1000; // rolling: each request restarts the 8 h
export const JSON_BODY_LIMIT = '1mb';
const SESSION_CLEANUP_INTERVAL_MS = 15 * 60 * 1000;

function sessionSecret(deps: AppDeps): string {
  const secret = deps.config.api.sessionSecret;
  if (secret) return secret;
  if (deps.config.profile === 'production') throw new Error('PULSEKEEPER_SESSION_SECRET must be set in production');
  (deps.log ?? console.error)('PULSEKEEPER_SESSION_SECRET is not set: sessions end when the API restarts', null);
  return randomBytes(32).toString('hex');
}

function securityHeaders(behindTls: boolean) {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'"],
        // Plotly positions its legend, axis titles and toolbar with inline styles; without this the residual plot
        // renders scrambled. Scripts stay strictly 'self' (inline styles cannot run code).
        styleSrc: ["'self'", "'unsafe-inline'"],
        fontSrc: ["'self'"],
        imgSrc: ["'self'", 'data:'],
        connectSrc: ["'self'"],
        objectSrc: ["'none'"],
        baseUri: ["'self'"],
        formAction: ["'self'"],
        frameAncestors: ["'none'"],
        scriptSrcAttr: ["'none'"],
        ...(behindTls ? { upgradeInsecureRequests: [] } : {}),
      },
    },
    strictTransportSecurity: behindTls,
  });
}

export function createApp(deps: AppDeps): Application {
  const { config, knex } = deps;
  const log = deps.log ?? ((message: string, err: unknown) => console.error(message, err));
  const app = express();
  if (config.api.behindTls) app.set('trust proxy', 1); // the reverse proxy's X-Forwarded-* (client IP, https)
  app.use(securityHeaders(config.api.behindTls));
  // gzip for the large columnar answers (a fit's explorer columns run to tens of MB as JSON). The sign-in
  // and CSRF answers stay uncompressed: a compressed secret next to reflected input is what BREACH reads.
  app.use(compression({ filter: (req, res) => !req.path.startsWith('/api/auth/') && compression.filter(req, res) }));

  const store = new SessionStore({ knex, cleanupIntervalMs: SESSION_CLEANUP_INTERVAL_MS, onError: (err) => log('session store', err) });
  app.locals.sessionStore = store;

  app.use('/api', (_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });
  app.use('/api', express.json({ limit: JSON_BODY_LIMIT }));
  app.use(
    '/api',
    session({
      name: SESSION_COOKIE_NAME,
      secret: sessionSecret(deps),
      store,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure: config.api.behindTls, maxAge: SESSION_IDLE_MS },
    }),
  );
  const csrf = createCsrf();
  app.use('/api', csrf.protect);
  app.use('/api', loadCurrentUser(knex));

  const routes = new RouteTable(app);
  app.locals.routeTable = routes;
  const mail: MailDeps = { knex, mailer: deps.mailer, publicUrl: config.api.publicUrl, log };
  const limits = createRateLimits({ ...DEFAULT_RATE_LIMITS, ...deps.rateLimits });
  addHealthRoutes(routes, deps);
  addAuthRoutes(routes, deps, mail, csrf, limits);
  addInvitationRoutes(routes, deps);
  addUserRoutes(routes, deps, mail);
  addOutboxRoutes(routes, deps);
  addObservatoryRoutes(routes, deps);
  addPulsarRoutes(routes, deps);
  addJobRoutes(routes, deps);
  addToaBatchRoutes(routes, deps);
  addToaRoutes(routes, deps);
  addExclusionRoutes(routes, deps);
  addRevisionRoutes(routes, deps);
  addFitRunRoutes(routes, deps);
  addSearchRunRoutes(routes, deps);
  addCampaignRoutes(routes, deps);
  addNotificationRoutes(routes, deps);
  addComparisonRoutes(routes, deps);
  addAuditLogRoutes(routes, deps);
  app.use('/api', apiNotFound);

  if (deps.clientDir && existsSync(path.join(deps.clientDir, 'index.html'))) {
    const clientDir = deps.clientDir;
    app.use(express.static(clientDir, { index: false }));
    app.use((req, res, next) => {
      // SPA fallback: the client routes. `root` keeps the dot-file check to the file name, so a checkout under a
      // dot-folder (e.g. ~/.apps/pulsekeeper or a .data/tmp test folder) still serves its client.
      if (req.method === 'GET' || req.method === 'HEAD') res.sendFile('index.html', { root: clientDir });
      else next();
    });
  }
  app.use(apiNotFound);
  app.use(errorHandler(log));
  return app;
}

/** Stops the session store's cleanup timer (call before destroying knex). */
export function closeApp(app: Application): void {
  (app.locals.sessionStore as SessionStore | undefined)?.stopCleanup();
}
