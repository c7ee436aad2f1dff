import { Pager } from '@/components/ui/pager';
import { useEffect, useState } from 'react';
import { useSearchParams } from 'react-router';
import { PHASES, phaseSchema, type Species } from '@shared/schemas/library';
import { Badge } from '@/components/ui/badge';
import { cn } from '@/components/ui/cn';
import { EmptyState } from '@/components/ui/empty-state';
import { SelectField, TextField } from '@/components/ui/field';
import { QueryError } from '@/components/ui/query-error';
import { Loading } from '@/components/ui/spinner';
import { formatNumber } from '@/lib/format';
import { Formula, phaseInWords } from '@/components/ui/formula';
import { useSpecies, type SpeciesListParams } from '../api/get-species';

export const PHASE_NAMES: Record<(typeof PHASES)[number], string> = {
  cr: 'crystal (cr)',
  l: 'liquid (l)',
  g: 'gas (g)',
  aq: 'aqueous, standard state (aq)',
  ai: 'aqueous, ionised (ai)',
  ao: 'aqueous, undissociated (ao)',
};

const PAGE_SIZE = 50;

function useSpeciesParams(): SpeciesListParams {
  const [search] = useSearchParams();
  const phase = phaseSchema.safeParse(search.get('phase'));
  const page = Number(search.get('page'));
  return {
    q: search.get('q') || undefined,
    phase: phase.success ? phase.data : undefined,
    page: Number.isInteger(page) && page > 0 ? page : 1,
    pageSize: PAGE_SIZE,
  };
}

export function SpeciesBrowser() {
  const params = useSpeciesParams();
  const [, setSearch] = useSearchParams();
  const species = useSpecies(params);
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

  useEffect(() => {
    if ((params.q ?? '') === draft.trim()) return;
    const timer = setTimeout(() => update({ q: draft.trim() || undefined, page: undefined }), 300);
    return () => clearTimeout(timer);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [draft]);

  const total = species.data?.total ?? 0;
  const page = params.page ?? 1;

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end gap-3">
        <TextField
          label="Search by formula or name"
          type="search"
          value={draft}
          onChange={(event) => setDraft(event.target.value)}
          containerClassName="min-w-64 flex-1"
          placeholder="e.g. NH4NO3, calcium"
        />
        <SelectField
          label="Phase"
          value={params.phase ?? ''}
          containerClassName="w-64"
          onChange={(event) => update({ phase: event.target.value || undefined, page: undefined })}
        >
          <option value="">All phases</option>
          {PHASES.map((phase) => (
            <option key={phase} value={phase}>
              {PHASE_NAMES[phase]}
            </option>
          ))}
        </SelectField>
      </div>

      {species.isPending ? (
        <Loading label="Loading species data…" />
      ) : species.isError ? (
        <QueryError error={species.error} onRetry={() => void species.refetch()} retrying={species.isFetching} />
      ) : species.data.items.length === 0 ? (
        <EmptyState title="No species match">Try the formula without charges or phase, or another phase.</EmptyState>
      ) : (
        <>
          <SpeciesTable species={species.data.items} stale={species.isPlaceholderData} />
          <Pager noun="species" plural="species" label="Pages of species data" page={page} pageSize={PAGE_SIZE} total={total} onPageChange={(p) => update({ page: String(p) })} />
        </>
      )}
    </div>
  );
}

function SpeciesTable({ species, stale }: { species: Species[]; stale: boolean }) {
  const num = (value: number | null, digits = 2) => formatNumber(value, { maxFractionDigits: digits });
  return (
    <div className={cn('-mx-5 overflow-x-auto transition-opacity', stale && 'opacity-60')} aria-busy={stale || undefined}>
      <table className="w-full min-w-[60rem] text-left text-small">
        <caption className="sr-only">Species data at 298.15 K and 1 bar</caption>
        <thead className="border-b border-ink-100 text-caption font-bold tracking-wide text-ink-500">
          <tr>
            <th scope="col" className="px-5 py-2 uppercase">Species</th>
            <th scope="col" className="px-3 py-2 uppercase">Phase</th>
            <th scope="col" className="px-3 py-2 text-right">ΔfH° (kJ/mol)</th>
            <th scope="col" className="px-3 py-2 text-right">S° (J/(mol·K))</th>
            <th scope="col" className="px-3 py-2 text-right">Cp° (J/(mol·K))</th>
            <th scope="col" className="px-3 py-2 text-right">Molar mass (g/mol)</th>
            <th scope="col" className="px-3 py-2 uppercase">Source</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-ink-100">
          {species.map((s) => (
            <tr key={s.id}>
              <th scope="row" className="px-5 py-2 text-left align-top font-normal">
                <Formula text={s.formula} className="font-bold text-ink-900" />
                <span className="block text-caption text-ink-500">{s.name}</span>
              </th>
              <td className="px-3 py-2 align-top">
                <span title={PHASE_NAMES[s.phase]}>{phaseInWords(s.phase)}</span>
                {s.scope === 'workspace' && (
                  <Badge tone="caution" className="ml-2">
                    {s.correctsId ? 'corrected here' : 'added here'}
                  </Badge>
                )}
              </td>
              <td className="px-3 py-2 text-right align-top tabular-nums">{num(s.dfH_kJ_per_mol)}</td>
              <td className="px-3 py-2 text-right align-top tabular-nums">{num(s.S_J_per_mol_K)}</td>
              <td className="px-3 py-2 text-right align-top tabular-nums">{num(s.Cp_J_per_mol_K)}</td>
              <td className="px-3 py-2 text-right align-top tabular-nums">{num(s.molarMass_g_per_mol, 3)}</td>
              <td className="px-3 py-2 align-top text-caption text-ink-600">
                <span className="line-clamp-2 max-w-80" title={s.source}>
                  {s.source}
                </span>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
