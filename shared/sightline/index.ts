/**
 * Kenning's sightline core: horizon, dip, hidden height, geographic and
 * detection range, refraction. Pure and isomorphic; SI units inside
 * (metres, radians, kelvin; pressure in hPa). Convert at the edges with
 * `@/shared/units`.
 */
export * from '@/shared/physics/constants';
export * from '@/shared/sightline/constants';
export type * from '@/shared/sightline/types';
export { SightlineInputError } from '@/shared/sightline/sightline-error';
export { checkInput, type InputBounds } from '@/shared/sightline/check-input';
export { resolveSphere, type ResolvedSphere } from '@/shared/sightline/resolve-sphere';
export { effectiveRadius } from '@/shared/sightline/effective-radius';
export { localRadiusOfCurvature } from '@/shared/sightline/local-radius-of-curvature';
export { horizonDistance } from '@/shared/sightline/horizon-distance';
export { tangentLength } from '@/shared/sightline/tangent-length';
export { horizonDip } from '@/shared/sightline/horizon-dip';
export { horizonDistanceApprox } from '@/shared/sightline/horizon-distance-approx';
export { horizonApproxRelativeError } from '@/shared/sightline/horizon-approx-relative-error';
export { horizonSag } from '@/shared/sightline/horizon-sag';
export { hiddenHeight } from '@/shared/sightline/hidden-height';
export { hiddenHeightApprox } from '@/shared/sightline/hidden-height-approx';
export { visibleHeight } from '@/shared/sightline/visible-height';
export { geographicRange } from '@/shared/sightline/geographic-range';
export { firstSightingRange } from '@/shared/sightline/first-sighting-range';
export {
  refractionFromTemperatureGradient,
  type TemperatureGradientInput,
} from '@/shared/sightline/refraction-from-temperature-gradient';
export { refractionFromTwoTemperatures, type TwoTemperaturesInput } from '@/shared/sightline/refraction-from-two-temperatures';
export { refractionFromRefractivityGradient } from '@/shared/sightline/refraction-from-refractivity-gradient';
export { radioKFactor } from '@/shared/sightline/radio-k-factor';
export { classifyRefraction } from '@/shared/sightline/classify-refraction';
export {
  REFRACTION_PRESETS,
  REFRACTION_PRESET_IDS,
  refractionPreset,
  type RefractionPreset,
  type RefractionPresetId,
} from '@/shared/sightline/refraction-presets';
export { extinctionFromVisibility } from '@/shared/sightline/extinction-from-visibility';
export { visualRange } from '@/shared/sightline/visual-range';
export { convertVisibility } from '@/shared/sightline/convert-visibility';
export { resolutionRange } from '@/shared/sightline/resolution-range';
export { detectionRange, type DetectionInput, type DetectionRange } from '@/shared/sightline/detection-range';
export { isTargetVisible, type TargetVisibility } from '@/shared/sightline/is-target-visible';
export {
  refractionBand,
  type RefractionBand,
  type RefractionBandPoint,
  type RefractionSweep,
} from '@/shared/sightline/refraction-band';
