import type { CandidateRecord, RunDetail } from '@shared/schemas/runs';

export function TradeOffView(_props: { run: RunDetail; candidates: CandidateRecord[]; selectedIds: readonly number[]; focus: CandidateRecord[]; onToggle: (id: number) => void }) {
  return null;
}
