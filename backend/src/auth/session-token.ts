import jwt from 'jsonwebtoken';
import type { Request, Response } from 'express';
import { config } from '../config';
import { SESSION_COOKIE, type SessionTokenPayload } from './passport';

export function issueSessionToken(user: { id: number; workspaceId: number; tokenVersion: number }): string {
  const payload: SessionTokenPayload = { sub: String(user.id), ws: user.workspaceId, tv: user.tokenVersion };
  return jwt.sign(payload, config.jwtSecret, { algorithm: 'HS256', expiresIn: config.jwtTtlSeconds, issuer: 'packwright' });
}

/**
 * `Secure` follows the request: set whenever it arrived over https — directly, or through a proxy
 * trusted by TRUST_PROXY that says so in X-Forwarded-Proto (Express's req.secure) — and always in
 * production, where plain http is not expected.
 */
function secureFor(req: Request): boolean {
  return req.secure || config.env === 'production';
}

export function setSessionCookie(req: Request, res: Response, token: string): void {
  res.cookie(SESSION_COOKIE, token, {
    httpOnly: true,
    sameSite: 'lax',
    secure: secureFor(req),
    maxAge: config.jwtTtlSeconds * 1000,
    path: '/',
  });
}

export function clearSessionCookie(req: Request, res: Response): void {
  res.clearCookie(SESSION_COOKIE, { path: '/', httpOnly: true, sameSite: 'lax', secure: secureFor(req) });
}
