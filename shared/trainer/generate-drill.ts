// Over 300 lines: one seeded generator per drill kind, sharing the question, scoring and explanation shapes.
import type { ConditionSet, Target } from '@/shared/schemas/library';
import type {
  DrillAnswerUnit,
  DrillExplanation,
  DrillInputs,
  DrillKind,
  DrillQuestion,
  DrillUnits,
} from '@/shared/schemas/drill';
import type { RefractionCondition } from '@/shared/schemas/sightline';
import { intersectBearings } from '@/shared/fixes/intersect-bearings';
import { offsetPoint } from '@/shared/fixes/offset-point';
import { FixError } from '@/shared/fixes/fix-error';
import { geodesicInverse } from '@/shared/geo/geodesic-inverse';
import type { LatLon } from '@/shared/geo/types';
import { MEAN_EARTH_RADIUS_M, STANDARD_OPTICAL_K } from '@/shared/physics/constants';
import { detectionInputsOf } from '@/shared/sightline/detection-inputs';
import { effectiveRadius } from '@/shared/sightline/effective-radius';
import { evaluateSightline, SIGHTLINE_CAUTIONS } from '@/shared/sightline/evaluate-sightline';
import { formatK } from '@/shared/sightline/format-k';
import { hiddenHeight } from '@/shared/sightline/hidden-height';
import { horizonDip } from '@/shared/sightline/horizon-dip';
import { horizonDistance } from '@/shared/sightline/horizon-distance';
import { refractionFromCondition } from '@/shared/sightline/refraction-from-condition';
import { refractionPreset, type RefractionPresetId } from '@/shared/sightline/refraction-presets';
import { terrainProfile } from '@/shared/terrain/terrain-profile';
import { TerrainInputError } from '@/shared/terrain/terrain-input-error';
import type { TerrainRaster } from '@/shared/terrain/terrain-raster';
import { convertAngle } from '@/shared/units/angle';
import { convertLength } from '@/shared/units/length';
import { drillScoring } from '@/shared/trainer/score-drill-answer';
import { seededRandom, type SeededRandom } from '@/shared/trainer/seeded-random';

/** Where a drill is set: one of the organisation's posts, or open water (post null). */
export interface DrillSetup {
  readonly post: {
    readonly name: string;
    /** Height of eye above the ground its targets stand on (the smooth-earth datum), metres. */
    readonly eyeHeightM: number;
    /** Where it stands, WGS84 degrees (bearing-fix questions). */
    readonly location?: LatLon;
  } | null;
  /** Other posts of the same site, in a stable order (by name): the second post of a bearing-fix question. */
  readonly otherPosts?: readonly { readonly name: string; readonly location: LatLon }[];
  /**
   * The post's site terrain, when it has one: target-visible questions are then set on the terrain
   * profile from the post (grid bearing and distance) instead of over open water.
   */
  readonly terrain?: {
    readonly raster: TerrainRaster;
    /** The post's position in the grid's metres. */
    readonly x: number;
    readonly y: number;
    /** Eye above the post's ground (structure + eye), metres. */
    readonly eyeAboveGroundM: number;
  } | null;
  /** The post's site's landmarks (named reference marks), in a stable order (by name): landmark-range questions. */
  readonly landmarks?: readonly { readonly name: string; readonly location: LatLon; readonly heightM: number | null }[];
  /** The organisation's targets, in a stable order (by name). */
  readonly targets: readonly Pick<
    Target,
    'name' | 'kind' | 'heightM' | 'widthM' | 'requiredVisibleM' | 'period' | 'lightIntensityCd' | 'onWater'
  >[];
  /** The organisation's condition sets, in a stable order (by name). */
  readonly conditionSets: readonly Pick<
    ConditionSet,
    'name' | 'conditions' | 'visibilityM' | 'visibilityKind' | 'seaState' | 'significantWaveHeightM' | 'backgroundLighting'
  >[];
}

/** A generated drill: the question, and what is only shown after the answer. */
export interface GeneratedDrill {
  readonly question: DrillQuestion;
  readonly solution: { readonly correctValue: number | boolean; readonly explanation: DrillExplanation };
}

/** A kind that cannot be set here (yet); `reason` is for people. */
export class DrillUnavailableError extends Error {
  override readonly name = 'DrillUnavailableError';
}

