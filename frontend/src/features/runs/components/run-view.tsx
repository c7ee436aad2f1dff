import { useCallback, useMemo, useState, type ReactNode } from 'react';
import { Link } from 'react-router';
import type { CandidateRecord, RunDetail } from '@shared/schemas/runs';
import { RunStatusBadge, isRunActive } from '@/components/status/run-status-badge';
import { Alert } from '@/components/ui/alert';
import { ButtonLink } from '@/components/ui/button';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { candidateRef, chemistryName, missSummary } from '@/lib/candidate-figures';
import { formatCount, formatDateTime, formatDuration, formatMoney, formatNumber } from '@/lib/format';
import { CandidatesTable, MAX_SELECTED, rankedOrder } from './candidates-table';
import { InfeasibleSets } from './infeasible-sets';
import { RunProgress } from './run-progress';
import { failureAdvice } from '../lib/run-health';
import { TradeOffView } from './trade-off-view';

/**
 * One run: its progress while it works, then the ranked candidates, the trade-off view and the
 * infeasible sets. The selection (up to four candidates) is shared by the table and the plots.
 */
export function RunView({
  run,
  canWrite,
  selectionActions,
}: {
  run: RunDetail;
  canWrite: boolean;
  /** Actions on the selected candidates (the shortlist), composed by the page. */
  selectionActions?: (selected: CandidateRecord[]) => ReactNode;
}) {
  const ordered = useMemo(() => [...run.candidates].sort(rankedOrder), [run.candidates]);
  // Only candidates that meet the brief in simulation are ranked; simulated misses are listed apart.
  const passing = useMemo(() => ordered.filter((c) => c.verification.status === 'passed'), [ordered]);
  const misses = useMemo(() => ordered.filter((c) => c.verification.status !== 'passed'), [ordered]);
  const [selectedIds, setSelectedIds] = useState<number[]>([]);
  const toggle = useCallback(
    (id: number) =>
      setSelectedIds((ids) => (ids.includes(id) ? ids.filter((x) => x !== id) : ids.length >= MAX_SELECTED ? ids : [...ids, id])),
    [],
  );
  // The first candidate is in focus until someone chooses.
  const selected = selectedIds.map((id) => run.candidates.find((c) => c.id === id)).filter((c): c is CandidateRecord => !!c);
  const focus = selected.length ? selected : passing.slice(0, 1);
  const active = isRunActive(run.status);
  const finished = run.status === 'succeeded' || (run.status === 'cancelled' && run.candidates.length > 0);

  return (
    <div className="flex flex-col gap-gutter">
      <p className="flex flex-wrap items-center gap-x-3 gap-y-1 text-small text-ink-600">
        <RunStatusBadge status={run.status} />
        <span>
          Started {formatDateTime(run.createdAt)}
          {run.createdBy ? ` by ${run.createdBy}` : ''}
        </span>
        {run.finishedAt && <span>took {formatDuration(run.startedAt ?? run.createdAt, run.finishedAt)}</span>}
        <span>
          brief version {run.briefVersion} ·{' '}
          <Link to={`/briefs/${run.briefId}`} className="font-semibold text-frost-700 hover:underline">
            {run.brief.name}
          </Link>
        </span>
        {run.stats && (
          <span className="tabular-nums">
            {formatCount(run.stats.setsEnumerated ?? 0, 'set')} tried · {formatCount(run.stats.feasibleSets ?? 0, 'feasible set')} ·{' '}
            {formatCount(run.stats.verified ?? 0, 'candidate')} simulated · {formatCount(passing.length, 'meets', 'meet')} the brief
          </span>
        )}
      </p>

      {active && (
        <Card>
          <CardHeader title="Optimising" description="The page follows the run; you can leave and come back." />
          <CardBody>
            <RunProgress run={run} canCancel={canWrite} />
          </CardBody>
        </Card>
      )}
      {run.status === 'failed' && (
        <Alert tone="danger" title="This run failed">
          {run.error ?? 'The optimiser stopped without saying why.'} {failureAdvice(run)}
        </Alert>
      )}
      {run.status === 'cancelled' && (
        <Alert tone="caution" title="This run was cancelled">
          {run.candidates.length ? 'The candidates found before it stopped are below.' : 'It stopped before any candidate was found.'}
        </Alert>
      )}
      {run.warnings.length > 0 && <RunWarnings warnings={run.warnings} />}

      {finished && (
        <>
          <Card>
            <CardHeader
              title="Candidates that meet the brief"
              description={`${formatCount(passing.length, 'candidate')}, each simulated with the time model under the brief's conditions, ranked by the brief's objective. Select two to four to compare them; the plots follow your selection.`}
              action={
                <div className="flex flex-wrap items-center gap-2" aria-live="polite">
                  <span className="text-small text-ink-600">{selected.length ? `${selected.length} selected` : 'None selected'}</span>
                  {selected.length >= 2 ? (
                    <ButtonLink variant="secondary" size="sm" to={`/compare?ids=${selected.map((c) => c.id).join(',')}`}>
                      Compare {selected.length}
                    </ButtonLink>
                  ) : null}
                  {selectionActions?.(selected)}
                </div>
              }
            />
            <CardBody>
              <CandidatesTable
                candidates={passing}
                packType={run.brief.packType}
                currency={run.currency}
                selectedIds={selectedIds}
                onToggle={toggle}
              />
            </CardBody>
          </Card>

          {passing.length > 0 && <TradeOffView run={run} candidates={passing} selectedIds={selectedIds} focus={focus} onToggle={toggle} />}

          {misses.length > 0 && (
            <Card>
              <CardHeader
                title="Simulated, and missing the brief"
                description="Sets the linear model finds feasible whose simulated pack misses the brief, even after their heat budget was corrected by the shortfall and solved again. Not ranked."
              />
              <CardBody>
                <ul className="flex flex-col divide-y divide-ink-100 text-small">
                  {misses.map((c) => (
                    <li key={c.id} className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1 py-2">
                      <Link to={`/candidates/${c.id}`} className="font-semibold text-frost-700 hover:underline">
                        {candidateRef(c)} {chemistryName(c)}
                      </Link>
                      <span className="text-ink-700">{missSummary(c, run.brief.holdMin)}</span>
                      <span className="tabular-nums text-ink-600">
                        {formatMoney(c.unitCost, run.currency)} · {formatNumber(c.massG, { maxFractionDigits: 0 })}&#8239;g
                        {c.correction && c.correction.rounds > 0 ? ` · corrected ${formatCount(c.correction.rounds, 'time')}, no composition of this set passed` : ''}
                      </span>
                    </li>
                  ))}
                </ul>
              </CardBody>
            </Card>
          )}

          <Card>
            <CardHeader title="Infeasible sets" description="Sets of actives that cannot meet the brief, and the constraint that stops each." />
            <CardBody>
              <InfeasibleSets sets={run.infeasible} currency={run.currency} />
            </CardBody>
          </Card>

          {run.excludedIngredients.length > 0 && (
            <details className="rounded-card border border-ink-100 bg-surface px-5 py-3 shadow-card">
              <summary className="cursor-pointer font-semibold text-ink-800">
                {formatCount(run.excludedIngredients.length, 'ingredient')} left out before the search
              </summary>
              <ul className="mt-2 flex flex-col gap-1 text-small text-ink-700">
                {run.excludedIngredients.map((e) => (
                  <li key={e.ingredientId}>
                    <span className="font-semibold">{e.name}</span>: {e.reason}
                  </li>
                ))}
              </ul>
            </details>
          )}
        </>
      )}
    </div>
  );
}

/** The optimiser's warnings, grouped by kind and folded: they qualify the figures, they are not errors. */
function RunWarnings({ warnings }: { warnings: RunDetail['warnings'] }) {
  const groups = new Map<string, string[]>();
  for (const w of warnings) groups.set(w.code, [...(groups.get(w.code) ?? []), w.message]);
  return (
    <details className="rounded-control border border-amber-100 bg-amber-50 px-4 py-3 text-small text-amber-700">
      <summary className="cursor-pointer font-semibold">
        {formatCount(warnings.length, 'note')} from the optimiser on the data and the model (assumed heat capacities, data ranges)
      </summary>
      <ul className="mt-2 flex flex-col gap-2">
        {[...groups].map(([code, messages]) => (
          <li key={code}>
            <p className="font-semibold">
              {code} ({messages.length})
            </p>
            <ul className="list-disc pl-5">
              {messages.map((m, k) => (
                <li key={k}>{m}</li>
              ))}
            </ul>
          </li>
        ))}
      </ul>
    </details>
  );
}
