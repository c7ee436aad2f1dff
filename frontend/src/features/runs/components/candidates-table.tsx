import { useMemo, useState } from 'react';
import { Link } from 'react-router';
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from '@tanstack/react-table';
import type { CandidateRecord } from '@shared/schemas/runs';
import { Badge } from '@/components/ui/badge';
import { cn } from '@/components/ui/cn';
import { EmptyState } from '@/components/ui/empty-state';
import {
  CONSTRAINT_WORDS,
  VERIFICATION_WORDS,
  candidateRef,
  chemistryName,
  hazardSummary,
  shortIngredientName,
} from '@/lib/candidate-figures';
import { formatMoney, formatNumber } from '@/lib/format';

/** Passing candidates first, then the unverified, then those that could not be verified, then misses. */
const STATUS_ORDER: Record<string, number> = { passed: 0, 'not-verified': 1, failed: 2, missed: 3 };
export const MAX_SELECTED = 4;

/** Candidates in the order the table opens with: verified passes by rank, misses below them. */
export function rankedOrder(a: CandidateRecord, b: CandidateRecord): number {
  return (STATUS_ORDER[a.verification.status] ?? 9) - (STATUS_ORDER[b.verification.status] ?? 9) || a.rank - b.rank;
}

const col = createColumnHelper<CandidateRecord>();

