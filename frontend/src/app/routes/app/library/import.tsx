import type { QueryClient } from '@tanstack/react-query';
import { Link, type LoaderFunctionArgs } from 'react-router';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { CsvImport } from '@/features/library/components/csv-import';
import { requireRole } from '../../../guards';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireRole(queryClient, request, ['chemist', 'admin']);
    return null;
  };

export default function ImportIngredientsRoute() {
  return (
    <>
      <title>Import ingredients · Packwright</title>
      <p className="mb-2 text-small">
        <Link to="/library" className="font-semibold text-frost-700 hover:underline">
          ← Ingredient library
        </Link>
      </p>
      <PageHeader
        title="Import ingredients from CSV"
        description="Check the file first: every row is validated and nothing is written. The import itself is all or nothing."
      />
      <Card className="max-w-5xl">
        <CardHeader title="CSV file" />
        <CardBody>
          <CsvImport />
        </CardBody>
      </Card>
    </>
  );
}
