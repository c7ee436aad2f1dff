import { Link } from 'react-router';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { Pager, usePageState } from '@/components/ui/pager';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { Badge } from '@/components/ui/badge';
import { useLabLogs } from '../api/lab-logs';

/** The workspace's lab logs (or one candidate's), newest first, a page at a time. */
export function LabLogList({ candidateId }: { candidateId?: number }) {
  const paging = usePageState(20);
  const q = useLabLogs(candidateId, { page: paging.page, pageSize: paging.pageSize });
  return (
    <Card>
      <CardHeader title={candidateId ? 'Lab logs of this candidate' : 'Lab logs'} description="Recorded temperature curves, each compared with the model's prediction." />
      <CardBody>
        {q.isPending ? (
          <Loading label="Loading lab logs…" />
        ) : q.isError ? (
          <QueryError error={q.error} onRetry={() => void q.refetch()} />
        ) : q.data.total === 0 ? (
          <EmptyState title="No lab logs yet">Upload a logger export to compare it with the prediction and calibrate the model.</EmptyState>
        ) : (
          <div className="flex flex-col gap-3">
          <table className="w-full text-left text-small">
            <caption className="sr-only">Lab logs</caption>
            <thead className="text-caption font-bold text-ink-600">
              <tr>
                <th scope="col" className="py-1.5 pr-4">Name</th>
                <th scope="col" className="py-1.5 pr-4">Samples</th>
                <th scope="col" className="py-1.5 pr-4">Conditions</th>
                <th scope="col" className="py-1.5 pr-4">Fit</th>
                <th scope="col" className="py-1.5 pr-4">Uploaded</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-ink-100">
              {q.data.items.map((l) => (
                <tr key={l.id}>
                  <th scope="row" className="py-1.5 pr-4 font-semibold">
                    <Link to={`/lab-logs/${l.id}`} className="text-frost-700 underline-offset-2 hover:underline">
                      {l.name}
                    </Link>
                    <span className="block text-caption font-normal text-ink-500">{l.filename}</span>
                  </th>
                  <td className="py-1.5 pr-4 tabular-nums">{l.sampleCount.toLocaleString('en')}</td>
                  <td className="py-1.5 pr-4">{l.conditions.contact.replaceAll('-', ' ')}, {l.conditions.ambientC} °C</td>
                  <td className="py-1.5 pr-4">{l.fitted ? <Badge tone="success">RMSE {l.rmseK?.toFixed(2)} K</Badge> : <Badge>not fitted</Badge>}</td>
                  <td className="py-1.5 pr-4 text-ink-600">{l.createdBy} · {new Date(l.createdAt).toLocaleDateString('en-GB')}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <Pager noun="lab log" label="Pages of the lab logs" page={paging.page} pageSize={paging.pageSize} total={q.data.total} onPageChange={paging.setPage} pageSizes={[20, 50, 100]} onPageSizeChange={paging.setPageSize} />
          </div>
        )}
      </CardBody>
    </Card>
  );
}
