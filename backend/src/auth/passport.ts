import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { ExtractJwt, Strategy as JwtStrategy } from 'passport-jwt';
import type { Request } from 'express';
import { z } from 'zod';
import { MAX_ID } from '@shared/schemas';
import { config } from '../config';
import { UserRecord } from '../users/user.model';
import { Workspace } from '../workspaces/workspace.model';
import { DUMMY_PASSWORD_HASH, verifyPassword } from './passwords';
import { toAuthUser } from './session-user';

export const SESSION_COOKIE = 'pw_session';

export interface SessionTokenPayload {
  sub: string;
  ws: number;
  /** The user's token version when the token was issued; a bump revokes older tokens. */
  tv: number;
}

/**
 * What a signed token must carry to be a session: a numeric user id within the id range, the
 * workspace, the token version and an expiry. A token signed with our secret but lacking any of
 * these (an old or hand-made token) is refused as no session, never looked up.
 */
const sessionPayloadSchema = z.object({
  sub: z
    .string()
    .regex(/^[1-9]\d{0,9}$/)
    .refine((s) => Number(s) <= MAX_ID),
  ws: z.number().int().positive().max(MAX_ID),
  tv: z.number().int().min(0).max(MAX_ID),
  exp: z.number().finite(),
});

function cookieExtractor(req: Request): string | null {
  const cookies = req.cookies as Record<string, string> | undefined;
  return cookies?.[SESSION_COOKIE] ?? null;
}

/** Where a request's token came from matters for cross-site checks: only cookies ride along by themselves. */
export function tokenSource(req: Request): 'cookie' | 'bearer' | null {
  if (req.headers.authorization?.startsWith('Bearer ')) return 'bearer';
  if (cookieExtractor(req)) return 'cookie';
  return null;
}

async function findActiveUser(where: { id?: number; email?: string }) {
  return UserRecord.findOne({ where, include: [{ model: Workspace, as: 'workspace' }] });
}

passport.use(
  new LocalStrategy({ usernameField: 'email', passwordField: 'password', session: false }, async (email, password, done) => {
    try {
      const user = await findActiveUser({ email: email.trim().toLowerCase() });
      // Compare against a dummy hash for unknown addresses so the answer and its timing match.
      const ok = await verifyPassword(password, user?.passwordHash ?? DUMMY_PASSWORD_HASH);
      if (!user || !ok || user.disabled) return done(null, false);
      return done(null, toAuthUser(user));
    } catch (error) {
      return done(error);
    }
  }),
);

passport.use(
  new JwtStrategy(
    {
      jwtFromRequest: ExtractJwt.fromExtractors([ExtractJwt.fromAuthHeaderAsBearerToken(), cookieExtractor]),
      secretOrKey: config.jwtSecret,
      algorithms: ['HS256'],
      issuer: 'packwright',
    },
    async (raw: unknown, done: (err: unknown, user?: Express.User | false) => void) => {
      try {
        const parsed = sessionPayloadSchema.safeParse(raw);
        if (!parsed.success) return done(null, false);
        const payload = parsed.data;
        const user = await findActiveUser({ id: Number(payload.sub) });
        if (!user || user.disabled || user.tokenVersion !== payload.tv || user.workspaceId !== payload.ws) {
          return done(null, false);
        }
        return done(null, toAuthUser(user));
      } catch (error) {
        return done(error);
      }
    },
  ),
);

export { passport };