const R = MEAN_EARTH_RADIUS_M;
/** Everyday optical conditions a question is set under. */
const EVERYDAY_K: readonly RefractionPresetId[] = [
  'no-refraction',
  'standard-optical',
  'levelling-one-seventh',
  'nautical-tables',
  'standard-atmosphere',
];
/** The conditions a refraction-effect question compares with standard optical. */
const OTHER_CONDITIONS: readonly RefractionPresetId[] = [
  'no-refraction',
  'sub-refraction-heated-ground',
  'super-refraction-inversion',
  'radio-four-thirds',
];
/** Heights of eye of an open-water setup: a small boat's cockpit to a high bridge or a cliff-top post, metres. */
const OPEN_WATER_EYES_M = [2, 3, 5, 8, 12, 15, 20, 25, 30, 40];

const UNIT_WORDS: Record<DrillAnswerUnit, string> = {
  km: 'kilometres',
  nmi: 'nautical miles',
  mi: 'statute miles',
  m: 'metres',
  ft: 'feet',
  'yes-no': 'yes or no',
};

const distanceUnit = (units: DrillUnits): 'km' | 'nmi' | 'mi' =>
  units === 'nautical' ? 'nmi' : units === 'imperial' ? 'mi' : 'km';
const heightUnit = (units: DrillUnits): 'm' | 'ft' => (units === 'imperial' ? 'ft' : 'm');
const num = (value: number, digits = 3) => String(Number(value.toPrecision(digits)));
const say = (metres: number, unit: 'km' | 'nmi' | 'mi' | 'm' | 'ft', digits = 3) =>
  `${num(convertLength(metres, 'm', unit), digits)} ${unit}`;
const cautions = () => SIGHTLINE_CAUTIONS.map((c) => ({ ...c }));
const where = (setup: DrillSetup) => (setup.post ? `From ${setup.post.name}` : 'From a lookout on open water');

function eyeOf(setup: DrillSetup, random: SeededRandom): number {
  return setup.post ? setup.post.eyeHeightM : random.pick(OPEN_WATER_EYES_M);
}

/** R′ = R/(1 − k), the horizon and the dip, with the formula put in words. */
function horizonFigures(h: number, k: number) {
  const r = effectiveRadius({ k }).value;
  const d = horizonDistance(h, { k }).value;
  const dip = horizonDip(h, { k }).value;
  return { r, d, dipDeg: dip === null ? null : convertAngle(dip, 'rad', 'deg') };
}

/** A round distance in the question's unit (so the text and the inputs agree exactly), metres. */
function roundDistance(metres: number, unit: 'km' | 'nmi' | 'mi'): number {
  return convertLength(Math.max(0.5, Math.round(convertLength(metres, 'm', unit) * 2) / 2), unit, 'm');
}

function horizonDrill(setup: DrillSetup, random: SeededRandom, units: DrillUnits): GeneratedDrill {
  const h = eyeOf(setup, random);
  const k = refractionPreset(random.pick(EVERYDAY_K)).k;
  const { r, d, dipDeg } = horizonFigures(h, k);
  const unit = distanceUnit(units);
  const inputs: DrillInputs = { eyeHeightM: h, k };
  return {
    question: {
      text: `${where(setup)}, height of eye ${say(h, heightUnit(units))}, with k = ${formatK(k)}: how far away is the sea-level horizon? Answer in ${UNIT_WORDS[unit]}.`,
      inputs,
      unit,
    },
    solution: {
      correctValue: convertLength(d!, 'm', unit),
      explanation: {
        text: `The horizon is where the line of sight grazes the effective earth of radius R′ = R/(1 − k). At ${say(h, 'm')} with k = ${formatK(k)} it is ${say(d!, unit)} away; the sea horizon dips ${num(dipDeg! * 60)}′ below the horizontal.`,
        formula: `d = R′·acos(R′/(R′ + h)) ≈ √(2R′h); R′ = ${num(R / 1000, 7)} km / (1 − ${formatK(k)}) = ${num(r! / 1000, 6)} km, h = ${num(h)} m → d = ${say(d!, unit, 4)}`,
        sideView: { eyeHeightM: h, k, effectiveRadiusM: r, horizonDistanceM: d, dipDeg },
        scoring: drillScoring(unit),
        cautions: cautions(),
      },
    },
  };
}

function targetOf(setup: DrillSetup, random: SeededRandom) {
  const tall = setup.targets.filter((t) => t.heightM >= 1);
  return tall.length > 0 ? random.pick(tall) : { name: 'mast', heightM: 30 };
}

