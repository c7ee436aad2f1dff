import type { QueryClient } from '@tanstack/react-query';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router';
import { Badge } from '@/components/ui/badge';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { QueryError } from '@/components/ui/query-error';
import { Loading } from '@/components/ui/spinner';
import { getIngredientQueryOptions, useIngredient } from '@/features/library/api/get-ingredient';
import { IngredientAttachments } from '@/features/library/components/ingredient-attachments';
import { IngredientForm } from '@/features/library/components/ingredient-form';
import { IngredientHistory } from '@/features/library/components/ingredient-history';
import { formatDateTime } from '@/lib/format';
import { hasRole, useSessionUser } from '@/lib/session';
import { requireUser } from '../../../guards';
import { idFrom } from '@/lib/route-params';


export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    const id = idFrom(params.id);
    if (id) void queryClient.prefetchQuery(getIngredientQueryOptions(id));
    return null;
  };

export default function IngredientRoute() {
  const me = useSessionUser();
  const id = idFrom(useParams().id);
  const ingredient = useIngredient(id);
  const canWrite = hasRole(me, ['chemist', 'admin']);

  const back = (
    <p className="mb-2 text-small">
      <Link to="/library" className="font-semibold text-frost-700 hover:underline">
        ← Ingredient library
      </Link>
    </p>
  );

  if (ingredient.isPending) return <>{back}<Loading label="Loading the ingredient…" /></>;
  if (ingredient.isError)
    return (
      <>
        {back}
        <QueryError
          title="This ingredient could not be loaded"
          error={ingredient.error}
          onRetry={() => void ingredient.refetch()}
          retrying={ingredient.isFetching}
        />
      </>
    );

  const item = ingredient.data;
  return (
    <>
      <title>{`${item.name} · Ingredient library · Packwright`}</title>
      {back}
      <PageHeader
        title={item.name}
        description={
          <>
            {item.grade || 'No grade given'} · version {item.version} · last changed {formatDateTime(item.updatedAt)}
            {item.updatedBy ? ` by ${item.updatedBy}` : ''}
          </>
        }
        action={!canWrite ? <Badge>Read only</Badge> : undefined}
      />
      <div className="grid grid-cols-1 items-start gap-gutter xl:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <Card>
          <CardHeader title="Details" description="Figures, the heat-producing process and the sources behind them." />
          <CardBody>
            {/* Keyed by id: another ingredient starts a fresh form; a reload resets it in place. */}
            <IngredientForm
              key={`${item.id}`}
              ingredient={item}
              currency={me.workspace.currency}
              canWrite={canWrite}
              onReload={async () => (await ingredient.refetch()).data}
            />
          </CardBody>
        </Card>
        <div className="flex flex-col gap-gutter">
          <Card>
            <CardHeader title="Safety data sheets" description="Attached files (PDF)." />
            <CardBody>
              <IngredientAttachments ingredientId={item.id} canWrite={canWrite} />
            </CardBody>
          </Card>
          <Card>
            <CardHeader title="History" description="Who changed what, newest first." />
            <CardBody>
              <IngredientHistory ingredientId={item.id} />
            </CardBody>
          </Card>
        </div>
      </div>
    </>
  );
}
