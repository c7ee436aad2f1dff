import { createSecretKey } from 'node:crypto';
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
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { toAuthUser, type AuthUser } from './session-user';

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

interface SessionUserRow {
  id: number;
  email: string;
  name: string;
  role: AuthUser['role'];
  disabled: boolean;
  token_version: number;
  workspace_id: number;
  workspace_name: string;
  workspace_currency: string;
}

/**
 * The member a session token names, with their workspace, in one plain query: every signed-in
 * request asks this, and building Sequelize instances with an include cost more than the query.
 */
async function findSessionUser(id: number) {
  if (!Number.isSafeInteger(id) || id <= 0) return null;
  const [row] = await sequelize.query<SessionUserRow>(
    `SELECT u.id, u.email, u.name, u.role, u.disabled, u.token_version, u.workspace_id, w.name AS workspace_name, w.currency AS workspace_currency
       FROM users u JOIN workspaces w ON w.id = u.workspace_id WHERE u.id = :id`,
    { replacements: { id }, type: QueryTypes.SELECT },
  );
  if (!row) return null;
  const authUser: AuthUser = {
    id: row.id,
    email: row.email,
    name: row.name,
    role: row.role,
    workspaceId: row.workspace_id,
    workspace: { id: row.workspace_id, name: row.workspace_name, currency: row.workspace_currency },
  };
  return { authUser, disabled: row.disabled, tokenVersion: row.token_version, workspaceId: row.workspace_id };
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
      // A KeyObject made once: given the secret as a string, jsonwebtoken first tries it as a public
      // key (createPublicKey throws) and then builds a secret key, on every request.
      secretOrKey: createSecretKey(Buffer.from(config.jwtSecret, 'utf8')) as unknown as string,
      algorithms: ['HS256'],
      issuer: 'packwright',
    },
    async (raw: unknown, done: (err: unknown, user?: Express.User | false) => void) => {
      try {
        const parsed = sessionPayloadSchema.safeParse(raw);
        if (!parsed.success) return done(null, false);
        const payload = parsed.data;
        const user = await findSessionUser(Number(payload.sub));
        if (!user || user.disabled || user.tokenVersion !== payload.tv || user.workspaceId !== payload.ws) {
          return done(null, false);
        }
        return done(null, user.authUser);
      } catch (error) {
        return done(error);
      }
    },
  ),
);

export { passport };
