import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router';
import { ButtonLink } from '@/components/ui/button';
import { Card, CardBody } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { EXPORT_CSV_HREF } from '@/features/library/api/import-ingredients';
import { LibraryBrowser } from '@/features/library/components/library-browser';
import { buttonClasses } from '@/components/ui/button';
import { hasRole, useSessionUser } from '@/lib/session';
import { requireUser } from '../../../guards';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    return null;
  };

export default function LibraryRoute() {
  const me = useSessionUser();
  const canWrite = hasRole(me, ['chemist', 'admin']);
  return (
    <>
      <title>Ingredient library · Packwright</title>
      <PageHeader
        title="Ingredient library"
        description="Everything a pack can be made of: grades, costs, densities, the heat-producing process each carries, and where the figures come from."
        action={
          <div className="flex flex-wrap gap-2">
            <a href={EXPORT_CSV_HREF} download className={buttonClasses('secondary')}>
              Export CSV
            </a>
            {canWrite && (
              <>
                <ButtonLink to="/library/import" variant="secondary">
                  Import CSV
                </ButtonLink>
                <ButtonLink to="/library/new">New ingredient</ButtonLink>
              </>
            )}
          </div>
        }
      />
      <Card>
        <CardBody>
          <LibraryBrowser />
        </CardBody>
      </Card>
    </>
  );
}
