import { createContext, useContext, type ReactNode } from 'react';
import type { SessionUser } from '@shared/schemas/auth';
import type { Role } from '@shared/schemas/common';

/**
 * The signed-in member for everything under the app layout. The layout reads the session from
 * the auth feature and provides it here, so other features can know who is signed in without
 * importing the auth feature.
 */
const SessionContext = createContext<SessionUser | null>(null);

export function SessionProvider({ user, children }: { user: SessionUser; children: ReactNode }) {
  return <SessionContext.Provider value={user}>{children}</SessionContext.Provider>;
}

export function useSessionUser(): SessionUser {
  const user = useContext(SessionContext);
  if (!user) throw new Error('useSessionUser was called outside the signed-in app layout.');
  return user;
}

export function hasRole(user: Pick<SessionUser, 'role'>, roles: readonly Role[]): boolean {
  return roles.includes(user.role);
}

/**
 * Whether this browser may hold a session. The session cookie is HttpOnly, so the page keeps a
 * hint of its own: set when the server names the signed-in member, cleared on a 401 or sign-out.
 * Without it, public pages treat the visitor as signed out and do not ask the server (whose 401
 * would only be logged by the browser); protected pages always ask.
 */
const SESSION_HINT_KEY = 'packwright.signed-in';

export function rememberSession(signedIn: boolean): void {
  try {
    if (signedIn) window.localStorage.setItem(SESSION_HINT_KEY, '1');
    else window.localStorage.removeItem(SESSION_HINT_KEY);
  } catch {
    // Storage may be unavailable (private mode); the hint is only an optimisation.
  }
}

export function mayHaveSession(): boolean {
  try {
    return window.localStorage.getItem(SESSION_HINT_KEY) === '1';
  } catch {
    return true;
  }
}
