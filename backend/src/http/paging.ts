import type { Paged, SortValue } from '@shared/schemas';

/** What every list query arrives with, after `pagedQuerySchema` validated it. */
export interface PageQuery<K extends string = string> {
  page: number;
  pageSize: number;
  sort: SortValue<K>;
}

/** LIMIT and OFFSET of a page. */
export function pageWindow(q: { page: number; pageSize: number }): { limit: number; offset: number } {
  return { limit: q.pageSize, offset: (q.page - 1) * q.pageSize };
}

/**
 * The SQL column and direction of a whitelisted sort value. `columns` maps each sort key to its
 * column expression, written here in code and never taken from the request.
 */
export function sortColumn<K extends string>(sort: SortValue<K>, columns: Record<K, string>): { column: string; direction: 'ASC' | 'DESC' } {
  const descending = sort.startsWith('-');
  const key = (descending ? sort.slice(1) : sort) as K;
  return { column: columns[key], direction: descending ? 'DESC' : 'ASC' };
}

export function pageOf<T>(q: { page: number; pageSize: number }, items: T[], total: number): Paged<T> {
  return { items, page: q.page, pageSize: q.pageSize, total };
}

/** A `q` filter as an ILIKE pattern: contains, with `%`, `_` and backslash taken literally (backslash is LIKE's escape). */
export function likePattern(q: string): string {
  return `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}
