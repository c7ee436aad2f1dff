import { existsSync } from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import cookieParser from 'cookie-parser';
import { projectRoot, config, type TrustProxy } from './config';
import { LoginLimiter, type LoginLimits } from './auth/login-limiter';
import { passport } from './auth/passport';
import { sameOriginGuard } from './auth/auth.middleware';
import { apiNotFound, errorHandler } from './http/error-handler';
import { apiRouter } from './api-router';

export interface AppOptions {
  /** Serve the built front end from this folder (default dist/ when it exists). */
  staticDir?: string | null;
  /** Extra origins allowed to make cookie-authenticated writes (the Vite dev server). */
  extraOrigins?: string[];
  /** Express's `trust proxy` (default: the TRUST_PROXY setting, off when unset). */
  trustProxy?: TrustProxy;
  /** Sign-in limits of this app (default: the LOGIN_* settings). */
  loginLimits?: LoginLimits;
}

/** Builds the Express app: security headers, JSON limits, the API under /api, the built SPA. */
export function createApp(options: AppOptions = {}): Express {
  const app = express();
  app.disable('x-powered-by');
  // X-Forwarded-For/-Proto are believed only from the proxies named by TRUST_PROXY: otherwise any
  // client could pick its own address (and escape the sign-in limit) or claim https.
  app.set('trust proxy', options.trustProxy ?? config.trustProxy);
  app.locals.loginLimiter = new LoginLimiter(options.loginLimits ?? config.loginRateLimit);
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'default-src': ["'self'"],
          'img-src': ["'self'", 'data:'],
          'style-src': ["'self'", "'unsafe-inline'"],
          'frame-src': ["'self'", 'blob:'],
          'script-src': ["'self'"],
        },
      },
    }),
  );
  app.use(cookieParser());
  app.use(express.json({ limit: '512kb' }));
  app.use(passport.initialize());
  const extraOrigins = options.extraOrigins ?? [];
  app.use('/api', sameOriginGuard(() => [...extraOrigins, ...(config.appUrl ? [new URL(config.appUrl).origin] : [])]));
  app.use('/api', apiRouter);
  app.use('/api', apiNotFound);

  const staticDir = options.staticDir === undefined ? path.join(projectRoot, 'dist') : options.staticDir;
  if (staticDir && existsSync(path.join(staticDir, 'index.html'))) {
    app.use(express.static(staticDir, { index: false, maxAge: '1h' }));
    // Client-side routes: every non-API GET, the root included, answers the SPA's index.html.
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(staticDir, 'index.html')));
  }
  app.use(errorHandler);
  return app;
}
