import { useEffect, useState } from 'react';
import { useSearchParams } from 'react-router';
import { INGREDIENT_ROLES, INGREDIENT_SORTS, ingredientRoleSchema, type IngredientRole } from '@shared/schemas/library';
import { EmptyState } from '@/components/ui/empty-state';
import { Pager } from '@/components/ui/pager';
import { SelectField, TextField } from '@/components/ui/field';
import { QueryError } from '@/components/ui/query-error';
import { Loading } from '@/components/ui/spinner';
import { useIngredients, type IngredientListParams } from '../api/get-ingredients';
import { IngredientsTable, sortParamFromState, sortStateFromParam } from './ingredients-table';
import { ROLE_NAMES } from './labels';

const PAGE_SIZES = [25, 50, 100] as const;
type Sort = (typeof INGREDIENT_SORTS)[number];

/** Reads the list parameters from the address, so a filtered page can be shared and reloaded. */
export function useLibraryParams(): IngredientListParams {
  const [search] = useSearchParams();
  const role = ingredientRoleSchema.safeParse(search.get('role'));
  const sort = search.get('sort');
  const page = Number(search.get('page'));
  const pageSize = Number(search.get('pageSize'));
  return {
    q: search.get('q') || undefined,
    role: role.success ? role.data : undefined,
    sort: INGREDIENT_SORTS.includes(sort as Sort) ? (sort as Sort) : 'name',
    page: Number.isInteger(page) && page > 0 ? page : 1,
    pageSize: PAGE_SIZES.includes(pageSize as (typeof PAGE_SIZES)[number]) ? pageSize : 25,
  };
}

export function LibraryBrowser() {
  const params = useLibraryParams();
  const [, setSearch] = useSearchParams();
  const ingredients = useIngredients(params);
  const [draft, setDraft] = useState(params.q ?? '');

  const update = (patch: Record<string, string | undefined>) =>
    setSearch(
      (prev) => {
        const next = new URLSearchParams(prev);
        for (const [key, value] of Object.entries(patch)) {
          if (value === undefined || value === '') next.delete(key);
          else next.set(key, value);
        }
        return next;
      },
      { replace: true },
    );

  // Search as the user types, a moment after they stop.
  useEffect(() => {
    if ((params.q ?? '') === draft.trim()) return;
    const timer = setTimeout(() => update({ q: draft.trim() || undefined, page: undefined }), 300);
    return () => clearTimeout(timer);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [draft]);

  const total = ingredients.data?.total ?? 0;
  const pageSize = params.pageSize ?? 25;
  const page = params.page ?? 1;

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end gap-3">
        <TextField
          label="Search by name, grade or species"
          type="search"
          value={draft}
          onChange={(event) => setDraft(event.target.value)}
          containerClassName="min-w-64 flex-1"
          placeholder="e.g. ammonium, prilled"
        />
        <SelectField
          label="Role"
          value={params.role ?? ''}
          containerClassName="w-48"
          onChange={(event) => update({ role: event.target.value || undefined, page: undefined })}
        >
          <option value="">All roles</option>
          {INGREDIENT_ROLES.map((role: IngredientRole) => (
            <option key={role} value={role}>
              {ROLE_NAMES[role]}
            </option>
          ))}
        </SelectField>
      </div>

      {ingredients.isPending ? (
        <Loading label="Loading the ingredient library…" />
      ) : ingredients.isError ? (
        <QueryError error={ingredients.error} onRetry={() => void ingredients.refetch()} retrying={ingredients.isFetching} />
      ) : ingredients.data.items.length === 0 ? (
        <EmptyState title={params.q || params.role ? 'No ingredient matches' : 'The library is empty'}>
          {params.q || params.role
            ? 'Try a shorter search or another role.'
            : 'Add an ingredient or import a CSV file to start the library.'}
        </EmptyState>
      ) : (
        <>
          <IngredientsTable
            ingredients={ingredients.data.items}
            sorting={sortStateFromParam(params.sort)}
            onSortingChange={(sorting) => update({ sort: sortParamFromState(sorting), page: undefined })}
            stale={ingredients.isPlaceholderData}
          />
          <Pager
            noun="ingredient"
            label="Pages of the library"
            page={page}
            pageSize={pageSize}
            total={total}
            onPageChange={(p) => update({ page: String(p) })}
            pageSizes={PAGE_SIZES}
            onPageSizeChange={(size) => update({ pageSize: String(size), page: undefined })}
          />
        </>
      )}
    </div>
  );
}
