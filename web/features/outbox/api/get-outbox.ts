import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

/** One captured e-mail from the dev/test mail sink. `html` is never rendered by the client. */
export interface OutboxMessage {
  id: string;
  to: string;
  subject: string;
  text: string;
  html: string | null;
  receivedAt: string;
}

export const outboxKeys = {
  all: ['outbox'] as const,
  list: () => ['outbox', 'list'] as const,
};

export const getOutbox = () => api.get<OutboxMessage[]>('/outbox');

export const outboxQueryOptions = () => queryOptions({ queryKey: outboxKeys.list(), queryFn: getOutbox, refetchInterval: 10_000 });

export const useOutbox = () => useQuery(outboxQueryOptions());
