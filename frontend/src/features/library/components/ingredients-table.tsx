import { useMemo } from 'react';
import { Link, useNavigate } from 'react-router';
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  useReactTable,
  type SortingState,
} from '@tanstack/react-table';
import type { Ingredient } from '@shared/schemas/library';
import { Badge } from '@/components/ui/badge';
import { cn } from '@/components/ui/cn';
import { formatMoney, formatNumber } from '@/lib/format';
import { PROCESS_NAMES, ROLE_NAMES } from './labels';

const column = createColumnHelper<Ingredient>();

/** Columns the server can sort by (INGREDIENT_SORTS); the others are not sortable. */
const SORTABLE = new Set(['name', 'role', 'costPerKg', 'updatedAt']);

export function sortParamFromState(sorting: SortingState): string | undefined {
  const first = sorting[0];
  if (!first) return undefined;
  return `${first.desc ? '-' : ''}${first.id}`;
}

export function sortStateFromParam(sort: string | undefined): SortingState {
  if (!sort) return [{ id: 'name', desc: false }];
  const desc = sort.startsWith('-');
  return [{ id: desc ? sort.slice(1) : sort, desc }];
}

export function IngredientsTable({
  ingredients,
  sorting,
  onSortingChange,
  stale,
}: {
  ingredients: Ingredient[];
  sorting: SortingState;
  onSortingChange: (sorting: SortingState) => void;
  /** The rows shown are from the previous page or filter while the next one loads. */
  stale?: boolean;
}) {
  const navigate = useNavigate();
  const columns = useMemo(
    () => [
      column.accessor('name', {
        header: 'Name',
        cell: (info) => (
          <Link to={`/library/${info.row.original.id}`} className="font-bold text-ink-900 underline-offset-2 hover:underline">
            {info.getValue()}
          </Link>
        ),
      }),
      column.accessor('grade', { header: 'Grade', cell: (info) => info.getValue() || '—' }),
      column.accessor('role', {
        header: 'Role',
        cell: (info) => <Badge tone={info.getValue() === 'active' ? 'cool' : 'neutral'}>{ROLE_NAMES[info.getValue()]}</Badge>,
      }),
      column.accessor((row) => row.process?.kind ?? null, {
        id: 'process',
        header: 'Process',
        cell: (info) => {
          const kind = info.getValue();
          return kind ? PROCESS_NAMES[kind] : <span className="text-ink-400">none</span>;
        },
      }),
      column.accessor('costPerKg', {
        header: 'Cost per kg',
        meta: { numeric: true },
        cell: (info) => (
          <span title={info.row.original.currency}>{formatMoney(info.getValue(), info.row.original.currency)}</span>
        ),
      }),
      column.accessor('densityGPerMl', {
        header: 'Density (g/mL)',
        meta: { numeric: true },
        cell: (info) => formatNumber(info.getValue(), { maxFractionDigits: 3 }),
      }),
      column.accessor('sources', {
        header: 'Sources',
        cell: (info) => {
          const sources = info.getValue();
          if (sources.length === 0) return <span className="text-amber-700">none cited</span>;
          return (
            <span title={sources.join('\n')} className="block max-w-64 truncate">
              {sources.length > 1 ? `${sources.length} · ` : ''}
              {sources[0]}
            </span>
          );
        },
      }),
      column.accessor('version', { header: 'Version', meta: { numeric: true }, cell: (info) => info.getValue() }),
    ],
    [],
  );

  // The table instance is rebuilt each render by design; nothing here memoises its functions.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data: ingredients,
    columns,
    state: { sorting },
    manualSorting: true,
    manualPagination: true,
    enableSortingRemoval: false,
    enableMultiSort: false,
    onSortingChange: (updater) => onSortingChange(typeof updater === 'function' ? updater(sorting) : updater),
    getCoreRowModel: getCoreRowModel(),
    getRowId: (row) => String(row.id),
  });

  return (
    <div className={cn('-mx-5 overflow-x-auto transition-opacity', stale && 'opacity-60')} aria-busy={stale || undefined}>
      <table className="w-full min-w-[62rem] text-left text-small">
        <caption className="sr-only">Ingredient library. Column headers with a button sort the table.</caption>
        <thead className="border-b border-ink-100 text-caption font-bold tracking-wide text-ink-500 uppercase">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header, i) => {
                const sortable = SORTABLE.has(header.column.id);
                const sorted = header.column.getIsSorted();
                const numeric = (header.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric;
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}
                    className={cn('py-2', i === 0 ? 'px-5' : 'px-3', numeric && 'text-right')}
                  >
                    {sortable ? (
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        className="inline-flex items-center gap-1 uppercase hover:text-ink-800"
                      >
                        {flexRender(header.column.columnDef.header, header.getContext())}
                        <span aria-hidden="true">{sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}</span>
                        <span className="sr-only">
                          {sorted ? `, sorted ${sorted === 'asc' ? 'ascending' : 'descending'}` : ', sort'}
                        </span>
                      </button>
                    ) : (
                      flexRender(header.column.columnDef.header, header.getContext())
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody className="divide-y divide-ink-100">
          {table.getRowModel().rows.map((row) => (
            <tr
              key={row.id}
              className="cursor-pointer hover:bg-frost-50/60"
              onClick={(event) => {
                // The name is a link for keyboard users; a click anywhere else on the row opens it too.
                if ((event.target as HTMLElement).closest('a,button')) return;
                void navigate(`/library/${row.original.id}`);
              }}
            >
              {row.getVisibleCells().map((cell, i) => {
                const numeric = (cell.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric;
                return (
                  <td key={cell.id} className={cn('py-2.5 align-top', i === 0 ? 'px-5' : 'px-3', numeric && 'text-right tabular-nums')}>
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
