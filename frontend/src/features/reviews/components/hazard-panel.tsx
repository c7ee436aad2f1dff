import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { QueryError } from '@/components/ui/query-error';
import { Loading } from '@/components/ui/spinner';
import { useCandidateHazards } from '../api/get-candidate-hazards';
import { useHStatements } from '../api/get-h-statements';
import { ClassificationList, HazardNotesList, LabelElements, StandingCaution } from './hazard-notes';

/** A candidate's computed hazard notes, its GHS label elements and the standing caution. */
export function HazardPanel({ candidateId }: { candidateId: number }) {
  const q = useCandidateHazards(candidateId);
  const h = useHStatements();
  return (
    <Card>
      <CardHeader id="hazards-heading" title="Hazard notes" description="Computed from the composition, the ingredients’ hazard data and the predicted temperatures." />
      <CardBody className="flex flex-col gap-4">
        {q.isPending ? (
          <Loading label="Computing the hazard notes…" />
        ) : q.isError ? (
          <QueryError title="The hazard notes could not be computed" error={q.error} onRetry={() => void q.refetch()} retrying={q.isFetching} />
        ) : (
          <>
            <StandingCaution text={q.data.standingCaution} />
            {q.data.ingredientsWithoutHazardData.length > 0 && (
              <p className="text-small text-amber-700">No hazard data yet for: {q.data.ingredientsWithoutHazardData.join(', ')}. Their hazards are not counted.</p>
            )}
            <HazardNotesList notes={q.data.hazards.notes} />
            <section aria-labelledby="classification-heading">
              <h3 id="classification-heading" className="mb-2 text-body font-bold text-ink-900">
                Classification (CLP)
              </h3>
              <ClassificationList classification={q.data.hazards.classification} />
            </section>
            <section aria-labelledby="label-heading">
              <h3 id="label-heading" className="mb-2 text-body font-bold text-ink-900">
                Label elements (GHS)
              </h3>
              <LabelElements label={q.data.hazards.label} hTexts={h.data?.texts} />
            </section>
          </>
        )}
      </CardBody>
    </Card>
  );
}
