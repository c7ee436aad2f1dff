import type { CandidateRecord } from '@shared/schemas/runs';
import { Button } from '@/components/ui/button';
import { errorMessage } from '@/lib/api-client';
import { useShortlistCandidate } from '../api/shortlist-candidate';

/**
 * Shortlists the given candidates (or takes them off when all are already on it). Designers and
 * administrators only; the page hides it from other roles.
 */
export function ShortlistButton({ candidates, size = 'sm' }: { candidates: CandidateRecord[]; size?: 'sm' | 'md' }) {
  const shortlist = useShortlistCandidate();
  if (candidates.length === 0) return null;
  const allOn = candidates.every((c) => c.state === 'shortlisted');
  const locked = candidates.some((c) => c.state !== 'proposed' && c.state !== 'shortlisted');
  const onClick = async () => {
    for (const c of candidates) await shortlist.mutateAsync({ id: c.id, shortlisted: !allOn }).catch(() => undefined);
  };
  const what = candidates.length === 1 ? '' : ` ${candidates.length}`;
  return (
    <span className="inline-flex flex-col items-start gap-1">
      <Button size={size} variant={allOn ? 'secondary' : 'primary'} onClick={() => void onClick()} pending={shortlist.isPending} disabled={locked}>
        {allOn ? `Take${what} off the shortlist` : `Shortlist${what}`}
      </Button>
      {shortlist.isError && (
        <span role="alert" className="text-caption font-semibold text-rust-700">
          {errorMessage(shortlist.error)}
        </span>
      )}
    </span>
  );
}