/** The start of the drills over open water: the eye, an everyday k, a target, R′ and the horizon, and the side view's common part. */
function overWaterSighting(setup: DrillSetup, random: SeededRandom) {
  const h = eyeOf(setup, random);
  const k = refractionPreset(random.pick(EVERYDAY_K)).k;
  const target = targetOf(setup, random);
  const { r, d: horizon } = horizonFigures(h, k);
  const sideView = (distanceM: number) => ({
    eyeHeightM: h,
    k,
    effectiveRadiusM: r,
    horizonDistanceM: horizon,
    distanceM,
    targetHeightM: target.heightM,
  });
  return { h, k, target, r, horizon, sideView };
}

function hiddenHeightDrill(setup: DrillSetup, random: SeededRandom, units: DrillUnits): GeneratedDrill {
  const { h, k, target, r, horizon, sideView } = overWaterSighting(setup, random);
  const bearingDeg = random.int(0, 359);
  const unit = distanceUnit(units);
  const distanceM = roundDistance(horizon! * random.between(1.2, 2.6), unit);
  const hidden = hiddenHeight(h, distanceM, { k }).value ?? 0;
  const answerUnit = heightUnit(units);
  const visible = Math.max(0, target.heightM - hidden);
  return {
    question: {
      text:
        `${where(setup)}, height of eye ${say(h, answerUnit)}, a ${target.name} ${say(target.heightM, answerUnit)} tall stands at bearing ${String(bearingDeg).padStart(3, '0')}°, ` +
        `${say(distanceM, unit)} away. With k = ${formatK(k)}, how much of it is hidden below the horizon? Answer in ${UNIT_WORDS[answerUnit]}.`,
      inputs: { eyeHeightM: h, k, targetHeightM: target.heightM, distanceM, bearingDeg, targetName: target.name },
      unit: answerUnit,
    },
    solution: {
      correctValue: convertLength(hidden, 'm', answerUnit),
      explanation: {
        text:
          `The horizon is ${say(horizon!, unit)} away; the target stands ${say(distanceM - horizon!, unit)} beyond it, and the effective earth hides its lowest ` +
          `${say(hidden, answerUnit)}${visible > 0 ? `, leaving ${say(visible, answerUnit)} above the horizon line` : ': all of it'}.`,
        formula:
          `hidden = R′/cos((D − d_h)/R′) − R′ ≈ (D − d_h)²/(2R′); R′ = ${num(r! / 1000, 6)} km, d_h = ${num(horizon! / 1000, 4)} km, ` +
          `D = ${num(distanceM / 1000, 4)} km → ${say(hidden, answerUnit, 4)}`,
        sideView: {
          ...sideView(distanceM),
          hiddenHeightM: hidden,
          visibleHeightM: visible,
        },
        scoring: drillScoring(answerUnit),
        cautions: cautions(),
      },
    },
  };
}