export function CandidatesTable({
  candidates,
  packType,
  currency,
  selectedIds,
  onToggle,
}: {
  candidates: CandidateRecord[];
  packType: 'cold' | 'warm';
  currency: string;
  selectedIds: readonly number[];
  onToggle: (id: number) => void;
}) {
  const [sorting, setSorting] = useState<SortingState>([{ id: 'rank', desc: false }]);
  const cold = packType === 'cold';
  const selected = useMemo(() => new Set(selectedIds), [selectedIds]);
  const full = selectedIds.length >= MAX_SELECTED;

  const columns = useMemo(
    () => [
      col.display({
        id: 'select',
        header: () => <span className="sr-only">Select to compare</span>,
        cell: ({ row }) => {
          const c = row.original;
          const on = selected.has(c.id);
          return (
            <input
              type="checkbox"
              className="size-4"
              checked={on}
              disabled={!on && full}
              onChange={() => onToggle(c.id)}
              aria-label={`Select ${candidateRef(c)} (${chemistryName(c)})`}
              title={!on && full ? `At most ${MAX_SELECTED} at once` : undefined}
            />
          );
        },
      }),
      col.accessor('rank', {
        header: 'Rank',
        sortingFn: (a, b) => rankedOrder(a.original, b.original),
        cell: ({ row }) => (
          <span className="flex items-center gap-1 font-bold tabular-nums">
            {row.original.rank}
            {row.original.pareto && (
              <span className="text-caption font-semibold text-frost-700" title="On the Pareto front over cost, mass, hold margin and hazard score">
                ◆<span className="sr-only"> Pareto front</span>
              </span>
            )}
          </span>
        ),
      }),
      col.accessor((c) => chemistryName(c), {
        id: 'chemistry',
        header: 'Chemistry',
        cell: ({ row, getValue }) => (
          <span>
            <Link to={`/candidates/${row.original.id}`} className="font-semibold text-frost-700 hover:underline">
              {candidateRef(row.original)} {getValue()}
            </Link>
            {row.original.state === 'shortlisted' && (
              <Badge tone="success" className="ml-1.5">
                Shortlisted
              </Badge>
            )}
            {(row.original.incompatibilities?.length ?? 0) > 0 && (
              <span className="mt-0.5 flex flex-col gap-0.5">
                <Badge tone="caution" className="self-start">
                  Incompatible
                </Badge>
                <ul className="max-w-64 text-caption text-rust-700">
                  {row.original.incompatibilities!.map((i) => (
                    <li key={`${i.kind}:${i.subject}`}>{i.message}</li>
                  ))}
                </ul>
              </span>
            )}
          </span>
        ),
      }),
      col.display({
        id: 'composition',
        header: 'Composition (g)',
        cell: ({ row }) => (
          <ul className="flex flex-col text-caption text-ink-700">
            {row.original.composition
              .filter((e) => e.massG > 0)
              .map((e) => (
                <li key={e.ingredientId} className="tabular-nums">
                  {formatNumber(e.massG, { maxFractionDigits: 1 })}&#8239;g {shortIngredientName(e.name)}
                </li>
              ))}
          </ul>
        ),
      }),
      // Only simulated figures: a candidate that was not simulated shows none (the run lists none such).
      col.accessor((c) => (cold ? c.predictedMinTempC : c.predictedMaxTempC) ?? Number.NaN, {
        id: 'extreme',
        header: cold ? 'Coldest (°C)' : 'Warmest (°C)',
        sortingFn: 'basic',
        cell: ({ getValue }) => (
          <span className="tabular-nums" title="Time model">
            {Number.isFinite(getValue()) ? formatNumber(getValue(), { maxFractionDigits: 1 }) : '—'}
          </span>
        ),
      }),
      col.accessor((c) => c.minutesInBand ?? c.verification.minutesInBand ?? -1, {
        id: 'inBand',
        header: 'In band (min)',
        sortingFn: 'basic',
        cell: ({ getValue }) => <span className="tabular-nums">{getValue() < 0 ? '—' : formatNumber(getValue(), { maxFractionDigits: 1 })}</span>,
      }),
      col.accessor('massG', {
        header: 'Mass (g)',
        cell: ({ getValue }) => <span className="tabular-nums">{formatNumber(getValue(), { maxFractionDigits: 0 })}</span>,
      }),
      col.accessor('unitCostValue', {
        header: `Cost (${currency})`,
        cell: ({ row }) => <span className="tabular-nums">{formatMoney(row.original.unitCost, currency)}</span>,
      }),
      col.accessor((c) => c.hazardScore, {
        id: 'hazard',
        header: 'Hazards',
        sortingFn: 'basic',
        cell: ({ row }) => {
          const h = hazardSummary(row.original);
          return (
            <div className="flex max-w-56 flex-col gap-0.5 text-caption">
              <span className="font-semibold text-ink-900">
                {h.signalWord ?? 'No signal word'} · score {formatNumber(h.score, { maxFractionDigits: 1 })}
              </span>
              {h.pictograms.length > 0 && <span className="tabular-nums text-ink-700">{h.pictograms.join(' ')}</span>}
              {h.flags.length > 0 && (
                <ul className="flex flex-wrap gap-1">
                  {h.flags.map((f) => (
                    <li key={f} className="rounded-full bg-rust-50 px-2 py-0.5 font-semibold text-rust-700">
                      {f}
                    </li>
                  ))}
                </ul>
              )}
            </div>
          );
        },
      }),
      col.display({
        id: 'binding',
        header: 'Binding constraints',
        cell: ({ row }) =>
          row.original.bindingConstraints.length ? (
            <ul className="flex max-w-48 flex-wrap gap-1 text-caption text-ink-700">
              {row.original.bindingConstraints.map((b) => (
                <li key={b.id} title={b.label} className="rounded-full bg-ink-100 px-2 py-0.5 font-semibold">
                  {CONSTRAINT_WORDS[b.kind] ?? b.kind}
                  <span className="sr-only">: {b.label}</span>
                </li>
              ))}
            </ul>
          ) : (
            <span className="text-caption text-ink-500">none</span>
          ),
      }),
      col.accessor((c) => STATUS_ORDER[c.verification.status] ?? 9, {
        id: 'verification',
        header: 'Verification',
        sortingFn: 'basic',
        cell: ({ row }) => {
          const v = row.original.verification;
          const w = VERIFICATION_WORDS[v.status];
          return (
            <div className="flex max-w-64 flex-col gap-0.5">
              <Badge tone={w.tone} className="self-start">
                {w.label}
              </Badge>
              {v.reasons.length > 0 && (
                <ul className="list-disc pl-4 text-caption text-ink-700">
                  {v.reasons.map((r) => (
                    <li key={r}>{r}</li>
                  ))}
                </ul>
              )}
            </div>
          );
        },
      }),
    ],
    [selected, full, onToggle, cold, currency],
  );

  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data: candidates,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getRowId: (c) => String(c.id),
  });

  if (candidates.length === 0)
    return (
      <EmptyState title="No feasible candidate">
        No set of actives meets every limit of this brief. The infeasible sets below say which constraint stops each one and by how much.
      </EmptyState>
    );

  return (
    <div className="-mx-5 overflow-x-auto" tabIndex={0} aria-label="Ranked candidates, scrolls sideways">
      <table className="w-full min-w-[72rem] text-left text-small">
        <caption className="sr-only">Ranked candidates; column headers sort the table</caption>
        <thead className="sticky top-0 z-10 border-b border-ink-100 bg-surface text-caption font-bold text-ink-500">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const sortable = header.column.getCanSort() && header.column.id !== 'select' && header.column.id !== 'composition' && header.column.id !== 'binding';
                const dir = header.column.getIsSorted();
                return (
                  <th
                    key={header.id}
                    scope="col"
                    className={cn('px-3 py-2 first:pl-5 last:pr-5 align-bottom')}
                    aria-sort={dir === 'asc' ? 'ascending' : dir === 'desc' ? 'descending' : undefined}
                  >
                    {sortable ? (
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        className="inline-flex items-center gap-1 rounded-control text-left uppercase tracking-wide hover:text-ink-900"
                      >
                        {flexRender(header.column.columnDef.header, header.getContext())}
                        <span aria-hidden="true" className="text-ink-400">
                          {dir === 'asc' ? '▲' : dir === 'desc' ? '▼' : '↕'}
                        </span>
                      </button>
                    ) : (
                      <span className="uppercase tracking-wide">{flexRender(header.column.columnDef.header, header.getContext())}</span>
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody className="divide-y divide-ink-100">
          {table.getRowModel().rows.map((row) => {
            const c = row.original;
            const missed = c.verification.status === 'missed' || c.verification.status === 'failed';
            return (
              <tr
                key={row.id}
                data-candidate-id={c.id}
                className={cn('align-top', selected.has(c.id) ? 'bg-frost-50' : missed ? 'bg-rust-50/40' : undefined)}
              >
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-3 py-2 first:pl-5 last:pr-5">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            );
          })}
        </tbody>
      </table>
      <p className="px-5 pt-2 text-caption text-ink-500">
        ◆ on the Pareto front over cost, mass, hold margin and hazard score. Every figure is from the time model under the
        brief&apos;s conditions. Hazards: the mixture&apos;s GHS signal word and pictogram codes, and flags from the hazard notes
        (open a candidate for the notes); sort by the Hazards header to rank by hazard score. Incompatible: its ingredients do
        not belong together, said in words; such a mixture ranks after the compatible ones unless the brief allows it.
      </p>
    </div>
  );
}
