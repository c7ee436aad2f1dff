import type { CandidateRecord } from '@shared/schemas/runs';

export function CompareView(_props: { candidates: CandidateRecord[]; canWrite: boolean }) {
  return null;
}