/** Target-visible on the post's terrain: the terrain profile to a seeded point; null when no point on the grid works. */
function terrainVisibleDrill(setup: DrillSetup, random: SeededRandom, units: DrillUnits): GeneratedDrill | null {
  const terrain = setup.terrain;
  if (!terrain || !setup.post) return null;
  const { raster } = terrain;
  const k = refractionPreset(random.pick(EVERYDAY_K)).k;
  const target = targetOf(setup, random);
  const part = random.pick(['top', 'base'] as const);
  const unit = distanceUnit(units);
  const east = [raster.xll, raster.xll + raster.width * raster.cellSize];
  const north = [raster.yll, raster.yll + raster.height * raster.cellSize];
  for (let attempt = 0; attempt < 16; attempt += 1) {
    const bearingDeg = random.int(0, 359);
    const b = convertAngle(bearingDeg, 'deg', 'rad');
    // How far the grid reaches along this bearing (to one cell inside its edge).
    const reach = Math.min(
      ...[
        Math.sin(b) > 1e-9 ? (east[1]! - raster.cellSize - terrain.x) / Math.sin(b) : Infinity,
        Math.sin(b) < -1e-9 ? (east[0]! + raster.cellSize - terrain.x) / Math.sin(b) : Infinity,
        Math.cos(b) > 1e-9 ? (north[1]! - raster.cellSize - terrain.y) / Math.cos(b) : Infinity,
        Math.cos(b) < -1e-9 ? (north[0]! + raster.cellSize - terrain.y) / Math.cos(b) : Infinity,
      ],
    );
    if (!(reach > 1500)) continue;
    const distanceM = roundDistance(random.between(1000, Math.min(reach, 40_000)), unit);
    if (distanceM > reach) continue;
    let profile;
    try {
      profile = terrainProfile(raster, {
        observer: { x: terrain.x, y: terrain.y, eyeHeight: terrain.eyeAboveGroundM },
        target: { x: terrain.x + distanceM * Math.sin(b), y: terrain.y + distanceM * Math.cos(b), height: target.heightM },
        conditions: [{ refractionCoefficient: k, earthRadius: R }],
      });
    } catch (error) {
      if (error instanceof TerrainInputError) continue;
      throw error;
    }
    const c = profile.conditions[0]!;
    const visible = part === 'top' ? c.targetTopSeen : c.groundSeen;
    const blocker = c.firstObstruction;
    const hidden = Number.isFinite(c.hiddenHeight) ? c.hiddenHeight : null;
    const eyeAbove = terrain.eyeAboveGroundM;
    return {
      question: {
        text:
          `From ${setup.post.name} (eye ${say(eyeAbove, heightUnit(units))} above its ground), a ${target.name} ${say(target.heightM, heightUnit(units))} tall stands at grid bearing ` +
          `${String(bearingDeg).padStart(3, '0')}°, ${say(distanceM, unit)} away on the site's terrain. With k = ${formatK(k)}, can the lookout see its ${part}? Answer yes (true) or no (false).`,
        inputs: {
          eyeHeightM: eyeAbove,
          k,
          targetHeightM: target.heightM,
          distanceM,
          bearingDeg,
          targetName: target.name,
          part,
          basis: 'terrain',
        },
        unit: 'yes-no',
      },
      solution: {
        correctValue: visible,
        explanation: {
          text:
            `Along the terrain profile the eye is at ${num(profile.eyeElevation, 4)} m and the target's ground at ${num(profile.targetGround, 4)} m. ` +
            (blocker
              ? `The ground at ${say(blocker.distance, unit)} (${num(blocker.ground, 4)} m) rises into the line of sight first; `
              : 'Nothing rises into the line of sight to the target’s ground; ') +
            `${hidden === null ? 'all' : say(hidden, 'm')} of the target is hidden, so its ${part} is ${visible ? '' : 'not '}seen. Seen is not the same as detected.`,
          formula: `ground lowered by (1 − k)·d²/(2R) = (1 − ${formatK(k)})·d²/(2 × ${num(R / 1000, 7)} km) along the profile; the sight line from the eye clears the highest lowered ground, or not`,
          sideView: {
            eyeHeightM: eyeAbove,
            k,
            eyeElevationM: profile.eyeElevation,
            observerGroundM: profile.observerGround,
            targetGroundM: profile.targetGround,
            distanceM: profile.distance,
            targetHeightM: target.heightM,
            hiddenHeightM: hidden,
            firstObstructionDistanceM: blocker?.distance ?? null,
            firstObstructionGroundM: blocker?.ground ?? null,
            horizonDistanceM: c.horizon?.distance ?? null,
            part,
            visible,
            basis: 'terrain',
          },
          scoring: drillScoring('yes-no'),
          cautions: cautions(),
        },
      },
    };
  }
  return null;
}

