import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { mailMessageListResponseSchema } from '@shared/schemas/mail';
import { api } from '@/lib/api-client';

export const mailKeys = {
  all: ['mail-messages'] as const,
  list: () => [...mailKeys.all, 'list'] as const,
};

export type MailMessageList = z.output<typeof mailMessageListResponseSchema>;

/** What the local mail sink received for this workspace, newest first. */
export async function getMailMessages(signal?: AbortSignal): Promise<MailMessageList> {
  const result = await api.get('/api/mail-messages', { schema: mailMessageListResponseSchema, signal });
  const messages = [...result.messages].sort((a, b) => Date.parse(b.receivedAt) - Date.parse(a.receivedAt));
  return { ...result, messages };
}

export const getMailMessagesQueryOptions = () =>
  queryOptions({
    queryKey: mailKeys.list(),
    queryFn: ({ signal }) => getMailMessages(signal),
  });

/** Polls gently while the page is open, so a message sent a moment ago shows up by itself. */
export function useMailMessages() {
  return useQuery({ ...getMailMessagesQueryOptions(), refetchInterval: 5_000 });
}
