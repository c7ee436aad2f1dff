import type { QueryClient } from '@tanstack/react-query';
import { Link, useNavigate, type LoaderFunctionArgs } from 'react-router';
import { Card, CardBody } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { BriefForm } from '@/features/briefs/components/brief-form';
import { useSessionUser } from '@/lib/session';
import { requireRole } from '../../../guards';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireRole(queryClient, request, ['designer', 'admin']);
    return null;
  };

export default function NewBriefRoute() {
  const me = useSessionUser();
  const navigate = useNavigate();
  return (
    <>
      <title>New brief · Packwright</title>
      <p className="mb-2 text-small">
        <Link to="/briefs" className="font-semibold text-frost-700 hover:underline">
          ← Briefs
        </Link>
      </p>
      <PageHeader
        title="New brief"
        description="Start from a sideline cold compress and change what differs. Every figure carries its unit."
      />
      <Card>
        <CardBody>
          <BriefForm
            brief={null}
            currency={me.workspace.currency}
            onSaved={(saved) => void navigate(`/briefs/${saved.id}`)}
            onCancel={() => void navigate('/briefs')}
          />
        </CardBody>
      </Card>
    </>
  );
}