function targetVisibleDrill(setup: DrillSetup, random: SeededRandom, units: DrillUnits): GeneratedDrill {
  const onTerrain = terrainVisibleDrill(setup, random, units);
  if (onTerrain) return onTerrain;
  const { h, k, target, r, horizon, sideView } = overWaterSighting(setup, random);
  const part = random.pick(['top', 'base'] as const);
  // Near the edge: the top shows out to the geographic range, the base to the horizon.
  const targetHorizon = horizonDistance(target.heightM, { k }).value!;
  const edge = part === 'top' ? horizon! + targetHorizon : horizon!;
  const unit = distanceUnit(units);
  const distanceM = roundDistance(edge * random.between(0.7, 1.3), unit);
  const hidden = hiddenHeight(h, distanceM, { k }).value ?? Number.POSITIVE_INFINITY;
  const visible = part === 'top' ? hidden < target.heightM : hidden <= 0;
  return {
    question: {
      text:
        `${where(setup)}, height of eye ${say(h, heightUnit(units))}, a ${target.name} ${say(target.heightM, heightUnit(units))} tall stands ${say(distanceM, unit)} away over open water. ` +
        `With k = ${formatK(k)}, is its ${part} above the horizon line? Answer yes (true) or no (false).`,
      inputs: { eyeHeightM: h, k, targetHeightM: target.heightM, distanceM, targetName: target.name, part },
      unit: 'yes-no',
    },
    solution: {
      correctValue: visible,
      explanation: {
        text:
          part === 'top'
            ? `The top shows out to the geographic range, ${say(horizon!, unit)} + ${say(targetHorizon, unit)} = ${say(edge, unit)}; at ${say(distanceM, unit)} it is ${visible ? '' : 'not '}above the horizon line (hidden part ${say(Number.isFinite(hidden) ? hidden : target.heightM, 'm')}).`
            : `The base shows only inside the horizon, ${say(horizon!, unit)}; at ${say(distanceM, unit)} it is ${visible ? '' : 'not '}visible. Above the horizon line is not the same as detected.`,
        formula:
          part === 'top'
            ? `geographic range = d_h(eye) + d_h(top) = √(2R′·${num(h)} m) + √(2R′·${num(target.heightM)} m), R′ = ${num(r! / 1000, 6)} km → ${say(edge, unit, 4)}`
            : `d_h = √(2R′h) = √(2 · ${num(r! / 1000, 6)} km · ${num(h)} m) → ${say(horizon!, unit, 4)}`,
        sideView: {
          ...sideView(distanceM),
          hiddenHeightM: Number.isFinite(hidden) ? hidden : null,
          geographicRangeM: horizon! + targetHorizon,
          part,
          visible,
        },
        scoring: drillScoring('yes-no'),
        cautions: cautions(),
      },
    },
  };
}

function detectionDrill(setup: DrillSetup, random: SeededRandom, units: DrillUnits): GeneratedDrill {
  if (setup.targets.length === 0 || setup.conditionSets.length === 0) {
    throw new DrillUnavailableError('A detection-range drill needs at least one target and one condition set in the library.');
  }
  const h = eyeOf(setup, random);
  const unit = distanceUnit(units);
  // A few seeded tries for a case with a finite, non-zero range (a target screened by waves or unlit at night has none).
  for (let attempt = 0; attempt < 12; attempt += 1) {
    const target = random.pick(setup.targets);
    const set = random.pick(setup.conditionSets);
    const condition = random.pick(set.conditions) as RefractionCondition;
    const k = refractionFromCondition(condition, R);
    const answer = evaluateSightline({
      observerHeightM: h,
      ...detectionInputsOf({ ...target, onWater: target.onWater }, set),
      conditions: [condition],
    });
    const result = answer.results[0]!;
    if (result.detectionRangeM === null || result.detectionRangeM <= 0 || k >= 1) continue;
    const limits = [
      ['horizon (geographic range of the required part)', result.geographicRangeM],
      ['visibility', result.visibilityLimitM],
      ['angular size', result.angularSizeLimitM],
      ['luminous range', result.luminousRangeM],
    ] as const;
    const listed = limits
      .filter(([, value]) => value !== null)
      .map(([name, value]) => `${name} ${say(value!, unit)}`)
      .join('; ');
    return {
      question: {
        text:
          `${where(setup)}, height of eye ${say(h, heightUnit(units))}, under “${set.name}” (k = ${formatK(k)}${set.visibilityM !== null ? `, visibility ${say(set.visibilityM, unit)}` : ''}): ` +
          `at what range can a ${target.name} be detected, and which limit sets it? Answer the range in ${UNIT_WORDS[unit]}.`,
        inputs: {
          eyeHeightM: h,
          k,
          targetHeightM: target.heightM,
          targetName: target.name,
          conditionSetName: set.name,
          visibilityM: set.visibilityM,
        },
        unit,
      },
      solution: {
        correctValue: convertLength(result.detectionRangeM, 'm', unit),
        explanation: {
          text: `The detection range is the least of the limits: ${listed}. Here the ${result.limitedBy} limit sets it at ${say(result.detectionRangeM, unit)}.`,
          formula: `range = min(geographic range, visibility limit, angular-size limit${result.luminousRangeM !== null ? ', luminous range' : ''}) = ${say(result.detectionRangeM, unit, 4)} (${result.limitedBy})`,
          sideView: {
            eyeHeightM: h,
            k,
            effectiveRadiusM: result.effectiveRadiusM,
            horizonDistanceM: result.horizonDistanceM,
            targetHeightM: target.heightM,
            geographicRangeM: result.geographicRangeM,
            visibilityLimitM: result.visibilityLimitM,
            angularSizeLimitM: result.angularSizeLimitM,
            luminousRangeM: result.luminousRangeM,
            waveScreenM: result.waveScreenM,
            detectionRangeM: result.detectionRangeM,
            limitedBy: result.limitedBy,
          },
          scoring: drillScoring(unit),
          cautions: cautions(),
        },
      },
    };
  }
  throw new DrillUnavailableError(
    'No target of the library is detectable under its condition sets from here (waves, night without a light).',
  );
}

