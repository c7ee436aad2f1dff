import type { QueryClient } from '@tanstack/react-query';
import { Link, useNavigate, type LoaderFunctionArgs } from 'react-router';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { IngredientForm } from '@/features/library/components/ingredient-form';
import { useSessionUser } from '@/lib/session';
import { requireRole } from '../../../guards';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireRole(queryClient, request, ['chemist', 'admin']);
    return null;
  };

export default function NewIngredientRoute() {
  const me = useSessionUser();
  const navigate = useNavigate();
  return (
    <>
      <title>New ingredient · Packwright</title>
      <p className="mb-2 text-small">
        <Link to="/library" className="font-semibold text-frost-700 hover:underline">
          ← Ingredient library
        </Link>
      </p>
      <PageHeader title="New ingredient" description="Add an ingredient with its process and sources. Safety data sheets can be attached once it is saved." />
      <Card className="max-w-4xl">
        <CardHeader title="Ingredient" />
        <CardBody>
          <IngredientForm
            ingredient={null}
            currency={me.workspace.currency}
            canWrite
            onSaved={(saved) => void navigate(`/library/${saved.id}`, { replace: true })}
          />
        </CardBody>
      </Card>
    </>
  );
}
