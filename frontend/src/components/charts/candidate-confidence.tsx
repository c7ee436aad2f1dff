import { QueryError } from '@/components/ui/query-error';
import { Loading } from '@/components/ui/spinner';
import { useCandidateConfidence } from '@/lib/candidate-confidence';
import { ConfidenceBand } from './confidence-band';

/** A candidate's confidence band, fetched on demand (the Monte Carlo runs once per candidate). */
export function CandidateConfidence({
  candidateId,
  title,
  compact,
  height,
  modelled,
}: {
  candidateId: number;
  title?: string;
  compact?: boolean;
  height?: number;
  /** The candidate's simulated verdict, said beside the probability. */
  modelled?: 'passed' | 'missed' | 'failed' | 'not-verified';
}) {
  const q = useCandidateConfidence(candidateId);
  if (q.isPending) return <Loading label="Sampling the model's uncertainties (Monte Carlo)…" className="py-2" />;
  if (q.isError) return <QueryError title="The confidence band could not be computed" error={q.error} onRetry={() => void q.refetch()} retrying={q.isFetching} />;
  const c = q.data;
  return (
    <ConfidenceBand
      band={c.band}
      nominal={c.nominal}
      targetBand={c.targetBand}
      probabilityMeetsBrief={c.probabilityMeetsBrief}
      samples={c.samples}
      {...(title ? { title } : {})}
      {...(compact !== undefined ? { compact } : {})}
      {...(height !== undefined ? { height } : {})}
      {...(modelled ? { modelled } : {})}
    />
  );
}
