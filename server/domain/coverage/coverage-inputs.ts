import { createHash } from 'node:crypto';
import { canonicalJson } from '@/shared/plans/canonical-json';
import type { ConditionSet, Target } from '@/shared/schemas/library';
import type { Plan } from '@/shared/schemas/plan';
import type { RefractionCondition } from '@/shared/schemas/sightline';
import type { HeightDatum, Post, Site } from '@/shared/schemas/site';
import { tideLevelsOf, type TideLevel } from '@/shared/terrain/tide-levels';
import { DETECTION_MODEL_VERSION, MEAN_EARTH_RADIUS_M } from '@/shared/sightline';
import { effectiveResolutionArcmin, type PlanLookout } from '@/shared/schemas/plan';
import { formatK } from '@/shared/sightline/format-k';
import { refractionFromCondition } from '@/shared/sightline/refraction-from-condition';
import { REFRACTION_PRESETS } from '@/shared/sightline/refraction-presets';
import { utmZoneFor } from '@/shared/geo/utm-zone-for';
import { gridProjection } from '@/shared/terrain/grid-projection';
import type { CoverageGrid as CoverageRunGrid } from '@/shared/schemas/coverage';

/** Longest side of the flat datum's grid, cells: fine enough for a coast stretch, quick to compute. */
export const FLAT_GRID_MAX_EDGE = 800;

/** Blind areas smaller than this are counted but not listed, m² (1 ha). */
export const BLIND_AREA_MIN_M2 = 10_000;

/**
 * Everything a coverage run computes from, resolved and frozen when the run
 * is requested: the worker needs no access rules, and the hash of this
 * object says whether a run still matches its plan.
 */
export interface CoverageRunInputs {
  /** The terrain computed on, or null for the flat datum at sea level. */
  terrain: { id: string; sha256: string } | null;
  /** The flat datum's grid (UTM metres), when there is no terrain. */
  flatGrid: CoverageRunGrid | null;
  site: {
    boundary: [number, number][] | null;
    zones: { name: string; weight: number; ring: [number, number][] }[];
    /** Land/sea mask: cells at or below this height are sea, metres; null = not stated. */
    seaLevelMaxM: number | null;
    /** Land/sea mask: the sea part as a WGS84 ring; null = not drawn. */
    seaArea: [number, number][] | null;
    /**
     * Coast watch (present only when the site has a shoreline and bands, so
     * older plans keep their inputs hash): the shoreline ([lon, lat] from
     * chainage 0), the offshore bands, the site's time zone for the hourly
     * series.
     */
    shore?: { shoreline: [number, number][]; bands: { name: string; fromM: number; toM: number }[]; timeZone: string };
    /** Water levels above the datum, each a condition of the run (present only when the site states a tide). */
    tideLevels?: TideLevel[];
    /** What heights are measured from (present only with a tide). */
    heightDatum?: HeightDatum;
  };
  posts: {
    id: string;
    name: string;
    latDeg: number;
    lonDeg: number;
    /** Recorded ground elevation, metres (used on the flat datum only; on terrain the grid's ground is used). */
    groundElevationM: number;
    /** Structure height + eye height above the platform, metres. */
    aboveGroundM: number;
    sector: { fromDeg: number; toDeg: number } | null;
    /** A vessel: rides the tide (present only when true). */
    floats?: true;
    /**
     * A vessel's or aircraft's patrol: its route (WGS84), speed (m/s) and
     * cycle (minutes). Absent for a fixed post (so the inputs of plans
     * without patrols hash as before).
     */
    patrol?: { route: { latDeg: number; lonDeg: number }[]; speedMps: number; cycleMinutes: number };
  }[];
  targets: {
    id: string;
    name: string;
    heightM: number;
    /** Height above ground that must be in view to count, metres: the target's height less the part that must show. */
    countsFromM: number;
    requiredVisibleM: number;
    /** Critical width for the angular-size limit, metres. */
    widthM: number;
    period: 'day' | 'night';
    /** Candela, or null for no light. */
    lightIntensityCd: number | null;
    /** Floats on the water: the wave screen and the sea mask apply. */
    onWater: boolean;
  }[];
  conditions: {
    conditionSetId: string;
    conditionSetName: string;
    conditionIndex: number;
    label: string;
    k: number;
    /** The set's visibility, metres; null = not stated. */
    visibilityM: number | null;
    visibilityKind: 'mor-5pct' | 'meteorological-range-2pct';
    seaState: number | null;
    significantWaveHeightM: number | null;
    backgroundLighting: 'none' | 'some' | 'much';
  }[];
  /** Conditions left out of the terrain coverage, and why. */
  skippedConditions: { conditionSetName: string; conditionLabel: string; reason: string }[];
  earthRadiusM: number;
  standard: Plan['standard'];
  /** The lookout's resolving angle in object space (the eye's over the optics' magnification), arcminutes. */
  resolutionArcmin: number;
  /** `DETECTION_MODEL_VERSION` the run was asked with: a new model gives new figures. */
  detectionModel: string;
  blindAreaMinAreaM2: number;
}

