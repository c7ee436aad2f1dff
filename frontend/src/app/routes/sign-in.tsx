import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router';
import { useNavigate, useSearchParams } from 'react-router';
import { Alert } from '@/components/ui/alert';
import { AuthLayout } from '@/components/layouts/auth-layout';
import { SignInForm } from '@/features/auth/components/sign-in-form';
import { safeNextPath } from '@/lib/api-client';
import { redirectIfSignedIn } from '../guards';

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) =>
    redirectIfSignedIn(queryClient, request);

export default function SignInRoute() {
  const [searchParams] = useSearchParams();
  const navigate = useNavigate();
  const next = searchParams.get('next');

  return (
    <AuthLayout title="Sign in" description="Use the e-mail address your workspace invited.">
      {next && next !== '/' && (
        <Alert tone="info" className="mb-6">
          Sign in to continue to the page you asked for.
        </Alert>
      )}
      <SignInForm onSignedIn={() => void navigate(safeNextPath(next), { replace: true })} />
    </AuthLayout>
  );
}
