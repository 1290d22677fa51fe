import { createHash } from 'node:crypto';
import { canonicalJson } from '@/shared/plans/canonical-json';
import type { Attachment } from '@/shared/schemas/attachment';
import type { CoverageSnapshot } from '@/shared/schemas/coverage';
import type { ConditionSet, Target } from '@/shared/schemas/library';
import type { PlanSnapshot, ZoneReach } from '@/shared/schemas/plan';
import { projectAzimuthalEquidistant } from '@/shared/geo/azimuthal-equidistant';
import { ringReach } from '@/shared/geo/ring-reach';
import type { RefractionCondition } from '@/shared/schemas/sightline';
import type { Post, Site } from '@/shared/schemas/site';
import { effectiveResolutionArcmin, type PlanLookout } from '@/shared/schemas/plan';
import { DETECTION_MODEL_VERSION } from '@/shared/sightline/constants';
import { evaluateSightline } from '@/shared/sightline/evaluate-sightline';
import { smoothEarthGround } from '@/shared/plans/smooth-earth-ground';
import { detectionSensitivity } from '@/shared/sightline/detection-sensitivity';
import { detectionInputsOf } from '@/shared/sightline/detection-inputs';

export const SNAPSHOT_ASSUMPTIONS = [
  'Results per post, target and condition: smooth earth at each result’s datum — the ground its targets stand on: the site’s stated ground height, else sea level on a coast and the post’s own ground inland.',
  'Terrain coverage, when computed: the site’s terrain grid (or the flat datum without terrain), each condition’s refraction applied as a uniform curvature correction, the condition set’s visibility as a range limit.',
  'Height of eye = ground elevation + structure height + eye height above the platform, counted above the result’s datum.',
  'Targets stand on the datum; by day a target is detected when its required top part shows and the visibility (at the 5 % contrast threshold) and the angular-size limit at the lookout’s resolving angle allow; at night only a light is detected, out to the lesser of its luminous range (Allard’s law, IALA night threshold) and its geographic range.',
  'On the water, wave crests of half the significant wave height hide the lower part of a target; a target whose required part is below them is not counted.',
  'Refraction is uniform along each sightline under each condition.',
  'Priority zones: the share of each zone within the detection range and the post’s viewing sector, on the smooth earth (terrain that hides ground is not counted).',
];

/**
 * Every input of a plan and every computed result, for one post × target ×
 * condition: the content that a revision freezes. Pure: same inputs, same snapshot.
 */
export function buildSnapshot(input: {
  title: string;
  standard: PlanSnapshot['inputs']['plan']['standard'];
  /** The lookout the plan assumes (resolving angle, optics); default 1′, unaided. */
  lookout?: PlanLookout;
  site: Site;
  posts: Post[];
  targets: Target[];
  conditionSets: ConditionSet[];
  /** The plan's own files and its posts' photos; default none. */
  attachments?: Attachment[];
  /** The plan's finished terrain coverage run for these inputs; default none. */
  coverage?: CoverageSnapshot | null;
}): PlanSnapshot {
  let cautions: PlanSnapshot['cautions'] = [];
  const lookout = input.lookout ?? { resolutionArcmin: 1, magnification: 1 };
  const resolutionArcmin = effectiveResolutionArcmin(lookout);
  const results: PlanSnapshot['results'] = [];
  for (const post of input.posts) {
    const datum = smoothEarthGround(input.site, post);
    const observerHeightM = Math.max(0, post.groundElevationM + post.structureHeightM + post.eyeHeightM - datum.groundM);
    const zoneRings = input.site.priorityZones.map((z) =>
      projectAzimuthalEquidistant(
        post.location,
        z.ring.map(([lonDeg, latDeg]) => ({ latDeg, lonDeg })),
      ),
    );
    const zonesFor = (rangeM: number | null): ZoneReach[] =>
      input.site.priorityZones.map((z, i) => {
        const { nearestM, farthestM, coveredShare } = ringReach(zoneRings[i]!, rangeM ?? 0, post.sector);
        const pct = rangeM === null ? null : Math.round(coveredShare * 1000) / 10;
        const reach = pct === null ? 'unknown' : pct >= 99.5 ? 'whole' : pct >= 0.5 ? 'part' : 'none';
        return { name: z.name, weight: z.weight, nearestM, farthestM, coveredPct: pct, reach };
      });
    for (const target of input.targets) {
      for (const set of input.conditionSets) {
        const request = {
          observerHeightM,
          ...detectionInputsOf(target, set, resolutionArcmin),
          conditions: set.conditions as RefractionCondition[],
        };
        const response = evaluateSightline(request);
        cautions = response.cautions;
        const band = detectionSensitivity(
          request,
          response.results.map((r) => r.k),
        );
        const sensitivity = { ...band, ks: [...band.ks], limitedBy: [...band.limitedBy] };
        response.results.forEach((result, conditionIndex) =>
          results.push({
            postId: post.id,
            postName: post.name,
            targetId: target.id,
            targetName: target.name,
            conditionSetId: set.id,
            conditionSetName: set.name,
            conditionIndex,
            observerHeightM,
            result,
            zones: zonesFor(result.detectionRangeM),
            sensitivity,
            datum,
          }),
        );
      }
    }
  }
  const strip = <T extends { version?: number; updatedAt?: string }>({ version: _v, updatedAt: _u, ...rest }: T) => rest;
  return {
    assumptions: SNAPSHOT_ASSUMPTIONS,
    inputs: {
      plan: { title: input.title, standard: input.standard, lookout, detectionModel: DETECTION_MODEL_VERSION },
      site: strip(input.site),
      posts: input.posts.map(strip),
      targets: input.targets.map(strip),
      conditionSets: input.conditionSets.map(strip),
      attachments: (input.attachments ?? []).map((a) => ({
        id: a.id,
        ownerType: a.ownerType,
        ownerId: a.ownerId,
        kind: a.kind,
        name: a.originalName,
        sha256: a.sha256,
        bytes: a.bytes,
        bearingDeg: a.bearingDeg,
        caption: a.caption,
      })),
    },
    results,
    coverage: input.coverage ?? null,
    cautions,
  };
}

export const contentHash = (snapshot: PlanSnapshot) => createHash('sha256').update(canonicalJson(snapshot)).digest('hex');