/** Why a duct (k ≥ 1) has no terrain coverage. */
export const DUCT_REASON =
  'k ≥ 1: a duct. The sight line bends at least as much as the earth, so there is no horizon and the seen area is not defined; judge such conditions from the sightline results.';

/** `${targetId}:${conditionSetId}:${conditionIndex}`, then `:tide-low`, `:tide-high` or `:tide-level` when the site states a tide. */
export const caseKeyOf = (targetId: string, conditionSetId: string, conditionIndex: number, tide?: TideLevel | null) =>
  `${targetId}:${conditionSetId}:${conditionIndex}${tide ? `:tide-${tide.id}` : ''}`;

/** sha256 of the canonical JSON of the inputs, hex. */
export const coverageInputsHash = (inputs: CoverageRunInputs) => createHash('sha256').update(canonicalJson(inputs)).digest('hex');

/** A condition for people: its preset's name, else its k. */
export const conditionLabel = (condition: RefractionCondition, k: number): string => {
  if ('preset' in condition) {
    const preset = REFRACTION_PRESETS.find((p) => p.id === condition.preset);
    if (preset) return preset.label;
  }
  return `k = ${formatK(k)}`;
};

/**
 * A grid over the site's boundary in the UTM zone of its centre, for sites
 * without terrain: the ground is the datum (sea level), so coverage is limited
 * by the horizon, the sectors and the visibility only.
 *
 * @returns null when the site has no boundary
 */
export function flatDatumGrid(site: Pick<Site, 'boundary'>): CoverageRunGrid | null {
  if (!site.boundary || site.boundary.length < 3) return null;
  const lats = site.boundary.map(([, lat]) => lat);
  const lons = site.boundary.map(([lon]) => lon);
  const centre = {
    latDeg: (Math.min(...lats) + Math.max(...lats)) / 2,
    lonDeg: (Math.min(...lons) + Math.max(...lons)) / 2,
  };
  const zone = utmZoneFor(centre.latDeg, centre.lonDeg);
  const epsg = (centre.latDeg >= 0 ? 32600 : 32700) + zone;
  const projection = gridProjection({ epsg, wkt: null });
  const points = site.boundary.map(([lonDeg, latDeg]) => projection.toGrid({ latDeg, lonDeg }));
  const west = Math.min(...points.map((p) => p.x));
  const east = Math.max(...points.map((p) => p.x));
  const south = Math.min(...points.map((p) => p.y));
  const north = Math.max(...points.map((p) => p.y));
  // Whole metres, at most FLAT_GRID_MAX_EDGE cells a side, one cell of margin all round.
  const cellSizeM = Math.max(1, Math.ceil(Math.max(east - west, north - south) / (FLAT_GRID_MAX_EDGE - 2)));
  const xllM = Math.floor(west / cellSizeM) * cellSizeM - cellSizeM;
  const yllM = Math.floor(south / cellSizeM) * cellSizeM - cellSizeM;
  return {
    width: Math.ceil((east - xllM) / cellSizeM) + 1,
    height: Math.ceil((north - yllM) / cellSizeM) + 1,
    cellSizeM,
    xllM,
    yllM,
    epsg,
  };
}

