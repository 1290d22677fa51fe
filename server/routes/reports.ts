import { create as contentDisposition } from 'content-disposition';
import { Router, type Response } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { crewCard, crewCardData } from '@/server/domain/reports/crew-card';
import { planPackage, type ReportDeps } from '@/server/domain/reports/plan-package';
import { actorOf, requireUser } from '@/server/http/session';
import { parseOrThrow } from '@/server/http/validate';
import type { FileStore } from '@/server/storage/file-store';
import { INT_COLUMN_MAX } from '@/shared/schemas/seen-version';

const PlanParams = z.object({ planId: z.uuid({ error: 'Not a plan id.' }) });
const RevisionParams = PlanParams.extend({
  number: z.coerce.number().int().min(1, 'Revisions start at 1.').max(INT_COLUMN_MAX, 'No such revision.'),
});
const CardParams = z.object({
  siteId: z.uuid({ error: 'Not a site id.' }),
  postId: z.uuid({ error: 'Not a post id.' }),
});
const FORMATS = ['dd', 'ddm', 'dms', 'utm', 'mgrs'] as const;
const coords = z.enum(FORMATS, { error: `Coordinates: ${FORMATS.join(', ')}.` }).default('ddm');
/** `?paper=a4|letter&coords=dd|ddm|dms|utm|mgrs` (A4 and degrees and decimal minutes by default). */
const PackageQuery = z.object({
  paper: z
    .enum(['a4', 'letter'], { error: 'Paper: a4 or letter.' })
    .default('a4')
    .transform((p) => (p === 'a4' ? ('A4' as const) : ('LETTER' as const))),
  coords,
});
const CardQuery = z.object({ coords });

function sendPdf(res: Response, file: { fileName: string; pdf: Buffer }) {
  res.setHeader('Content-Type', 'application/pdf');
  res.setHeader('Content-Disposition', contentDisposition(file.fileName, { type: 'attachment' }));
  res.setHeader('Content-Length', String(file.pdf.length));
  res.end(file.pdf);
}

/** Printed reports: a plan revision's package (or a draft's preview) and a post's crew card, as PDF. */
export function reportRoutes(db: Sequelize, files: FileStore) {
  const router = Router();
  const deps: ReportDeps = { db, files };

  router.get('/plans/:planId/revisions/:number/report.pdf', requireUser, async (req, res) => {
    const { planId, number } = parseOrThrow(RevisionParams, req.params, 'address');
    const { paper, coords: coordinateFormat } = parseOrThrow(PackageQuery, req.query, 'query');
    sendPdf(res, await planPackage(deps, actorOf(req), planId, number, { paper, coordinateFormat }));
  });
  router.get('/plans/:planId/preview/report.pdf', requireUser, async (req, res) => {
    const { planId } = parseOrThrow(PlanParams, req.params, 'address');
    const { paper, coords: coordinateFormat } = parseOrThrow(PackageQuery, req.query, 'query');
    sendPdf(res, await planPackage(deps, actorOf(req), planId, 'preview', { paper, coordinateFormat }));
  });
  router.get('/sites/:siteId/posts/:postId/card', requireUser, async (req, res) => {
    const { siteId, postId } = parseOrThrow(CardParams, req.params, 'address');
    res.json({ card: await crewCardData(actorOf(req), siteId, postId) });
  });
  router.get('/sites/:siteId/posts/:postId/card.pdf', requireUser, async (req, res) => {
    const { siteId, postId } = parseOrThrow(CardParams, req.params, 'address');
    const { coords: coordinateFormat } = parseOrThrow(CardQuery, req.query, 'query');
    sendPdf(res, await crewCard(deps, actorOf(req), siteId, postId, { coordinateFormat }));
  });
  return router;
}
