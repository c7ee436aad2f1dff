import type { RequestHandler } from 'express';
import type { Role } from '@shared/schemas';
import { AppError } from '../http/errors';
import { passport, tokenSource } from './passport';

/** Every protected route starts here: a valid, current session (cookie or bearer) or 401. */
export const requireAuth: RequestHandler = (req, res, next) => {
  passport.authenticate('jwt', { session: false }, (err: unknown, user: Express.User | false) => {
    if (err) return next(err);
    if (!user) return next(AppError.unauthenticated());
    req.user = user;
    next();
  })(req, res, next);
};

/** Role gate, used after {@link requireAuth}: a signed-in member of another role gets 403. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(AppError.unauthenticated());
    if (!roles.includes(req.user.role)) {
      return next(AppError.forbidden(`This needs the role ${roles.join(' or ')}; you are signed in as ${req.user.role}.`));
    }
    next();
  };
}

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Cross-site request protection for cookie sessions: a state-changing request that rides on the
 * session cookie must come from our own origin (Origin header, or Referer when Origin is absent).
 * Bearer-token clients are not exposed to this attack and are not checked.
 */
export function sameOriginGuard(allowedOrigins: () => string[]): RequestHandler {
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method) || tokenSource(req) !== 'cookie') return next();
    const origin = req.headers.origin ?? refererOrigin(req.headers.referer);
    const own = `${req.protocol}://${req.headers.host}`;
    if (origin && (origin === own || allowedOrigins().includes(origin))) return next();
    next(new AppError({ status: 403, code: 'cross_site_request', message: 'Cross-site request refused: the Origin header does not match this site.' }));
  };
}

function refererOrigin(referer: string | undefined): string | undefined {
  if (!referer) return undefined;
  try {
    return new URL(referer).origin;
  } catch {
    return undefined;
  }
}
