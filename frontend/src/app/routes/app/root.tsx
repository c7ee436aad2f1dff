import type { QueryClient } from '@tanstack/react-query';
import { Navigate, Outlet, useLocation, useNavigate, type LoaderFunctionArgs } from 'react-router';
import { AppLayout } from '@/components/layouts/app-layout';
import { Loading } from '@/components/ui/spinner';
import { navForRole } from '@/config/nav';
import { useMe } from '@/features/auth/api/get-me';
import { useLogout } from '@/features/auth/api/logout';
import { signInHref } from '@/lib/api-client';
import { SessionProvider } from '@/lib/session';
import { requireUser } from '../../guards';

/** The session guard for every signed-in page. */
export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    return null;
  };

export default function AppRoot() {
  const me = useMe();
  const navigate = useNavigate();
  const location = useLocation();
  const logout = useLogout({ onSettled: () => void navigate('/sign-in', { replace: true }) });

  if (me.isPending) return <Loading label="Opening your workspace…" className="justify-center" />;
  if (!me.data) {
    if (!logout.isIdle) return <Loading label="Signing out…" className="justify-center" />;
    // The session ended while the app was open.
    return <Navigate to={signInHref(`${location.pathname}${location.search}`)} replace />;
  }

  const user = me.data;
  return (
    <SessionProvider user={user}>
      <AppLayout
        workspaceName={user.workspace.name}
        personName={user.name}
        personEmail={user.email}
        role={user.role}
        nav={navForRole(user.role)}
        onSignOut={() => logout.mutate()}
        signingOut={logout.isPending}
      >
        <Outlet />
      </AppLayout>
    </SessionProvider>
  );
}
