import { useNavigate, useSearchParams } from 'react-router';
import { AuthLayout } from '@/components/layouts/auth-layout';
import { AcceptInvitation, InvalidInvitation } from '@/features/auth/components/accept-invitation-form';

export default function AcceptInvitationRoute() {
  const [searchParams] = useSearchParams();
  const navigate = useNavigate();
  const token = searchParams.get('token') ?? '';

  return (
    <AuthLayout title="Join your team on Packwright" description="You have been invited to a Packwright workspace. Set your name and a password to join.">
      {token ? (
        <AcceptInvitation token={token} onAccepted={() => void navigate('/', { replace: true })} />
      ) : (
        <InvalidInvitation />
      )}
    </AuthLayout>
  );
}
