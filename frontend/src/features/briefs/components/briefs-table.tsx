import type { ReactNode } from 'react';
import { Link, useNavigate } from 'react-router';
import type { BriefRecord } from '@shared/schemas/runs';
import { RunStatusBadge } from '@/components/status/run-status-badge';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { FormMessage } from '@/components/ui/field';
import { errorMessage } from '@/lib/api-client';
import { formatCount, formatQuantity, formatWhen } from '@/lib/format';
import { useDuplicateBrief } from '../api/save-brief';
import { PACK_TYPE_NAMES } from './labels';

/** The target in one phrase: "≤ 5 °C within 3 min, held 15 min". */
export function targetPhrase(spec: BriefRecord['spec']): string {
  const sign = spec.packType === 'cold' ? '≤' : '≥';
  return `${sign} ${formatQuantity(spec.targetTempC, '°C')} within ${formatQuantity(spec.reachWithinMin, 'min')}, held ${formatQuantity(spec.holdMin, 'min')}`;
}

export function BriefsTable({ briefs, canWrite, newAction, archived = false }: { briefs: BriefRecord[]; canWrite: boolean; newAction?: ReactNode; archived?: boolean }) {
  const duplicate = useDuplicateBrief();
  const navigate = useNavigate();
  if (briefs.length === 0 && archived)
    return (
      <EmptyState title="No archived briefs">
        A brief archived from its page shows here, read-only, with its runs, candidates and reviews.
      </EmptyState>
    );
  if (briefs.length === 0)
    return (
      <EmptyState title="No briefs yet" action={newAction}>
        {canWrite ? 'Write the first brief: what the pack must do, and within which limits.' : 'Designers write briefs; they will show here.'}
      </EmptyState>
    );
  return (
    <div className="flex flex-col gap-3">
      {duplicate.isError && <FormMessage>{errorMessage(duplicate.error)}</FormMessage>}
      <div className="-mx-5 overflow-x-auto">
        <table className="w-full min-w-[52rem] text-left text-small">
          <caption className="sr-only">Briefs of this workspace</caption>
          <thead className="border-b border-ink-100 text-caption font-bold tracking-wide text-ink-500 uppercase">
            <tr>
              <th scope="col" className="px-5 py-2">Brief</th>
              <th scope="col" className="px-3 py-2">Target</th>
              <th scope="col" className="px-3 py-2">Limits</th>
              <th scope="col" className="px-3 py-2">Last run</th>
              <th scope="col" className="px-3 py-2">Changed</th>
              <th scope="col" className="px-5 py-2 text-right"><span className="sr-only">Actions</span></th>
            </tr>
          </thead>
          <tbody className="divide-y divide-ink-100">
            {briefs.map((b) => (
              <tr key={b.id} className="align-top">
                <th scope="row" className="px-5 py-3 font-normal">
                  <Link to={`/briefs/${b.id}`} className="font-bold text-ink-900 hover:text-frost-700 hover:underline">
                    {b.name}
                  </Link>
                  <div className="mt-0.5">
                    <Badge tone={b.packType === 'cold' ? 'cool' : 'warm'}>{PACK_TYPE_NAMES[b.packType]}</Badge>
                  </div>
                </th>
                <td className="px-3 py-3 tabular-nums text-ink-700">{targetPhrase(b.spec)}</td>
                <td className="px-3 py-3 tabular-nums text-ink-700">
                  ≤ {formatQuantity(b.spec.maxMassG, 'g', 0)}
                  {b.spec.maxUnitCost !== null && <> · ≤ {b.spec.maxUnitCost}</>}
                </td>
                <td className="px-3 py-3">
                  {b.lastRun ? (
                    <Link to={`/runs/${b.lastRun.id}`} className="inline-flex flex-col gap-0.5 rounded-control hover:underline">
                      <span className="flex items-center gap-2">
                        <RunStatusBadge status={b.lastRun.status} />
                        <span className="text-caption text-ink-500">{formatWhen(b.lastRun.createdAt)}</span>
                      </span>
                      <span className="text-caption text-ink-600">{formatCount(b.lastRun.candidates, 'candidate')}</span>
                    </Link>
                  ) : (
                    <span className="text-ink-500">Not run yet</span>
                  )}
                </td>
                <td className="px-3 py-3 text-ink-600">
                  {formatWhen(b.updatedAt)}
                  {b.updatedBy && <div className="text-caption text-ink-500">by {b.updatedBy}</div>}
                </td>
                <td className="px-5 py-3 text-right">
                  {canWrite && (
                    <Button
                      variant="ghost"
                      size="sm"
                      pending={duplicate.isPending && duplicate.variables === b.id}
                      onClick={() => duplicate.mutate(b.id, { onSuccess: (copy) => void navigate(`/briefs/${copy.id}?edit=1`) })}
                    >
                      Duplicate<span className="sr-only"> {b.name}</span>
                    </Button>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
