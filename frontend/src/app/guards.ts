import type { QueryClient } from '@tanstack/react-query';
import { data, redirect } from 'react-router';
import type { SessionUser } from '@shared/schemas/auth';
import type { Role } from '@shared/schemas/common';
import { getMeQueryOptions } from '@/features/auth/api/get-me';
import { safeNextPath, signInHref } from '@/lib/api-client';
import { mayHaveSession } from '@/lib/session';

/** Loader guard: the signed-in member, or a redirect to /sign-in?next=<here>. */
export async function requireUser(queryClient: QueryClient, request: Request): Promise<SessionUser> {
  const user = await queryClient.ensureQueryData(getMeQueryOptions());
  if (!user) {
    const url = new URL(request.url);
    throw redirect(signInHref(`${url.pathname}${url.search}`));
  }
  return user;
}

export type ForbiddenData = { kind: 'forbidden'; roles: readonly Role[]; role: Role };

/** Loader guard for role-restricted pages: answers 403, which the route error boundary explains kindly. */
export async function requireRole(queryClient: QueryClient, request: Request, roles: readonly Role[]): Promise<SessionUser> {
  const user = await requireUser(queryClient, request);
  if (!roles.includes(user.role)) {
    throw data<ForbiddenData>({ kind: 'forbidden', roles, role: user.role }, { status: 403, statusText: 'Not for your role' });
  }
  return user;
}

/** For the sign-in pages: a member who is already signed in goes where they were heading. */
export async function redirectIfSignedIn(queryClient: QueryClient, request: Request): Promise<null> {
  // Not signed in is the normal state here: without a session hint the server is not asked.
  if (!mayHaveSession() && queryClient.getQueryData(getMeQueryOptions().queryKey) === undefined) return null;
  const user = await queryClient.ensureQueryData(getMeQueryOptions()).catch(() => null);
  if (user) {
    const next = new URL(request.url).searchParams.get('next');
    throw redirect(safeNextPath(next));
  }
  return null;
}
