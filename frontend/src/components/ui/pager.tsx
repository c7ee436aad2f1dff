import { useId, useState, type FormEvent } from 'react';
import { Button } from './button';
import { SelectField } from './field';
import { formatCount } from '@/lib/format';

export interface PagerProps {
  /** What the list holds, in the singular ("brief"); the count is written with {@link formatCount}. */
  noun: string;
  /** The plural when it is not the singular plus s ("species"). */
  plural?: string;
  /** Names the list for screen readers: "Pages of the library". */
  label: string;
  page: number;
  pageSize: number;
  total: number;
  onPageChange: (page: number) => void;
  /** Offer these sizes (e.g. [25, 50, 100]); omit to hide the page-size choice. */
  pageSizes?: readonly number[];
  onPageSizeChange?: (pageSize: number) => void;
}

/**
 * The pager under every paged table: the count, the page, first / previous / next / last and a
 * page number to go to. Every control is a button, a select or a field, so Tab, Enter and Space
 * work; the status line is announced when the page changes. Nothing shows for an empty list.
 */
export function Pager({ noun, plural, label, page, pageSize, total, onPageChange, pageSizes, onPageSizeChange }: PagerProps) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const [draft, setDraft] = useState('');
  const goId = useId();
  if (total === 0) return null;
  const go = (p: number) => onPageChange(Math.min(pages, Math.max(1, p)));
  const jump = (event: FormEvent) => {
    event.preventDefault();
    const p = Number(draft);
    if (Number.isInteger(p) && p >= 1) go(p);
    setDraft('');
  };
  return (
    <nav aria-label={label} className="flex flex-wrap items-center justify-between gap-3 text-small text-ink-600">
      <p aria-live="polite">
        {formatCount(total, noun, plural)} · page {Math.min(page, pages)} of {pages}
      </p>
      <div className="flex flex-wrap items-center gap-2">
        {pageSizes && onPageSizeChange ? (
          <SelectField label="Rows per page" hideLabel controlSize="sm" value={String(pageSize)} onChange={(event) => onPageSizeChange(Number(event.target.value))}>
            {pageSizes.map((size) => (
              <option key={size} value={size}>
                {size} per page
              </option>
            ))}
          </SelectField>
        ) : null}
        {pages > 2 ? (
          <Button size="sm" variant="secondary" disabled={page <= 1} onClick={() => go(1)}>
            First<span className="sr-only"> page</span>
          </Button>
        ) : null}
        <Button size="sm" variant="secondary" disabled={page <= 1} onClick={() => go(page - 1)}>
          Previous<span className="sr-only"> page</span>
        </Button>
        <Button size="sm" variant="secondary" disabled={page >= pages} onClick={() => go(page + 1)}>
          Next<span className="sr-only"> page</span>
        </Button>
        {pages > 2 ? (
          <>
            <Button size="sm" variant="secondary" disabled={page >= pages} onClick={() => go(pages)}>
              Last<span className="sr-only"> page</span>
            </Button>
            <form onSubmit={jump} className="flex items-center gap-1">
              <label className="sr-only" htmlFor={goId}>
                Go to page (1 to {pages})
              </label>
              <input
                id={goId}
                type="number"
                inputMode="numeric"
                min={1}
                max={pages}
                value={draft}
                placeholder="Page"
                onChange={(event) => setDraft(event.target.value)}
                className="h-8 w-20 rounded-control border border-ink-200 bg-surface px-2 text-small text-ink-800"
              />
              <Button size="sm" variant="ghost" type="submit">
                Go
              </Button>
            </form>
          </>
        ) : null}
      </div>
    </nav>
  );
}

/** Page and page size of one paged list, kept in the component; a new filter starts again at page 1. */
export function usePageState(initialPageSize = 25) {
  const [page, setPage] = useState(1);
  const [pageSize, setPageSizeState] = useState(initialPageSize);
  const setPageSize = (size: number) => {
    setPageSizeState(size);
    setPage(1);
  };
  return { page, pageSize, setPage, setPageSize };
}
