import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { AuditEventListSchema, type AuditEventQuery } from '@/shared/schemas/audit';
import { api } from './api-client';

/** Filters of the audit trail as the API takes them (all optional). */
export type AuditFilter = Partial<Omit<AuditEventQuery, 'pageSize'>>;

export const auditKeys = {
  all: ['audit-events'] as const,
  page: (filter: AuditFilter) => [...auditKeys.all, 'page', filter] as const,
};

export const auditEventsQuery = (filter: AuditFilter) =>
  queryOptions({
    queryKey: auditKeys.page(filter),
    queryFn: () => {
      const q = new URLSearchParams();
      for (const [k, v] of Object.entries(filter)) if (v !== undefined && v !== '') q.set(k, String(v));
      return api.get(`/v1/audit-events?${q}`, AuditEventListSchema);
    },
    placeholderData: keepPreviousData,
  });

/** One page of the organisation's audit trail (administrators and reviewers). */
export function useAuditEvents(filter: AuditFilter) {
  return useQuery(auditEventsQuery(filter));
}
