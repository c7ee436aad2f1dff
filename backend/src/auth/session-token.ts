import jwt from 'jsonwebtoken';
import type { Response } from 'express';
import { config } from '../config';
import { SESSION_COOKIE, type SessionTokenPayload } from './passport';

export function issueSessionToken(user: { id: number; workspaceId: number; tokenVersion: number }): string {
  const payload: SessionTokenPayload = { sub: String(user.id), ws: user.workspaceId, tv: user.tokenVersion };
  return jwt.sign(payload, config.jwtSecret, { algorithm: 'HS256', expiresIn: config.jwtTtlSeconds, issuer: 'packwright' });
}

export function setSessionCookie(res: Response, token: string): void {
  res.cookie(SESSION_COOKIE, token, {
    httpOnly: true,
    sameSite: 'lax',
    secure: config.env === 'production',
    maxAge: config.jwtTtlSeconds * 1000,
    path: '/',
  });
}

export function clearSessionCookie(res: Response): void {
  res.clearCookie(SESSION_COOKIE, { path: '/', httpOnly: true, sameSite: 'lax', secure: config.env === 'production' });
}