/** Resolves a plan's site, posts, targets and conditions into the inputs of a run. */
export function buildCoverageInputs(input: {
  site: Site;
  terrain: { id: string; sha256: string } | null;
  posts: Post[];
  targets: Target[];
  conditionSets: ConditionSet[];
  standard: Plan['standard'];
  lookout?: PlanLookout;
}): CoverageRunInputs {
  const earthRadiusM = MEAN_EARTH_RADIUS_M;
  const tideLevels = tideLevelsOf(input.site.tide);
  const conditions = input.conditionSets.flatMap((set) =>
    (set.conditions as RefractionCondition[]).map((condition, conditionIndex) => {
      const k = refractionFromCondition(condition, earthRadiusM);
      return {
        conditionSetId: set.id,
        conditionSetName: set.name,
        conditionIndex,
        label: conditionLabel(condition, k),
        k,
        visibilityM: set.visibilityM,
        visibilityKind: set.visibilityKind,
        seaState: set.seaState,
        significantWaveHeightM: set.significantWaveHeightM,
        backgroundLighting: set.backgroundLighting,
      };
    }),
  );
  return {
    terrain: input.terrain,
    flatGrid: input.terrain ? null : flatDatumGrid(input.site),
    site: {
      boundary: input.site.boundary,
      zones: input.site.priorityZones.map((z) => ({ name: z.name, weight: z.weight, ring: z.ring })),
      seaLevelMaxM: input.site.seaLevelMaxM,
      seaArea: input.site.seaArea,
      ...(input.site.shoreline &&
        (input.site.bands ?? []).length > 0 && {
          shore: { shoreline: input.site.shoreline, bands: input.site.bands!, timeZone: input.site.timeZone },
        }),
      ...(tideLevels.length > 0 && { tideLevels, heightDatum: input.site.heightDatum ?? 'mean-sea-level' }),
    },
    posts: input.posts.map((p) => ({
      id: p.id,
      name: p.name,
      latDeg: p.location.latDeg,
      lonDeg: p.location.lonDeg,
      groundElevationM: p.groundElevationM,
      aboveGroundM: p.structureHeightM + p.eyeHeightM,
      sector: p.sector,
      ...(p.kind === 'vessel' && { floats: true as const }),
      ...(p.route &&
        p.speedMps &&
        p.cycleMinutes && { patrol: { route: p.route, speedMps: p.speedMps, cycleMinutes: p.cycleMinutes } }),
    })),
    targets: input.targets.map((t) => ({
      id: t.id,
      name: t.name,
      heightM: t.heightM,
      countsFromM: Math.max(0, t.heightM - t.requiredVisibleM),
      requiredVisibleM: t.requiredVisibleM,
      widthM: t.widthM,
      period: t.period,
      lightIntensityCd: t.lightIntensityCd,
      onWater: t.onWater,
    })),
    conditions: conditions.filter((c) => c.k < 1),
    skippedConditions: conditions
      .filter((c) => c.k >= 1)
      .map((c) => ({ conditionSetName: c.conditionSetName, conditionLabel: c.label, reason: DUCT_REASON })),
    earthRadiusM,
    standard: input.standard,
    resolutionArcmin: effectiveResolutionArcmin(input.lookout ?? { resolutionArcmin: 1, magnification: 1 }),
    detectionModel: DETECTION_MODEL_VERSION,
    blindAreaMinAreaM2: BLIND_AREA_MIN_M2,
  };
}
