import type { ReactNode } from 'react';
import { Link } from 'react-router';
import type { ReviewQueueResponse } from '@shared/schemas/reviews';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { Pager, usePageState } from '@/components/ui/pager';
import { QueryError } from '@/components/ui/query-error';
import { Loading } from '@/components/ui/spinner';
import { formatWhen } from '@/lib/format';
import { useReviewQueue } from '../api/get-review-queue';
import { ReviewStateBadge } from './review-state-badge';

type Item = ReviewQueueResponse['items'][number];

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

const FIRST_PAGE = { waiting: { queue: 'waiting', page: 1, pageSize: 25 }, recent: { queue: 'recent', page: 1, pageSize: 25 } } as const;
export const REVIEW_QUEUE_FIRST_PAGES = [FIRST_PAGE.waiting, FIRST_PAGE.recent];

function QueuePanel({ queue, title, empty }: { queue: 'waiting' | 'recent'; title: string; empty: ReactNode }) {
  const paging = usePageState(25);
  const q = useReviewQueue({ queue, page: paging.page, pageSize: paging.pageSize });
  const description = queue === 'recent' ? 'Every candidate submitted in this workspace, newest change first.' : q.data ? WAITING_WORDS[q.data.role] : undefined;
  return (
    <Card>
      <CardHeader title={title} description={description} />
      <CardBody>
        {q.isPending ? (
          <Loading label="Loading the reviews…" />
        ) : q.isError ? (
          <QueryError title="The reviews could not be loaded" error={q.error} onRetry={() => void q.refetch()} retrying={q.isFetching} />
        ) : q.data.total === 0 ? (
          empty
        ) : (
          <div className="flex flex-col gap-3">
            <QueueTable items={q.data.items} caption={title} />
            <Pager noun="candidate" label={`Pages of ${title.toLowerCase()}`} page={paging.page} pageSize={paging.pageSize} total={q.data.total} onPageChange={paging.setPage} pageSizes={[25, 50, 100]} onPageSizeChange={paging.setPageSize} />
          </div>
        )}
      </CardBody>
    </Card>
  );
}

/** The two review queues, each paged on its own: what waits for the signed-in role, and everything in or past review. */
export function ReviewQueue() {
  return (
    <div className="flex flex-col gap-6">
      <QueuePanel queue="waiting" title="Waiting for you" empty={<EmptyState title="Nothing waits for you">New work shows here and arrives by e-mail.</EmptyState>} />
      <QueuePanel queue="recent" title="In and past review" empty={<EmptyState title="No candidate submitted yet">A designer submits a shortlisted candidate from its page.</EmptyState>} />
    </div>
  );
}
