import { Link } from 'react-router';
import { AuthLayout } from '@/components/layouts/auth-layout';
import { ForgotPasswordForm } from '@/features/auth/components/forgot-password-form';

export default function ForgotPasswordRoute() {
  return (
    <AuthLayout
      title="Reset your password"
      description="Give the e-mail address you sign in with and we will send you a link to choose a new password."
      footer={
        <>
          Remembered it?{' '}
          <Link to="/sign-in" className="font-semibold text-frost-600 hover:underline">
            Back to sign in
          </Link>
        </>
      }
    >
      <ForgotPasswordForm />
    </AuthLayout>
  );
}
