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
