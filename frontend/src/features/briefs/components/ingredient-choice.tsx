import { useMemo, useState } from 'react';
import { Badge } from '@/components/ui/badge';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { EmptyState } from '@/components/ui/empty-state';
import { useBriefIngredients } from '../api/get-brief-ingredients';

const ROLE_WORDS: Record<string, string> = { active: 'active', solvent: 'solvent', additive: 'additive', packaging: 'packaging' };

/**
 * Allow or exclude library ingredients, one row each. Allowing any narrows the optimiser to
 * those; excluding one always leaves it out. An ingredient is never both.
 */
export function IngredientChoice({
  allowed,
  excluded,
  onChange,
  error,
}: {
  allowed: string[];
  excluded: string[];
  onChange: (allowed: string[], excluded: string[]) => void;
  error?: string;
}) {
  const ingredients = useBriefIngredients();
  const [filter, setFilter] = useState('');
  const rows = useMemo(() => {
    const list = ingredients.data?.items ?? [];
    const q = filter.trim().toLowerCase();
    return q ? list.filter((i) => `${i.name} ${i.grade}`.toLowerCase().includes(q)) : list;
  }, [ingredients.data, filter]);

  if (ingredients.isPending) return <Loading label="Loading the ingredient library…" />;
  if (ingredients.isError)
    return <QueryError title="The ingredient library could not be loaded" error={ingredients.error} onRetry={() => void ingredients.refetch()} />;
  if (ingredients.data.items.length === 0)
    return <EmptyState title="The ingredient library is empty">Chemists add ingredients in the ingredient library.</EmptyState>;

  const allowedSet = new Set(allowed);
  const excludedSet = new Set(excluded);
  const toggle = (id: string, list: 'allowed' | 'excluded', on: boolean) => {
    const a = new Set(allowedSet);
    const e = new Set(excludedSet);
    if (list === 'allowed') {
      if (on) {
        a.add(id);
        e.delete(id);
      } else a.delete(id);
    } else if (on) {
      e.add(id);
      a.delete(id);
    } else e.delete(id);
    onChange([...a], [...e]);
  };

  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div className="flex flex-col gap-1">
          <label htmlFor="brief-ingredient-filter" className="text-small font-semibold text-ink-800">
            Find an ingredient
          </label>
          <input
            id="brief-ingredient-filter"
            type="search"
            value={filter}
            onChange={(e) => setFilter(e.target.value)}
            className="h-9 w-64 rounded-control border border-ink-200 bg-surface px-3 text-small"
          />
        </div>
        <p className="text-small text-ink-600" aria-live="polite">
          {allowed.length === 0 ? 'The whole library is allowed' : `${allowed.length} allowed`} · {excluded.length} excluded
        </p>
      </div>
      {error && <p className="text-caption font-semibold text-rust-600">{error}</p>}
      <div className="max-h-72 overflow-auto rounded-control border border-ink-100">
        <table className="w-full text-left text-small">
          <caption className="sr-only">Allowed and excluded ingredients</caption>
          <thead className="sticky top-0 bg-ink-50 text-caption font-bold text-ink-600">
            <tr>
              <th scope="col" className="px-3 py-1.5">Ingredient</th>
              <th scope="col" className="px-3 py-1.5">Role</th>
              <th scope="col" className="px-3 py-1.5 text-center">Allowed</th>
              <th scope="col" className="px-3 py-1.5 text-center">Excluded</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-ink-100">
            {rows.map((i) => {
              const id = String(i.id);
              const label = i.grade ? `${i.name} (${i.grade})` : i.name;
              return (
                <tr key={id} className={excludedSet.has(id) ? 'bg-rust-50/50' : allowedSet.has(id) ? 'bg-moss-50/60' : undefined}>
                  <th scope="row" className="px-3 py-1 font-semibold text-ink-800">
                    {i.name} {i.grade && <span className="font-normal text-ink-500">{i.grade}</span>}
                  </th>
                  <td className="px-3 py-1">
                    <Badge>{ROLE_WORDS[i.role] ?? i.role}</Badge>
                  </td>
                  <td className="px-3 py-1 text-center">
                    <input
                      type="checkbox"
                      className="size-4"
                      aria-label={`Allow ${label}`}
                      checked={allowedSet.has(id)}
                      onChange={(e) => toggle(id, 'allowed', e.target.checked)}
                    />
                  </td>
                  <td className="px-3 py-1 text-center">
                    <input
                      type="checkbox"
                      className="size-4"
                      aria-label={`Exclude ${label}`}
                      checked={excludedSet.has(id)}
                      onChange={(e) => toggle(id, 'excluded', e.target.checked)}
                    />
                  </td>
                </tr>
              );
            })}
            {rows.length === 0 && (
              <tr>
                <td colSpan={4} className="px-3 py-3 text-center text-ink-500">
                  No ingredient matches “{filter}”.
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>
    </div>
  );
}
