import { createHash } from 'node:crypto';
import type { Readable } from 'node:stream';
import { PNG } from 'pngjs';
import type { Sequelize } from 'sequelize';
import { utmZoneFor } from '@/shared/geo/utm-zone-for';
import { standardVerdict, type StandardVerdict } from '@/shared/plans/standard-verdict';
import type { CoverageLayerName, CoverageSnapshot } from '@/shared/schemas/coverage';
import type { Plan, PlanSnapshot } from '@/shared/schemas/plan';
import { type Site } from '@/shared/schemas/site';
import { decodeClassRaster } from '@/shared/terrain/decode-class-raster';
import { gridProjection, type GridProjection } from '@/shared/terrain/grid-projection';
import { OrganizationModel } from '@/server/data/models';
import { coverageRepository } from '@/server/data/repositories/coverage-repository';
import { sitesRepository } from '@/server/data/repositories/sites-repository';
import { terrainRepository, type TerrainRecord } from '@/server/data/repositories/terrain-repository';
import { AppError } from '@/server/domain/app-error';
import type { FileStore } from '@/server/domain/ports/file-store';
import type { Actor } from '../actor';
import { coverageForSubmit } from '../coverage/coverage-snapshot';
import { contentHash } from '../plans/build-snapshot';
import { getPlan, loadPlanInputs, planHistory, planRevision, previewPlan } from '../plans/manage-plans';
import type { ClassLayer, Hillshade } from './map-picture';
import type { PlanPackageData, PrintOptions } from './plan-package-data';
import { renderPlanPackage } from './render-plan-package';
import { isoDateIn, slug } from './report-text';

/** What the printed reports need. */
export type { PlanPackageData, PrintOptions } from './plan-package-data';

export interface ReportDeps {
  db: Sequelize;
  /** Where the terrain's hillshade is kept. */
  files: FileStore;
}

/**
 * The plan package of one frozen revision (`revision` a number) or the
 * preview of the plan as it stands (`'preview'`, watermarked "draft — not
 * approved"): the same access as the plan (observers only approved plans;
 * another organisation's is not found), the revision's content re-verified
 * against its hash, every coverage layer against the hash the revision froze.
 */
export async function planPackage(
  deps: ReportDeps,
  actor: Actor,
  planId: string,
  which: number | 'preview',
  options: PrintOptions,
): Promise<{ fileName: string; pdf: Buffer }> {
  const plan = await getPlan(actor, planId);
  const history = await planHistory(actor, planId);
  let snapshot: PlanSnapshot;
  let hash: string;
  let revision: PlanPackageData['revision'] = null;
  let verdict: StandardVerdict;
  if (which === 'preview') {
    const preview = await previewPlan(actor, planId);
    const coverage = await deps.db.transaction(async (t) =>
      coverageForSubmit(actor.organizationId, plan, await loadPlanInputs(actor, plan, t), t),
    );
    snapshot = { ...preview, coverage: coverage.snapshot };
    hash = contentHash(snapshot);
    verdict = standardVerdict(coverage.snapshot?.cases);
  } else {
    const frozen = await planRevision(actor, planId, which);
    if (!frozen.snapshot) throw AppError.notFound('That revision');
    snapshot = frozen.snapshot;
    hash = frozen.contentHash;
    verdict = frozen.verdict ?? standardVerdict(snapshot.coverage?.cases);
    revision = {
      number: frozen.number,
      submittedAt: frozen.submittedAt,
      submittedBy: frozen.submittedBy.name,
      exceptionNote: frozen.exceptionNote,
      approved: history.reviews.some((r) => r.revision === frozen.number && r.decision === 'approve'),
    };
  }
  const n = revision?.number ?? null;
  const signatures = history.signatures
    .filter((s) => n === null || s.revision === null || s.revision <= n)
    .map((s) => ({ step: s.step, name: s.person.name, role: s.person.role, at: s.at, revision: s.revision }));
  const justifications = history.reviews
    .filter((r) => n !== null && r.revision === n && r.justification)
    .map((r) => ({ reviewer: r.reviewer.name, at: r.at, text: r.justification! }));

  const site = await frozenSite(actor, plan, snapshot);
  const coverage = snapshot.coverage;
  const terrain =
    coverage?.terrainId != null
      ? await terrainRepository.findInSite(actor.organizationId, plan.siteId, coverage.terrainId)
      : null;
  const organization = await OrganizationModel.findByPk(actor.organizationId, { attributes: ['name'], raw: true });

  const data: PlanPackageData = {
    plan,
    organizationName: organization?.name ?? '',
    site,
    revision,
    snapshot,
    contentHash: hash,
    verdict,
    justifications,
    signatures,
    terrain,
    hillshade: terrain ? await readHillshade(deps.files, terrain) : null,
    projection: mapProjection(coverage, terrain, site),
    layer: coverage ? layerReader(coverage) : () => Promise.resolve(null),
    options,
    generatedAt: new Date(),
  };
  const pdf = await renderPlanPackage(data);
  const when = isoDateIn(data.generatedAt, site.timeZone);
  const which_ = revision ? `v${plan.version}-rev${revision.number}` : `v${plan.version}-draft-preview`;
  return { fileName: `${slug(site.name)}_${slug(plan.title)}_${which_}_${when}.pdf`, pdf };
}