function refractionEffectDrill(setup: DrillSetup, random: SeededRandom, units: DrillUnits): GeneratedDrill {
  const h = eyeOf(setup, random);
  const base = refractionPreset('standard-optical');
  const other = refractionPreset(random.pick(OTHER_CONDITIONS));
  const unit = distanceUnit(units);
  const before = horizonFigures(h, base.k);
  const after = horizonFigures(h, other.k);
  return {
    question: {
      text:
        `${where(setup)}, height of eye ${say(h, heightUnit(units))}, the horizon is ${say(before.d!, unit)} away with k = ${formatK(base.k)}. ` +
        `How far is it under ${other.label.replace(/ \(k.*\)$/, '')} (k = ${formatK(other.k)})? Answer in ${UNIT_WORDS[unit]}.`,
      inputs: { eyeHeightM: h, k: base.k, otherK: other.k },
      unit,
    },
    solution: {
      correctValue: convertLength(after.d!, 'm', unit),
      explanation: {
        text:
          `The horizon distance goes as √R′ = √(R/(1 − k)): from k = ${formatK(base.k)} to ${formatK(other.k)} it changes by the factor ` +
          `√((1 − ${formatK(base.k)})/(1 − ${formatK(other.k)})) = ${num(after.d! / before.d!, 4)}, to ${say(after.d!, unit)}.`,
        formula: `d₂ = d₁·√((1 − k₁)/(1 − k₂)) = ${num(convertLength(before.d!, 'm', unit), 4)} × ${num(Math.sqrt((1 - base.k) / (1 - other.k)), 4)} ≈ ${say(after.d!, unit, 4)}`,
        sideView: {
          eyeHeightM: h,
          k: base.k,
          otherK: other.k,
          effectiveRadiusM: before.r,
          otherEffectiveRadiusM: after.r,
          horizonDistanceM: before.d,
          otherHorizonDistanceM: after.d,
          dipDeg: before.dipDeg,
          otherDipDeg: after.dipDeg,
        },
        scoring: drillScoring(unit),
        cautions: cautions(),
      },
    },
  };
}

/** Cut angles a question accepts, degrees from parallel: a fix outside 30°…150° is poor (common practice). */
const FIX_CUT_MIN_DEG = 30;

