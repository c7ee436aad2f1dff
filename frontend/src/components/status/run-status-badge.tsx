import { Badge } from '@/components/ui/badge';

const RUN_STATUS: Record<string, { label: string; tone: 'neutral' | 'cool' | 'success' | 'caution' | 'danger' }> = {
  queued: { label: 'Queued', tone: 'neutral' },
  running: { label: 'Running', tone: 'cool' },
  succeeded: { label: 'Finished', tone: 'success' },
  failed: { label: 'Failed', tone: 'danger' },
  cancelled: { label: 'Cancelled', tone: 'caution' },
};

/** An optimiser run's status in words (briefs and runs both show it). */
export function RunStatusBadge({ status }: { status: string }) {
  const s = RUN_STATUS[status] ?? { label: status, tone: 'neutral' as const };
  return <Badge tone={s.tone}>{s.label}</Badge>;
}

export const isRunActive = (status: string) => status === 'queued' || status === 'running';
