import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { mailMessageListResponseSchema } from '@shared/schemas/mail';
import { api } from '@/lib/api-client';

export interface MailPageParams {
  page: number;
  pageSize: number;
}
export const MAIL_FIRST_PAGE: MailPageParams = { page: 1, pageSize: 25 };

export const mailKeys = {
  all: ['mail-messages'] as const,
  list: (params: MailPageParams) => [...mailKeys.all, 'list', params] as const,
};

export type MailMessageList = z.output<typeof mailMessageListResponseSchema>;

/** One page of what the local mail sink received for this workspace, newest first (sorted by the server). */
export async function getMailMessages(params: MailPageParams, signal?: AbortSignal): Promise<MailMessageList> {
  return api.get('/api/mail-messages', { query: { ...params }, schema: mailMessageListResponseSchema, signal });
}

export const getMailMessagesQueryOptions = (params: MailPageParams = MAIL_FIRST_PAGE) =>
  queryOptions({
    queryKey: mailKeys.list(params),
    queryFn: ({ signal }) => getMailMessages(params, signal),
    placeholderData: keepPreviousData,
  });

/** Polls gently while the page is open, so a message sent a moment ago shows up by itself. */
export function useMailMessages(params: MailPageParams = MAIL_FIRST_PAGE) {
  return useQuery({ ...getMailMessagesQueryOptions(params), refetchInterval: 5_000 });
}
