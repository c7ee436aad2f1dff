import { useState } from 'react';
import type { InfeasibleSet } from '@shared/schemas/briefs';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { chemistryName } from '@/lib/candidate-figures';
import { formatNumber } from '@/lib/format';

const SHOWN = 12;

/** Sets of actives no composition can make work, each with what stops it and by how much. */
export function InfeasibleSets({ sets, currency }: { sets: InfeasibleSet[]; currency: string }) {
  const [all, setAll] = useState(false);
  if (sets.length === 0) return <EmptyState title="Every set of actives was feasible" />;
  const shown = all ? sets : sets.slice(0, SHOWN);
  const unit = (u: string) => (u === 'currency' ? currency : u);
  return (
    <div className="flex flex-col gap-3">
      <div className="-mx-5 overflow-x-auto">
        <table className="w-full min-w-[48rem] text-left text-small">
          <caption className="sr-only">Infeasible sets of actives and what stops them</caption>
          <thead className="border-b border-ink-100 text-caption font-bold tracking-wide text-ink-500 uppercase">
            <tr>
              <th scope="col" className="px-5 py-2">Actives</th>
              <th scope="col" className="px-3 py-2">Stopped by</th>
              <th scope="col" className="px-3 py-2 text-right">Short by</th>
              <th scope="col" className="px-5 py-2">Relaxing it</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-ink-100">
            {shown.map((s) =>
              (s.blocking.length ? s.blocking : [null]).map((b, k) => (
                <tr key={`${s.setIds.join('+')}-${b?.constraintId ?? 'none'}`} className="align-top">
                  {k === 0 && (
                    <th scope="row" rowSpan={Math.max(1, s.blocking.length)} className="px-5 py-2 font-semibold text-ink-900">
                      {chemistryName(s)}
                    </th>
                  )}
                  <td className="px-3 py-2 text-ink-700">{b ? b.label : s.reason}</td>
                  <td className="px-3 py-2 text-right tabular-nums font-semibold text-rust-700">
                    {b
                      ? b.shortfall === null
                        ? 'no amount of this set'
                        : `${formatNumber(b.shortfall, { maxFractionDigits: b.shortfall < 10 ? 2 : 1 })}\u202f${unit(b.unit)}`
                      : '—'}
                  </td>
                  <td className="px-5 py-2 text-ink-600">{b ? (b.relaxation === 'alone' ? 'enough on its own' : 'only with the others listed') : ''}</td>
                </tr>
              )),
            )}
          </tbody>
        </table>
      </div>
      {sets.length > SHOWN && (
        <Button variant="ghost" size="sm" className="self-start" onClick={() => setAll((v) => !v)} aria-expanded={all}>
          {all ? `Show the first ${SHOWN}` : `Show all ${sets.length} infeasible sets`}
        </Button>
      )}
    </div>
  );
}