function bearingFixDrill(setup: DrillSetup, random: SeededRandom, units: DrillUnits): GeneratedDrill {
  const a = setup.post;
  const others = setup.otherPosts ?? [];
  if (!a?.location || others.length === 0) {
    throw new DrillUnavailableError(
      'Bearing-fix drills are not available yet for this post: they need the post and a second post on the same site.',
    );
  }
  const b = random.pick(others);
  const baseline = geodesicInverse(a.location, b.location);
  const unit = distanceUnit(units);
  for (let attempt = 0; attempt < 24; attempt += 1) {
    // A smoke 2–30 km from the first post (at least half the baseline), anywhere around it.
    const d = random.between(Math.max(2000, baseline.distanceM / 2), Math.max(30_000, baseline.distanceM * 2));
    const azimuth = convertAngle(random.int(0, 359) + random.next(), 'deg', 'rad');
    const smoke = offsetPoint(a.location, d * Math.sin(azimuth), d * Math.cos(azimuth));
    // Bearings as lookouts report them: whole degrees true.
    const bearingA = Math.round(geodesicInverse(a.location, smoke).azimuthDeg) % 360;
    const bearingB = Math.round(geodesicInverse(b.location, smoke).azimuthDeg) % 360;
    let fix;
    try {
      fix = intersectBearings(
        { from: a.location, bearingRad: convertAngle(bearingA, 'deg', 'rad'), sigmaRad: convertAngle(1, 'deg', 'rad') },
        { from: b.location, bearingRad: convertAngle(bearingB, 'deg', 'rad'), sigmaRad: convertAngle(1, 'deg', 'rad') },
      );
    } catch (error) {
      if (error instanceof FixError) continue;
      throw error;
    }
    const cutDeg = convertAngle(fix.cutAngleRad, 'rad', 'deg');
    if (cutDeg < FIX_CUT_MIN_DEG || cutDeg > 180 - FIX_CUT_MIN_DEG) continue;
    const fromA = geodesicInverse(a.location, fix.position).distanceM;
    const fromB = geodesicInverse(b.location, fix.position).distanceM;
    // The plane triangle's sine rule, for the working shown (the answer is the ellipsoidal crossing).
    const between = (x: number, y: number) => Math.abs(((x - y + 540) % 360) - 180);
    const angleA = between(bearingA, baseline.azimuthDeg);
    const angleB = between(bearingB, geodesicInverse(b.location, a.location).azimuthDeg);
    const angleS = 180 - angleA - angleB;
    const planeA =
      (baseline.distanceM * Math.sin(convertAngle(angleB, 'deg', 'rad'))) / Math.sin(convertAngle(angleS, 'deg', 'rad'));
    const pad = (deg: number) => String(deg).padStart(3, '0');
    return {
      question: {
        text:
          `A smoke is reported: from ${a.name} at ${pad(bearingA)}° true, from ${b.name} (${say(baseline.distanceM, unit)} away at ${pad(Math.round(baseline.azimuthDeg) % 360)}°) at ${pad(bearingB)}° true. ` +
          `How far from ${a.name} is the smoke? Answer in ${UNIT_WORDS[unit]}.`,
        inputs: {
          eyeHeightM: a.eyeHeightM,
          k: STANDARD_OPTICAL_K,
          bearingDeg: bearingA,
          otherBearingDeg: bearingB,
          otherPostName: b.name,
          baselineM: baseline.distanceM,
          baselineBearingDeg: baseline.azimuthDeg,
        },
        unit,
      },
      solution: {
        correctValue: convertLength(fromA, 'm', unit),
        explanation: {
          text:
            `The two bearings cross ${say(fromA, unit)} from ${a.name} and ${say(fromB, unit)} from ${b.name}, at a cut of ${num(cutDeg)}° ` +
            `(a fix is best near 90°; below ${FIX_CUT_MIN_DEG}° or above ${180 - FIX_CUT_MIN_DEG}° a degree of error moves it far). A whole-degree bearing is ± 0.5°: ` +
            `at ${say(fromA, unit)} that alone is ± ${say((fromA * Math.PI) / 360, unit)} across the line of sight.`,
          formula:
            `sine rule in the plane triangle of the posts and the smoke: d = baseline · sin B / sin S = ` +
            `${num(convertLength(baseline.distanceM, 'm', unit), 4)} · sin ${num(angleB)}° / sin ${num(angleS)}° = ${say(planeA, unit, 4)} ` +
            `(A = ${num(angleA)}°, B = ${num(angleB)}°, S = 180° − A − B); on the ellipsoid (geodesics, Karney): ${say(fromA, unit, 4)}`,
          sideView: {
            eyeHeightM: a.eyeHeightM,
            k: STANDARD_OPTICAL_K,
            baselineM: baseline.distanceM,
            bearingDeg: bearingA,
            otherBearingDeg: bearingB,
            cutAngleDeg: cutDeg,
            distanceFromPostM: fromA,
            distanceFromOtherPostM: fromB,
            planeDistanceFromPostM: planeA,
            fixLatDeg: fix.position.latDeg,
            fixLonDeg: fix.position.lonDeg,
          },
          scoring: drillScoring(unit),
          cautions: cautions(),
        },
      },
    };
  }
  throw new DrillUnavailableError('These two posts give no usable cut for a smoke within 30 km; set the drill on another post.');
}

/** Landmarks farther than this from the post are not asked about, metres. */
const LANDMARK_MAX_M = 60_000;

/**
 * Range to a named landmark of the post's site: the geodesic distance on the
 * WGS84 ellipsoid (Karney's inverse problem), with the true bearing given as
 * the lookout would read it off the sighting ring. The seed picks the
 * landmark. The explanation gives the distance, the bearing and the cue a
 * lookout uses on the ground (the angle a landmark of known height fills).
 */
