import { Router, type Request } from 'express';
import { rateLimit } from 'express-rate-limit';
import { loginRequestSchema, passwordResetConfirmSchema, passwordResetRequestSchema } from '@shared/schemas';
import { AppError } from '../http/errors';
import { validate, validated } from '../http/validate';
import { LoginLimiter } from './login-limiter';
import { passport } from './passport';
import { requireAuth } from './auth.middleware';
import { confirmPasswordReset, endSessions, PASSWORD_RESET_ANSWER, recordLogin, requestPasswordReset } from './auth.service';
import { clearSessionCookie, issueSessionToken, setSessionCookie } from './session-token';
import { toSessionUser } from './session-user';
import './auth.openapi';

const resetLimiter = rateLimit({
  windowMs: 15 * 60 * 1000,
  limit: 20,
  standardHeaders: 'draft-8',
  legacyHeaders: false,
  // req.ip follows TRUST_PROXY; a forwarded header from an untrusted client is simply ignored.
  validate: { xForwardedForHeader: false },
  handler: (req, _res, next) => {
    const resetTime = (req as typeof req & { rateLimit?: { resetTime?: Date } }).rateLimit?.resetTime;
    const seconds = resetTime ? (resetTime.getTime() - Date.now()) / 1000 : 15 * 60;
    next(AppError.tooManyAttempts('Too many reset requests from here.', seconds));
  },
});

function loginLimiterOf(req: Request): LoginLimiter {
  return req.app.locals.loginLimiter as LoginLimiter;
}

export const authRouter = Router();

// Failed sign-ins are limited per address and per client (auth/login-limiter.ts); a successful
// sign-in does not count. Bad input is answered 400 before the limit and does not count either.
authRouter.post('/login', validate({ body: loginRequestSchema }), (req, res, next) => {
  const { body } = validated(res, { body: loginRequestSchema });
  const attempt = loginLimiterOf(req).begin(body.email, req.ip);
  if (!attempt.allowed) return next(AppError.tooManyAttempts('Too many failed sign-in attempts for this address or from this network.', attempt.retryAfterSeconds));
  passport.authenticate('local', { session: false }, async (err: unknown, user: Express.User | false) => {
    try {
      if (err) {
        attempt.abandoned();
        return next(err);
      }
      // One answer for an unknown address, a wrong password and a disabled account; it counts as a failure.
      if (!user) throw new AppError({ status: 401, code: 'invalid_credentials', message: 'That e-mail and password do not match an active account.' });
      attempt.succeeded();
      const record = await recordLogin(user.id);
      const token = issueSessionToken(record);
      setSessionCookie(req, res, token);
      res.json({ user: toSessionUser(user), token });
    } catch (error) {
      next(error);
    }
  })(req, res, next);
});

/** Logout ends the session for real: the token presented (cookie or bearer) and every older one stop working. */
authRouter.post('/logout', requireAuth, async (req, res) => {
  await endSessions(req.user!.id);
  clearSessionCookie(req, res);
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
