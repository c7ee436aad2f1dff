import { Link } from 'react-router';
import type { ReviewQueueResponse } from '@shared/schemas/reviews';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { formatWhen } from '@/lib/format';
import { ReviewStateBadge } from './review-state-badge';

type Item = ReviewQueueResponse['waiting'][number];

function QueueTable({ items, caption }: { items: readonly Item[]; caption: string }) {
  return (
    <table className="w-full text-small">
      <caption className="sr-only">{caption}</caption>
      <thead>
        <tr className="text-left text-ink-600">
          <th scope="col" className="py-1 pr-3 font-semibold">Candidate</th>
          <th scope="col" className="py-1 pr-3 font-semibold">Brief</th>
          <th scope="col" className="py-1 pr-3 font-semibold">State</th>
          <th scope="col" className="py-1 font-semibold">Last change</th>
        </tr>
      </thead>
      <tbody>
        {items.map((i) => (
          <tr key={i.candidateId} className="border-t border-ink-100">
            <td className="py-1.5 pr-3">
              <Link to={`/candidates/${i.candidateId}`} className="font-semibold text-frost-700 hover:underline">
                {i.setNames.join(' + ')}
              </Link>
              <span className="text-ink-500"> · #{i.candidateId}, rev. {i.revision}</span>
            </td>
            <td className="py-1.5 pr-3">{i.briefName}</td>
            <td className="py-1.5 pr-3">
              <ReviewStateBadge state={i.state} />
            </td>
            <td className="py-1.5">{formatWhen(i.updatedAt)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

const WAITING_WORDS: Record<string, string> = {
  chemist: 'Candidates in chemistry review.',
  reviewer: 'Candidates whose chemistry is approved, in regulatory review.',
  designer: 'Candidates sent back with changes requested, and shortlisted ones to submit.',
  admin: 'Candidates sent back with changes requested, and shortlisted ones to submit.',
};

export function ReviewQueue({ queue }: { queue: ReviewQueueResponse }) {
  return (
    <div className="flex flex-col gap-6">
      <Card>
        <CardHeader title="Waiting for you" description={WAITING_WORDS[queue.role]} />
        <CardBody>{queue.waiting.length === 0 ? <EmptyState title="Nothing waits for you">New work shows here and arrives by e-mail.</EmptyState> : <QueueTable items={queue.waiting} caption="Waiting for you" />}</CardBody>
      </Card>
      <Card>
        <CardHeader title="In and past review" description="Every candidate submitted in this workspace, newest change first." />
        <CardBody>{queue.recent.length === 0 ? <EmptyState title="No candidate submitted yet">A designer submits a shortlisted candidate from its page.</EmptyState> : <QueueTable items={queue.recent} caption="In and past review" />}</CardBody>
      </Card>
    </div>
  );
}
