/**
 * Conventional values of the sightline core's detection model (visibility
 * thresholds, refraction regimes, night lights, sea state, model version).
 * Physical constants (earth radius, standard k, standard atmosphere) live in
 * `@/shared/physics/constants`.
 */

/**
 * Threshold contrast behind each kind of reported visibility:
 * - `meteorological-range-2pct`: the meteorological range ("standard
 *   visibility") with ε = 0.02, V = 3.912/σ (AMS Glossary of Meteorology,
 *   "meteorological range", 2000–2012 text; the 2021 edit moved it to 0.05).
 * - `mor-5pct`: the meteorological optical range, 95 % attenuation of a
 *   collimated beam, V = 2.996/σ (CIE S 017 term 17-31-018; WMO-No. 8).
 */
export const VISIBILITY_CONTRAST_THRESHOLD = Object.freeze({
  'meteorological-range-2pct': 0.02,
  'mor-5pct': 0.05,
} as const);

/**
 * Refraction regime boundaries on k (see `classifyRefraction`):
 * sub-refraction below `SUB_REFRACTION_BELOW_K`, standard from there up to
 * (not including) `SUPER_REFRACTION_FROM_K`, super-refraction from it up to
 * `DUCTING_FROM_K`, ducting from `DUCTING_FROM_K` on.
 */
export const SUB_REFRACTION_BELOW_K = 0;

/**
 * Lower edge of super-refraction, k = 0.5 ≈ dN/dh of −79 N/km (the
 * super-refraction threshold of radio meteorology, −79 N/km · R ≈ 0.503).
 * The standard band 0 ≤ k < 0.5 therefore holds the optical conventions
 * (0.13, 1/7, ≈ 0.17) and the radio standard atmosphere (−40 N/km, k ≈ 0.25).
 */
export const SUPER_REFRACTION_FROM_K = 0.5;

/** k = 1: a ray bends exactly with the Earth; the effective surface is flat. */
export const DUCTING_FROM_K = 1;

/**
 * Threshold illuminance for sighting a point light at night against a dark
 * background, lux: 0.2 µlux = 2 × 10⁻⁷ lx. The value behind the nominal range
 * of lights. Source: IALA Recommendation E-200-2 on marine signal lights
 * (nominal range), as quoted in the IES definition "nominal range of a light
 * signal" (0.2 microlux, 0.74 transmissivity per nautical mile for a
 * meteorological visibility of 10 nmi).
 */
export const NIGHT_THRESHOLD_ILLUMINANCE_LUX = 2e-7;

/**
 * Factors on the night threshold for a light seen against lights behind it
 * (shore lights, a lit harbour): none 1, some 10, much 100. From memory, after
 * IALA Recommendation E-200-2's treatment of background lighting (threshold
 * ten and a hundred times the dark-background value); an agency with its own
 * figure should enter it as a factor.
 */
export const BACKGROUND_LIGHTING_FACTOR = Object.freeze({ none: 1, some: 10, much: 100 } as const);

/** Background behind a light at night (see {@link BACKGROUND_LIGHTING_FACTOR}). */
export type BackgroundLighting = keyof typeof BACKGROUND_LIGHTING_FACTOR;

/**
 * Significant wave height per sea-state degree 0–9 (Douglas sea scale, WMO
 * code table 3700): the upper edge of each degree's range, metres (degree 9,
 * "phenomenal", has no upper edge and is taken at its lower edge, 14 m).
 * Source: WMO Manual on Codes (WMO-No. 306), code table 3700 "State of the
 * sea" — heights from memory: 0 calm-glassy 0, 1 calm-rippled 0–0.1,
 * 2 smooth 0.1–0.5, 3 slight 0.5–1.25, 4 moderate 1.25–2.5, 5 rough 2.5–4,
 * 6 very rough 4–6, 7 high 6–9, 8 very high 9–14, 9 phenomenal over 14.
 */
export const SEA_STATE_WAVE_HEIGHT_M = Object.freeze([0, 0.1, 0.5, 1.25, 2.5, 4, 6, 9, 14, 14] as const);

/**
 * Version of Kenning's detection model (what counts as detected: view,
 * visibility, angular size, luminous range, wave screen). Frozen with every
 * coverage run and plan revision so approved figures keep the model they
 * were made with; change it whenever the model's result for the same inputs
 * changes.
 */
export const DETECTION_MODEL_VERSION = 'kenning-detection/2';
