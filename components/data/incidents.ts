import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import {
  IncidentDetailSchema,
  IncidentReportResultSchema,
  IncidentSchema,
  type IncidentCreate,
  type IncidentDetail,
  type IncidentReportInput,
  type IncidentStatus,
} from '@/shared/schemas/incident';
import { api } from './api-client';

/** Filter of the incident list, as the API takes it. */
export interface IncidentFilter {
  siteId?: string;
  status?: IncidentStatus;
}

export const incidentKeys = {
  all: ['incidents'] as const,
  lists: () => [...incidentKeys.all, 'list'] as const,
  list: (filter: IncidentFilter) => [...incidentKeys.lists(), filter] as const,
  detail: (id: string) => [...incidentKeys.all, 'detail', id] as const,
};

/** Where an incident's log is downloaded (the server names the files: site, incident, date). */
export const incidentExportUrls = {
  logCsv: (id: string) => `/api/v1/incidents/${id}/log.csv`,
  geoJson: (id: string) => `/api/v1/incidents/${id}/incident.geojson`,
};

/** How often an open incident's page asks for new bearings from other posts. */
export const INCIDENT_POLL_MS = 15_000;

const IncidentListSchema = z.object({ items: z.array(IncidentSchema) });

export const incidentsQuery = (filter: IncidentFilter = {}) =>
  queryOptions({
    queryKey: incidentKeys.list(filter),
    queryFn: () => {
      const q = new URLSearchParams();
      if (filter.siteId) q.set('siteId', filter.siteId);
      if (filter.status) q.set('status', filter.status);
      return api.get(`/v1/incidents${q.size ? `?${q}` : ''}`, IncidentListSchema);
    },
    placeholderData: keepPreviousData,
  });

export const incidentQuery = (id: string) =>
  queryOptions({
    queryKey: incidentKeys.detail(id),
    queryFn: () => api.get(`/v1/incidents/${id}`, IncidentDetailSchema),
    refetchInterval: (q) => (q.state.data?.incident.status === 'open' ? INCIDENT_POLL_MS : false),
  });

export const useIncidents = (filter: IncidentFilter = {}, enabled = true) => useQuery({ ...incidentsQuery(filter), enabled });
export const useIncident = (id: string) => useQuery(incidentQuery(id));

/** Every incident write answers the whole incident: keep it and refresh the lists. */
function useIncidentMutation<V>(mutationFn: (vars: V) => Promise<IncidentDetail>) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn,
    onSuccess: async (detail) => {
      qc.setQueryData(incidentKeys.detail(detail.incident.id), detail);
      await qc.invalidateQueries({ queryKey: incidentKeys.lists() });
    },
  });
}

export const useOpenIncident = () =>
  useIncidentMutation((input: IncidentCreate) => api.post('/v1/incidents', input, IncidentDetailSchema));

export const useUpdateIncident = (id: string) =>
  useIncidentMutation((input: { version: number; title?: string; status?: IncidentStatus; note?: string }) =>
    api.patch(`/v1/incidents/${id}`, input, IncidentDetailSchema),
  );

/**
 * Sends one bearing. The idempotency key travels with the report, so a retry
 * of the same report (a double tap, a lost answer) is stored once.
 */
export function useReportBearing(id: string) {
  const qc = useQueryClient();
  return useMutation({
    // Tried at once even offline: a report that cannot go now goes to the device's outbox (the form does that).
    networkMode: 'always',
    mutationFn: (input: IncidentReportInput) => api.post(`/v1/incidents/${id}/reports`, input, IncidentReportResultSchema),
    onSuccess: () =>
      Promise.all([
        qc.invalidateQueries({ queryKey: incidentKeys.detail(id) }),
        qc.invalidateQueries({ queryKey: incidentKeys.lists() }),
      ]),
  });
}