function landmarkRangeDrill(setup: DrillSetup, random: SeededRandom, units: DrillUnits): GeneratedDrill {
  const post = setup.post;
  if (!post?.location) {
    throw new DrillUnavailableError('A landmark-range drill is set on a post: choose one of your posts.');
  }
  const from = post.location;
  const near = (setup.landmarks ?? [])
    .map((m) => ({ ...m, leg: geodesicInverse(from, m.location) }))
    .filter((m) => m.leg.distanceM > 50 && m.leg.distanceM <= LANDMARK_MAX_M);
  if (near.length === 0) {
    throw new DrillUnavailableError(
      `${post.name}'s site has no landmark within ${LANDMARK_MAX_M / 1000} km: add landmarks (name and position) to the site first.`,
    );
  }
  const mark = random.pick(near);
  const unit = distanceUnit(units);
  const bearingDeg = Math.round(mark.leg.azimuthDeg) % 360;
  const pad = (deg: number) => String(deg).padStart(3, '0');
  const subtendDeg = mark.heightM ? convertAngle(Math.atan(mark.heightM / mark.leg.distanceM), 'rad', 'deg') : null;
  return {
    question: {
      text:
        `From ${post.name}, ${mark.name} lies at ${pad(bearingDeg)}° true. How far away is it? Answer in ${UNIT_WORDS[unit]}.` +
        (mark.heightM ? ` (${mark.name} stands ${num(mark.heightM)} m high.)` : ''),
      inputs: {
        eyeHeightM: post.eyeHeightM,
        k: STANDARD_OPTICAL_K,
        landmarkName: mark.name,
        bearingDeg,
        landmarkHeightM: mark.heightM,
      },
      unit,
    },
    solution: {
      correctValue: convertLength(mark.leg.distanceM, 'm', unit),
      explanation: {
        text:
          `${mark.name} is ${say(mark.leg.distanceM, unit)} from ${post.name} at ${num(mark.leg.azimuthDeg, 4)}° true. ` +
          'Ranges judged by eye are usually short over open ground and long into haze or against the light; ' +
          'known landmarks at known ranges are the lookout’s yardstick for everything else seen in that direction.' +
          (subtendDeg === null
            ? ''
            : ` A mark ${num(mark.heightM!)} m high fills ${num(subtendDeg * 60)}′ of arc at that range (height / range in radians).`),
        formula:
          `geodesic distance on the WGS84 ellipsoid between the post (${num(from.latDeg, 7)}°, ${num(from.lonDeg, 7)}°) ` +
          `and the landmark (${num(mark.location.latDeg, 7)}°, ${num(mark.location.lonDeg, 7)}°), Karney's inverse problem: ${say(mark.leg.distanceM, unit, 4)}`,
        sideView: {
          eyeHeightM: post.eyeHeightM,
          k: STANDARD_OPTICAL_K,
          distanceM: mark.leg.distanceM,
          bearingDeg: mark.leg.azimuthDeg,
          landmarkName: mark.name,
          landmarkHeightM: mark.heightM,
        },
        scoring: drillScoring(unit),
        cautions: cautions(),
      },
    },
  };
}

/**
 * One drill question of a kind, generated from a seed on a setup (a post of
 * the organisation, or open water) with the organisation's targets and
 * condition sets: the same seed, kind, setup and units give the same
 * question and answer. Smooth-earth geometry throughout (the horizon over
 * open water or level ground); the numbers come from the sightline core
 * (`horizonDistance`, `hiddenHeight`, `evaluateSightline`), never re-derived.
 *
 * @param kind - the kind of question
 * @param seed - whole number; the stream of choices (height of eye for open
 *   water, condition, target, bearing, distance) comes from it
 * @param setup - the post (height of eye above its targets' ground) or null, and the libraries
 * @param units - metric (km, m), nautical (nmi, m) or imperial (mi, ft)
 * @returns the question and its solution (correct value in the question's unit, explanation)
 * @throws {DrillUnavailableError} for `landmark-range` without a post or without a landmark on its site
 *   within 60 km, a bearing-fix drill without a second post on the site, and a detection
 *   drill without the library it needs
 *
 * Source: see the sightline functions it calls.
 *
 * @example
 * generateDrill('horizon-distance', 7, { post: null, targets: [], conditionSets: [] }, 'metric').question.unit; // 'km'
 */
export function generateDrill(kind: DrillKind, seed: number, setup: DrillSetup, units: DrillUnits): GeneratedDrill {
  return DRILL_MAKERS[kind](setup, seededRandom(seed), units);
}

/** The maker of each kind of drill. */
const DRILL_MAKERS: Record<DrillKind, (setup: DrillSetup, random: SeededRandom, units: DrillUnits) => GeneratedDrill> = {
  'horizon-distance': horizonDrill,
  'hidden-height': hiddenHeightDrill,
  'target-visible': targetVisibleDrill,
  'detection-range': detectionDrill,
  'refraction-effect': refractionEffectDrill,
  'landmark-range': landmarkRangeDrill,
  'bearing-fix': bearingFixDrill,
};
