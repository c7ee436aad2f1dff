import { Router } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { loginRequestSchema, passwordResetConfirmSchema, passwordResetRequestSchema } from '@shared/schemas';
import { config } from '../config';
import { AppError } from '../http/errors';
import { validate, validated } from '../http/validate';
import { passport } from './passport';
import { requireAuth } from './auth.middleware';
import { confirmPasswordReset, endSessions, PASSWORD_RESET_ANSWER, recordLogin, requestPasswordReset } from './auth.service';
import { clearSessionCookie, issueSessionToken, setSessionCookie } from './session-token';
import { toSessionUser } from './session-user';
import './auth.openapi';

/** Counted per client address and e-mail address, so one person's typos do not lock out an office. */
const loginLimiter = rateLimit({
  windowMs: config.loginRateLimit.windowMs,
  limit: config.loginRateLimit.limit,
  standardHeaders: 'draft-8',
  legacyHeaders: false,
  keyGenerator: (req) => {
    const email = typeof req.body?.email === 'string' ? req.body.email.trim().toLowerCase() : '';
    return `${ipKeyGenerator(req.ip ?? '')}|${email}`;
  },
  handler: (_req, _res, next) =>
    next(new AppError({ status: 429, code: 'too_many_attempts', message: 'Too many sign-in attempts. Wait a few minutes and try again.' })),
});

const resetLimiter = rateLimit({
  windowMs: 15 * 60 * 1000,
  limit: 20,
  standardHeaders: 'draft-8',
  legacyHeaders: false,
  handler: (_req, _res, next) =>
    next(new AppError({ status: 429, code: 'too_many_attempts', message: 'Too many reset requests. Wait a few minutes and try again.' })),
});

export const authRouter = Router();

authRouter.post('/login', loginLimiter, validate({ body: loginRequestSchema }), (req, res, next) => {
  passport.authenticate('local', { session: false }, async (err: unknown, user: Express.User | false) => {
    try {
      if (err) return next(err);
      // One answer for an unknown address, a wrong password and a disabled account.
      if (!user) throw new AppError({ status: 401, code: 'invalid_credentials', message: 'That e-mail and password do not match an active account.' });
      const record = await recordLogin(user.id);
      const token = issueSessionToken(record);
      setSessionCookie(res, token);
      res.json({ user: toSessionUser(user), token });
    } catch (error) {
      next(error);
    }
  })(req, res, next);
});

/** Logout ends the session for real: the token presented (cookie or bearer) and every older one stop working. */
authRouter.post('/logout', requireAuth, async (req, res) => {
  await endSessions(req.user!.id);
  clearSessionCookie(res);
  res.status(204).end();
});

authRouter.get('/me', requireAuth, (req, res) => {
  res.json({ user: toSessionUser(req.user!) });
});

authRouter.post('/password-reset', resetLimiter, validate({ body: passwordResetRequestSchema }), async (_req, res) => {
  const { body } = validated(res, { body: passwordResetRequestSchema });
  await requestPasswordReset(body.email);
  res.status(202).json({ message: PASSWORD_RESET_ANSWER });
});

authRouter.post('/password-reset/confirm', resetLimiter, validate({ body: passwordResetConfirmSchema }), async (_req, res) => {
  const { body } = validated(res, { body: passwordResetConfirmSchema });
  await confirmPasswordReset(body.token, body.password);
  res.json({ message: 'Your password is set. Sign in with it now.' });
});
