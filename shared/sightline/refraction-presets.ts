import {
  RADIO_FOUR_THIRDS_K,
  STANDARD_OPTICAL_K,
  STANDARD_PRESSURE_HPA,
  STANDARD_TEMPERATURE_GRADIENT_K_PER_M,
  STANDARD_TEMPERATURE_K,
} from '@/shared/physics/constants';
import { refractionFromTemperatureGradient } from '@/shared/sightline/refraction-from-temperature-gradient';
import { SightlineInputError } from '@/shared/sightline/sightline-error';

/** Identifiers of Kenning's named refraction conditions. */
export const REFRACTION_PRESET_IDS = [
  'no-refraction',
  'standard-optical',
  'levelling-one-seventh',
  'nautical-tables',
  'standard-atmosphere',
  'radio-four-thirds',
  'sub-refraction-heated-ground',
  'super-refraction-inversion',
  'ducting-strong-inversion',
] as const;

/** One of {@link REFRACTION_PRESET_IDS}. */
export type RefractionPresetId = (typeof REFRACTION_PRESET_IDS)[number];

/** A named refraction condition, defined by one physical value and its source. */
export interface RefractionPreset {
  readonly id: RefractionPresetId;
  /** Short label for pickers. */
  readonly label: string;
  /** Refraction coefficient, dimensionless. */
  readonly k: number;
  /** What defines the value (the physical quantity and, for temperature cases, P, T and dT/dh). */
  readonly definition: string;
  /** Where the value or relation comes from. */
  readonly source: string;
}

const SURVEYING_RELATION = 'surveying relation k ≈ 503·P/T²·(0.0343 + dT/dh)';

function fromGradient(pressureHpa: number, temperatureK: number, gradientKPerM: number): { k: number; definition: string } {
  const k = refractionFromTemperatureGradient({ pressureHpa, temperatureK, temperatureGradientKPerM: gradientKPerM });
  return {
    k,
    definition: `P = ${pressureHpa} hPa, T = ${temperatureK} K, dT/dh = ${gradientKPerM} K/m through the ${SURVEYING_RELATION}`,
  };
}

const isa = fromGradient(STANDARD_PRESSURE_HPA, STANDARD_TEMPERATURE_K, STANDARD_TEMPERATURE_GRADIENT_K_PER_M);
const heatedGround = fromGradient(STANDARD_PRESSURE_HPA, 308.15, -0.1);
const inversion = fromGradient(STANDARD_PRESSURE_HPA, 283.15, 0.06);
const strongInversion = fromGradient(STANDARD_PRESSURE_HPA, 273.15, 0.15);

const PRESET_TABLE = [
  {
    id: 'no-refraction',
    label: 'No refraction (geometric)',
    k: 0,
    definition: 'k = 0: straight sightlines over the true sphere',
    source: 'Geometric limit of the effective-radius model (IEC 60050-705, 705-05-41, with R′ = R)',
  },
  {
    id: 'standard-optical',
    label: 'Standard optical (k = 0.13)',
    k: STANDARD_OPTICAL_K,
    definition: 'k = 0.13, the conventional coefficient for optical sightlines',
    source: 'Geodetic surveying convention (common practice)',
  },
  {
    id: 'levelling-one-seventh',
    label: 'Levelling rule (k = 1/7)',
    k: 1 / 7,
    definition: 'k = 1/7: refraction taken as one seventh of curvature',
    source: 'Levelling correction c + r ≈ 0.0675 d² m (d in km), standard surveying texts',
  },
  {
    id: 'nautical-tables',
    label: 'Navigation tables (k ≈ 0.172)',
    k: 1 - 0.8279,
    definition: 'k = 1 − β₀ with the refraction factor β₀ = 0.8279',
    source: 'The American Practical Navigator (Bowditch, NGA Pub. 9), Table 12 "Distance of the Horizon"',
  },
  {
    id: 'standard-atmosphere',
    label: `Standard atmosphere (k ≈ ${isa.k.toFixed(3)})`,
    k: isa.k,
    definition: isa.definition,
    source: `ISO 2533 standard atmosphere at sea level; ${SURVEYING_RELATION}`,
  },
  {
    id: 'radio-four-thirds',
    label: 'Radar / radio 4/3 earth (k = 0.25)',
    k: RADIO_FOUR_THIRDS_K,
    definition: 'K = R′/R = 4/3, so k = 1 − 3/4 = 0.25 (dN/dh ≈ −39 N/km)',
    source: 'IEC 60050-705 (705-05-41); Federal Standard 1037C "effective Earth radius"',
  },
  {
    id: 'sub-refraction-heated-ground',
    label: `Sub-refraction, heated ground (k ≈ ${heatedGround.k.toFixed(2)})`,
    k: heatedGround.k,
    definition: heatedGround.definition,
    source: `Illustrative Kenning gradient; ${SURVEYING_RELATION}`,
  },
  {
    id: 'super-refraction-inversion',
    label: `Super-refraction, inversion (k ≈ ${inversion.k.toFixed(2)})`,
    k: inversion.k,
    definition: inversion.definition,
    source: `Illustrative Kenning gradient; ${SURVEYING_RELATION}`,
  },
  {
    id: 'ducting-strong-inversion',
    label: `Ducting, strong inversion (k ≈ ${strongInversion.k.toFixed(2)})`,
    k: strongInversion.k,
    definition: strongInversion.definition,
    source: `Illustrative Kenning gradient; ${SURVEYING_RELATION}`,
  },
] satisfies RefractionPreset[];

/**
 * Kenning's named refraction conditions, in the order a picker shows them
 * (frozen, as is each entry).
 * The three temperature-defined cases are illustrative gradients chosen by
 * Kenning (a hot afternoon over bare ground, a moderate inversion, a strong
 * inversion over cold water), turned into k by the surveying relation.
 */
export const REFRACTION_PRESETS: readonly RefractionPreset[] = Object.freeze(
  PRESET_TABLE.map((preset): RefractionPreset => Object.freeze(preset)),
);

/**
 * Looks up a named refraction condition.
 *
 * @param id - one of {@link REFRACTION_PRESET_IDS}
 * @returns the preset (a frozen shared object: do not mutate)
 * @throws {SightlineInputError} `out-of-range` for an unknown id (validated
 *   input never has one)
 *
 * Source: each preset carries its own `source`.
 *
 * @example
 * refractionPreset('radio-four-thirds').k; // 0.25
 */
export function refractionPreset(id: RefractionPresetId): RefractionPreset {
  const preset = REFRACTION_PRESETS.find((p) => p.id === id);
  if (preset === undefined) {
    throw new SightlineInputError('out-of-range', 'preset', `unknown refraction preset: ${String(id)}`);
  }
  return preset;
}
