import { REVIEW_STATE_LABELS, type ReviewState } from '@shared/reviews/state-machine';
import { Badge } from '@/components/ui/badge';

const TONES: Record<ReviewState, 'neutral' | 'cool' | 'success' | 'caution' | 'danger' | 'warm'> = {
  proposed: 'neutral',
  shortlisted: 'cool',
  'in-chemistry-review': 'warm',
  'in-regulatory-review': 'warm',
  approved: 'success',
  'changes-requested': 'caution',
  rejected: 'danger',
};

/** The review state in words and colour (the words carry the meaning; the colour only helps). */
export function ReviewStateBadge({ state }: { state: string }) {
  const s = state as ReviewState;
  return <Badge tone={TONES[s] ?? 'neutral'}>{REVIEW_STATE_LABELS[s] ?? state}</Badge>;
}