/** The site as the revision froze it, filled from today's where the freeze lacks a field. */
async function frozenSite(actor: Actor, plan: Plan, snapshot: PlanSnapshot): Promise<Site> {
  const today = await sitesRepository.findInOrganization(actor.organizationId, plan.siteId);
  const frozen = snapshot.inputs.site as Partial<Site>;
  if (!today) {
    // A deleted site: what the revision kept is all there is.
    return { priorityZones: [], boundary: null, timeZone: 'UTC', name: plan.siteName, ...frozen } as Site;
  }
  return { ...today, ...frozen };
}

async function readAll(stream: Readable): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks);
}

export async function readHillshade(files: FileStore, terrain: TerrainRecord): Promise<Hillshade | null> {
  try {
    const png = PNG.sync.read(await readAll(await files.open(terrain.hillshadeKey)));
    return {
      width: png.width,
      height: png.height,
      data: png.data,
      bounds: {
        west: terrain.xllM,
        south: terrain.yllM,
        east: terrain.xllM + terrain.width * terrain.cellSizeM,
        north: terrain.yllM + terrain.height * terrain.cellSizeM,
      },
    };
  } catch (error) {
    // The maps are still drawn, on plain paper; the relief is not what the figures rest on.
    console.error('[kenning] plan package: the hillshade could not be read:', error);
    return null;
  }
}

/** The terrain's grid CRS, the run's, or for a plan without coverage the UTM zone of the site's middle. */
export function mapProjection(
  coverage: CoverageSnapshot | null,
  terrain: TerrainRecord | null,
  site: Pick<Site, 'boundary'>,
): GridProjection {
  if (terrain) return gridProjection({ epsg: terrain.epsg, wkt: terrain.crsWkt });
  if (coverage?.grid.epsg) return gridProjection({ epsg: coverage.grid.epsg, wkt: null });
  const points = site.boundary ?? [];
  const lat = points.length ? points.reduce((s, p) => s + p[1], 0) / points.length : 0;
  const lon = points.length ? points.reduce((s, p) => s + p[0], 0) / points.length : 0;
  return gridProjection({ epsg: (lat >= 0 ? 32600 : 32700) + utmZoneFor(lat, lon), wkt: null });
}

function layerReader(coverage: CoverageSnapshot) {
  return async (caseKey: string, layer: Exclude<CoverageLayerName, 'post-visibility'>): Promise<ClassLayer | null> => {
    const encoded = await coverageRepository.layer(coverage.runId, caseKey, layer, '');
    if (!encoded) return null;
    const frozen = coverage.layerHashes[`${layer}:${caseKey}`];
    const actual = createHash('sha256').update(encoded.data).digest('hex');
    if (frozen !== undefined && frozen !== actual) {
      console.error(
        `[kenning] INTEGRITY: coverage run ${coverage.runId} layer ${layer}:${caseKey} no longer matches its frozen sha256.`,
      );
      throw new AppError(
        500,
        'revision_tampered',
        'A coverage layer of this revision no longer matches the content frozen when it was submitted. It is withheld; tell your administrator.',
      );
    }
    return {
      width: encoded.width,
      height: encoded.height,
      cellSizeM: encoded.cellSize,
      xllM: encoded.xll,
      yllM: encoded.yll,
      codes: decodeClassRaster(encoded),
    };
  };
}
