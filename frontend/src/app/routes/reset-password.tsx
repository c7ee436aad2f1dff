import { Link, useSearchParams } from 'react-router';
import { AuthLayout } from '@/components/layouts/auth-layout';
import { InvalidResetLink, ResetPasswordForm } from '@/features/auth/components/reset-password-form';

export default function ResetPasswordRoute() {
  const [searchParams] = useSearchParams();
  const token = searchParams.get('token') ?? '';

  return (
    <AuthLayout
      title="Choose a new password"
      footer={
        <Link to="/sign-in" className="font-semibold text-frost-600 hover:underline">
          Back to sign in
        </Link>
      }
    >
      {token ? <ResetPasswordForm token={token} /> : <InvalidResetLink />}
    </AuthLayout>
  );
}
