import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import {
  IncidentCreateSchema,
  IncidentListQuerySchema,
  IncidentReportInputSchema,
  IncidentUpdateSchema,
} from '@/shared/schemas/incident';
import { incidentGeoJson, incidentLogCsv } from '@/server/domain/incidents/incident-exports';
import {
  addReport,
  incidentDetail,
  listIncidents,
  openIncident,
  updateIncident,
  type IncidentDeps,
} from '@/server/domain/incidents/manage-incidents';
import { reportingPostsOf } from '@/server/domain/incidents/reporting-posts';
import { actorOf, requireUser } from '@/server/http/session';
import { parseOrThrow } from '@/server/http/validate';
import type { TerrainCache } from '@/server/domain/ports/terrain-cache';
import type { Mailer } from '@/server/mail/mailer';

const IdParams = z.object({ incidentId: z.uuid({ error: 'Not an incident id.' }) });

/** A file name that says site, incident and date, safe in any file system. */
function fileName(detail: Awaited<ReturnType<typeof incidentDetail>>, extension: string) {
  const slug = (s: string) =>
    s
      .normalize('NFKD')
      .replace(/[^\w-]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .toLowerCase()
      .slice(0, 40);
  const day = new Date().toISOString().slice(0, 10);
  return `${slug(detail.incident.siteName)}_${slug(detail.incident.title)}_incident-log_${day}.${extension}`;
}

/**
 * Incidents and their hash-chained log: every role of the organisation
 * reads; planners, administrators and observers on watch at one of the
 * site's posts write.
 */
export function incidentRoutes(db: Sequelize, publicUrl: () => string, mailer: Mailer | null, terrainCache?: TerrainCache) {
  const router = Router();
  const deps = (): IncidentDeps => ({ db, mailer, terrainCache, incidentUrl: (id) => `${publicUrl()}/incidents/${id}` });

  router.get('/incidents', requireUser, async (req, res) => {
    res.json(await listIncidents(actorOf(req), parseOrThrow(IncidentListQuerySchema, req.query, 'query')));
  });
  router.post('/incidents', requireUser, async (req, res) => {
    const input = parseOrThrow(IncidentCreateSchema, req.body, 'incident');
    res.status(201).json(await openIncident(deps(), actorOf(req), input));
  });
  router.get('/incidents/:incidentId', requireUser, async (req, res) => {
    const { incidentId } = parseOrThrow(IdParams, req.params, 'address');
    res.json(await incidentDetail(actorOf(req), incidentId));
  });
  router.patch('/incidents/:incidentId', requireUser, async (req, res) => {
    const { incidentId } = parseOrThrow(IdParams, req.params, 'address');
    const input = parseOrThrow(IncidentUpdateSchema, req.body, 'incident');
    res.json(await updateIncident(deps(), actorOf(req), incidentId, input));
  });
  router.post('/incidents/:incidentId/reports', requireUser, async (req, res) => {
    const { incidentId } = parseOrThrow(IdParams, req.params, 'address');
    const input = parseOrThrow(IncidentReportInputSchema, req.body, 'report');
    const result = await addReport(deps(), actorOf(req), incidentId, input);
    res.status(result.replayed ? 200 : 201).json(result);
  });
  router.get('/incidents/:incidentId/log.csv', requireUser, async (req, res) => {
    const { incidentId } = parseOrThrow(IdParams, req.params, 'address');
    const detail = await incidentDetail(actorOf(req), incidentId);
    res.attachment(fileName(detail, 'csv')).type('text/csv; charset=utf-8; header=present').send(incidentLogCsv(detail));
  });
  router.get('/incidents/:incidentId/incident.geojson', requireUser, async (req, res) => {
    const { incidentId } = parseOrThrow(IdParams, req.params, 'address');
    const actor = actorOf(req);
    const detail = await incidentDetail(actor, incidentId);
    const posts = await reportingPostsOf(actor, detail);
    res
      .attachment(fileName(detail, 'geojson'))
      .type('application/geo+json')
      .send(JSON.stringify(incidentGeoJson(detail, posts)));
  });
  return router;
}
