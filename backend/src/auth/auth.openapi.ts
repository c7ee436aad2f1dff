import { loginRequestSchema, loginResponseSchema, meResponseSchema, messageResponseSchema, passwordResetConfirmSchema, passwordResetRequestSchema } from '@shared/schemas';
import { documentRoute } from '../openapi/registry';

documentRoute({ method: 'post', path: '/auth/login', summary: 'Sign in; sets the session cookie and returns a bearer token (429 when rate-limited)', tag: 'auth', body: loginRequestSchema, response: loginResponseSchema });
documentRoute({ method: 'post', path: '/auth/logout', summary: 'Sign out (clears the session cookie)', tag: 'auth', roles: 'any', status: 204 });
documentRoute({ method: 'get', path: '/auth/me', summary: 'The signed-in member', tag: 'auth', roles: 'any', response: meResponseSchema });
documentRoute({ method: 'post', path: '/auth/password-reset', summary: 'E-mail a one-time reset link (same answer whether the address exists or not)', tag: 'auth', body: passwordResetRequestSchema, response: messageResponseSchema, status: 202 });
documentRoute({ method: 'post', path: '/auth/password-reset/confirm', summary: 'Set a new password with a reset token', tag: 'auth', body: passwordResetConfirmSchema, response: messageResponseSchema });
