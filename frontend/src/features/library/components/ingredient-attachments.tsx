import { Pager, usePageState } from '@/components/ui/pager';
import { useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { FormMessage } from '@/components/ui/field';
import { QueryError } from '@/components/ui/query-error';
import { Loading } from '@/components/ui/spinner';
import { errorMessage } from '@/lib/api-client';
import { formatDateTime, formatNumber } from '@/lib/format';
import { attachmentDownloadHref, useIngredientAttachments } from '../api/get-ingredient-attachments';
import { useUploadAttachment } from '../api/upload-attachment';

const MAX_MB = 5;

function formatSize(bytes: number): string {
  if (bytes < 1024 * 1024) return `${formatNumber(bytes / 1024, { maxFractionDigits: 0 })}\u202fkB`;
  return `${formatNumber(bytes / (1024 * 1024), { maxFractionDigits: 1 })}\u202fMB`;
}

/** Safety data sheets (PDF) of an ingredient: list, download, and upload for writers. */
export function IngredientAttachments({ ingredientId, canWrite }: { ingredientId: number; canWrite: boolean }) {
  const paging = usePageState(10);
  const attachments = useIngredientAttachments(ingredientId, { page: paging.page, pageSize: paging.pageSize });
  const upload = useUploadAttachment(ingredientId);
  const input = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const [localError, setLocalError] = useState<string | null>(null);

  const send = () => {
    if (!file) return;
    if (file.size > MAX_MB * 1024 * 1024) {
      setLocalError(`The file is ${formatSize(file.size)}; at most ${MAX_MB} MB can be uploaded.`);
      return;
    }
    setLocalError(null);
    upload.mutate(file, {
      onSuccess: () => {
        setFile(null);
        if (input.current) input.current.value = '';
      },
    });
  };

  return (
    <div className="flex flex-col gap-4">
      {attachments.isPending ? (
        <Loading label="Loading attachments…" />
      ) : attachments.isError ? (
        <QueryError error={attachments.error} onRetry={() => void attachments.refetch()} retrying={attachments.isFetching} />
      ) : attachments.data.total === 0 ? (
        <EmptyState title="No safety data sheet attached">
          {canWrite ? 'Upload the supplier’s current safety data sheet (PDF).' : 'A chemist can attach the supplier’s safety data sheet.'}
        </EmptyState>
      ) : (
        <>
        <ul className="divide-y divide-ink-100">
          {attachments.data.items.map((a) => (
            <li key={a.id} className="flex flex-wrap items-center justify-between gap-2 py-2 text-small">
              <div className="min-w-0">
                <p className="truncate font-semibold text-ink-900">{a.filename}</p>
                <p className="text-caption text-ink-500">
                  {formatSize(a.sizeBytes)} · {a.uploadedBy ?? 'unknown'} · {formatDateTime(a.createdAt)}
                </p>
              </div>
              <a
                href={attachmentDownloadHref(a.id)}
                download={a.filename}
                className="rounded-control border border-ink-200 px-3 py-1 text-small font-semibold text-ink-800 hover:bg-ink-50"
              >
                Download<span className="sr-only"> {a.filename}</span>
              </a>
            </li>
          ))}
        </ul>
        <Pager noun="attachment" label="Pages of the attachments" page={paging.page} pageSize={paging.pageSize} total={attachments.data.total} onPageChange={paging.setPage} />
        </>
      )}

      {canWrite && (
        <div className="flex flex-col gap-2 border-t border-ink-100 pt-4">
          <label htmlFor={`sds-${ingredientId}`} className="text-small font-semibold text-ink-800">
            Upload a safety data sheet (PDF, at most {MAX_MB} MB)
          </label>
          <input
            id={`sds-${ingredientId}`}
            ref={input}
            type="file"
            accept="application/pdf,.pdf"
            onChange={(event) => {
              setFile(event.target.files?.[0] ?? null);
              setLocalError(null);
              upload.reset();
            }}
            className="text-small file:mr-3 file:rounded-control file:border file:border-ink-200 file:bg-surface file:px-3 file:py-1.5 file:font-semibold"
          />
          <FormMessage>{localError ?? (upload.isError ? errorMessage(upload.error) : null)}</FormMessage>
          {upload.isSuccess && <FormMessage tone="success">Uploaded {upload.data.filename}.</FormMessage>}
          <Button size="sm" className="self-start" disabled={!file} pending={upload.isPending} pendingLabel="Uploading…" onClick={send}>
            Upload
          </Button>
        </div>
      )}
    </div>
  );
}
