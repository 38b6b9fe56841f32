import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import type { AuditLogEntry } from '../../../../api/contracts/audit-log';
import { api } from '../../../lib/api-client';

export type { AuditLogEntry };

export const AUDIT_LOG_PAGE_SIZE = 50;

export const auditLogKeys = {
  all: ['audit-log'] as const,
  ofPulsar: (pulsarId: string) => ['audit-log', 'pulsar', pulsarId] as const,
};

/** GET /api/pulsars/:id/audit-log, newest first; `before` is the id of the oldest entry already shown. */
export const getAuditLogPage = (pulsarId: string, before: number | null) =>
  api.get<AuditLogEntry[]>(
    `/pulsars/${encodeURIComponent(pulsarId)}/audit-log?limit=${AUDIT_LOG_PAGE_SIZE}${before === null ? '' : `&before=${before}`}`,
  );

export const auditLogQueryOptions = (pulsarId: string) =>
  infiniteQueryOptions({
    queryKey: auditLogKeys.ofPulsar(pulsarId),
    queryFn: ({ pageParam }) => getAuditLogPage(pulsarId, pageParam),
    initialPageParam: null as number | null,
    // A short page is the last one; otherwise continue below its oldest entry.
    getNextPageParam: (page) => (page.length < AUDIT_LOG_PAGE_SIZE ? undefined : page[page.length - 1].id),
  });

export const useAuditLog = (pulsarId: string) => useInfiniteQuery(auditLogQueryOptions(pulsarId));
