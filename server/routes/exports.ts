import { Router, type Response } from 'express';
import { create as contentDisposition } from 'content-disposition';
import { z } from 'zod';
import { COVERAGE_LAYER_KINDS, CoverageLayerQuerySchema } from '@/shared/schemas/coverage';
import { ContentHashSchema } from '@/shared/schemas/printout';
import { INT_COLUMN_MAX } from '@/shared/schemas/seen-version';
import {
  featuresExport,
  layerFileExport,
  resultsCsvExport,
  type ExportDeps,
  type ExportFile,
} from '@/server/domain/exports/manage-exports';
import { revisionByHash } from '@/server/domain/exports/verify-printout';
import { actorOf, requireUser } from '@/server/http/session';
import { parseOrThrow } from '@/server/http/validate';

const RevisionParams = z.object({
  planId: z.uuid({ error: 'Not a plan id.' }),
  number: z.coerce.number().int().min(1, 'Revisions start at 1.').max(INT_COLUMN_MAX, 'No such revision.'),
});
const LayerFileParams = z.object({
  runId: z.uuid({ error: 'Not a run id.' }),
  layer: z.enum(COVERAGE_LAYER_KINDS, { error: `The layer is one of: ${COVERAGE_LAYER_KINDS.join(', ')}.` }),
  format: z.enum(['tif', 'asc'], { error: 'The file is .tif (GeoTIFF) or .asc (ESRI ASCII grid).' }),
});
const HashParams = z.object({ sha256: ContentHashSchema });

/** Sends a file for download under its name (RFC 6266; non-ASCII names as `filename*`). */
function sendFile(res: Response, file: ExportFile<string | Buffer>) {
  res.setHeader('Content-Type', file.contentType);
  res.setHeader('Content-Disposition', contentDisposition(file.fileName, { type: 'attachment' }));
  res.send(file.body);
}

/**
 * Files of a plan revision and of coverage runs for other tools (CSV, GeoJSON,
 * GeoTIFF, ESRI ASCII grid), and verifying a printout by its content hash.
 * Everyone who may read the plan may export it. Mount before the coverage
 * routes: `/layers/posts-per-cell.tif` would otherwise reach the JSON layer route.
 */
export function exportRoutes(deps: ExportDeps) {
  const router = Router();

  router.get('/plans/:planId/revisions/:number/results.csv', requireUser, async (req, res) => {
    const { planId, number } = parseOrThrow(RevisionParams, req.params, 'address');
    sendFile(res, await resultsCsvExport(actorOf(req), planId, number));
  });
  router.get('/plans/:planId/revisions/:number/features.geojson', requireUser, async (req, res) => {
    const { planId, number } = parseOrThrow(RevisionParams, req.params, 'address');
    const file = await featuresExport(deps, actorOf(req), planId, number);
    sendFile(res, { ...file, body: JSON.stringify(file.body) });
  });
  router.get('/coverage-runs/:runId/layers/:layer.:format', requireUser, async (req, res) => {
    const { runId, layer, format } = parseOrThrow(LayerFileParams, req.params, 'address');
    const { caseKey, postId } = parseOrThrow(CoverageLayerQuerySchema, req.query, 'query');
    const file = await layerFileExport(actorOf(req), { runId, layer, caseKey, postId, format });
    // What the cell values mean (the GeoTIFF writer has no description tag).
    res.setHeader('X-Kenning-Legend', encodeURIComponent(file.legend));
    sendFile(res, file);
  });
  router.get('/revisions/by-hash/:sha256', requireUser, async (req, res) => {
    const { sha256 } = parseOrThrow(HashParams, req.params, 'address');
    res.json(await revisionByHash(actorOf(req), sha256));
  });
  return router;
}
