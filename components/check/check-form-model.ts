import type { RefractionCondition, SightlineRequest } from '@/shared/schemas/sightline';
import { SightlineRequestSchema } from '@/shared/schemas/sightline';
import type { RefractionPresetId } from '@/shared/sightline/refraction-presets';
import { convertLength, type LengthUnit } from '@/shared/units/length';
import { convertedText } from '@/shared/units/typed-lengths';
import { UNIT_SYSTEMS, type UnitSystem } from '@/shared/units/unit-systems';

/** Unit systems the quick check offers for heights and distances: the one list in `@/shared/units`. */
export { UNIT_SYSTEMS, type UnitSystem } from '@/shared/units/unit-systems';

/** What the person typed: text, in the chosen units. */
export interface CheckFormValues {
  units: UnitSystem;
  observerHeight: string;
  targetHeight: string;
  distance: string;
  requiredVisible: string;
  visibility: string;
  visibilityKind: 'mor-5pct' | 'meteorological-range-2pct';
  targetSize: string;
  resolutionArcmin: string;
  period: 'day' | 'night';
  /** Candela; only sent at night. */
  lightIntensity: string;
  backgroundLighting: 'none' | 'some' | 'much';
  /** Douglas degree 0–9 as text, '' = not stated. */
  seaState: string;
  /** Significant wave height in the height unit, '' = not stated. */
  waveHeight: string;
  presets: RefractionPresetId[];
  customK: string;
  weather: { enabled: boolean; pressureHpa: string; temperatureC: string; lapseRateKPerM: string };
  /**
   * What was typed before the last unit switch and what the switch showed:
   * switching back gives the typed text back unchanged where it was not edited.
   */
  beforeSwitch?: { units: UnitSystem; typed: Record<LengthField, string>; shown: Record<LengthField, string> };
}

/** The fields typed as lengths, converted when the units change. */
const LENGTH_FIELDS = [
  'observerHeight',
  'targetHeight',
  'requiredVisible',
  'targetSize',
  'waveHeight',
  'distance',
  'visibility',
] as const;
type LengthField = (typeof LENGTH_FIELDS)[number];

export { significantDigits, convertedText } from '@/shared/units/typed-lengths';

export const DEFAULT_FORM: CheckFormValues = {
  units: 'metric',
  observerHeight: '30',
  targetHeight: '10',
  distance: '25',
  requiredVisible: '0',
  visibility: '20',
  visibilityKind: 'mor-5pct',
  targetSize: '3',
  resolutionArcmin: '1',
  period: 'day',
  lightIntensity: '',
  backgroundLighting: 'none',
  seaState: '',
  waveHeight: '',
  presets: ['no-refraction', 'standard-optical', 'radio-four-thirds'],
  customK: '',
  weather: { enabled: false, pressureHpa: '1013.25', temperatureC: '15', lapseRateKPerM: '0.0065' },
};

/** Which form field each request path belongs to, so server/schema errors land under the right input. */
const FIELD_OF: Record<string, keyof CheckFormValues | 'weather'> = {
  observerHeightM: 'observerHeight',
  targetHeightM: 'targetHeight',
  distanceM: 'distance',
  requiredVisibleM: 'requiredVisible',
  visibilityM: 'visibility',
  targetSizeM: 'targetSize',
  resolutionArcmin: 'resolutionArcmin',
  lightIntensityCd: 'lightIntensity',
  seaState: 'seaState',
  significantWaveHeightM: 'waveHeight',
  conditions: 'presets',
};

export type CheckFormErrors = Partial<Record<keyof CheckFormValues | 'weather', string>>;

/** A label per condition, in request order, for the results table. */
export interface ConditionLabel {
  key: string;
  label: string;
}

const number = (text: string): number | undefined | null => {
  const t = text.trim().replace(',', '.');
  if (t === '') return undefined;
  const n = Number(t);
  return Number.isFinite(n) ? n : null;
};

/**
 * Turns the form into a sightline request in metres, or field errors. The
 * request is checked with the same schema the server uses.
 */
export function buildRequest(
  v: CheckFormValues,
  presetLabel: (id: RefractionPresetId) => string,
): { request: SightlineRequest; labels: ConditionLabel[] } | { errors: CheckFormErrors } {
  const errors: CheckFormErrors = {};
  const { height: hu, distance: du } = UNIT_SYSTEMS[v.units];
  const read = (field: keyof CheckFormValues, text: string, unit: LengthUnit | null, required = false) => {
    const n = number(text);
    if (n === null) errors[field] = 'Enter a number.';
    else if (n === undefined && required) errors[field] = 'Required.';
    else if (n !== undefined) return unit ? convertLength(n, unit) : n;
    return undefined;
  };
  const observerHeightM = read('observerHeight', v.observerHeight, hu, true);
  const targetHeightM = read('targetHeight', v.targetHeight, hu);
  const distanceM = read('distance', v.distance, du);
  const requiredVisibleM = read('requiredVisible', v.requiredVisible, hu);
  const visibilityM = read('visibility', v.visibility, du);
  const targetSizeM = read('targetSize', v.targetSize, hu);
  const resolutionArcmin = read('resolutionArcmin', v.resolutionArcmin, null);
  const lightIntensityCd = v.period === 'night' ? read('lightIntensity', v.lightIntensity, null) : undefined;
  const seaState = read('seaState', v.seaState, null);
  const significantWaveHeightM = read('waveHeight', v.waveHeight, hu);

  const conditions: RefractionCondition[] = [];
  const labels: ConditionLabel[] = [];
  for (const id of v.presets) {
    conditions.push({ preset: id });
    labels.push({ key: id, label: presetLabel(id) });
  }
  const k = number(v.customK);
  if (k === null) errors.customK = 'Enter a number.';
  else if (k !== undefined) {
    conditions.push({ k });
    labels.push({ key: 'custom-k', label: `Your k = ${k}` });
  }
  if (v.weather.enabled) {
    const p = number(v.weather.pressureHpa);
    const t = number(v.weather.temperatureC);
    const g = number(v.weather.lapseRateKPerM);
    if (p == null || t == null || g == null) errors.weather = 'Give pressure, temperature and lapse rate as numbers.';
    else {
      conditions.push({ pressureHpa: p, temperatureC: t, lapseRateKPerM: g });
      labels.push({ key: 'weather', label: `Weather: ${p} hPa, ${t} °C, Γ ${g} K/m` });
    }
  }
  if (Object.keys(errors).length) return { errors };

  const candidate = {
    observerHeightM,
    targetHeightM,
    distanceM,
    requiredVisibleM: targetHeightM === undefined ? undefined : requiredVisibleM,
    visibilityM,
    visibilityKind: visibilityM === undefined ? undefined : v.visibilityKind,
    targetSizeM,
    resolutionArcmin,
    period: v.period,
    lightIntensityCd,
    backgroundLighting: v.period === 'night' ? v.backgroundLighting : undefined,
    seaState,
    significantWaveHeightM,
    conditions,
  };
  const parsed = SightlineRequestSchema.safeParse(candidate);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const [head, index, sub] = issue.path.map(String);
      let field: keyof CheckFormValues | 'weather' = FIELD_OF[head ?? ''] ?? 'presets';
      if (head === 'conditions' && index !== undefined) {
        const key = labels[Number(index)]?.key;
        field = key === 'custom-k' ? 'customK' : key === 'weather' ? 'weather' : 'presets';
      }
      errors[field] ??= sub ? `${issue.message}` : issue.message;
    }
    return { errors };
  }
  return { request: parsed.data, labels };
}

/**
 * Switches unit system, converting what was typed so the question stays the
 * same (rounded to the precision typed); switching back restores the text
 * typed before, where it was not edited in between.
 */
export function switchUnits(v: CheckFormValues, units: UnitSystem): CheckFormValues {
  if (units === v.units) return v;
  const from = UNIT_SYSTEMS[v.units];
  const to = UNIT_SYSTEMS[units];
  const unitOf = (field: LengthField) =>
    field === 'distance' || field === 'visibility'
      ? ([from.distance, to.distance] as const)
      : ([from.height, to.height] as const);
  const back = v.beforeSwitch?.units === units ? v.beforeSwitch : null;
  const next = {} as Record<LengthField, string>;
  for (const field of LENGTH_FIELDS) {
    const text = v[field];
    const [a, b] = unitOf(field);
    const n = number(text);
    if (back && back.shown[field] === text) next[field] = back.typed[field];
    else if (n == null || a === b) next[field] = text;
    else next[field] = convertedText(convertLength(n, a, b), text);
  }
  const typed = Object.fromEntries(LENGTH_FIELDS.map((f) => [f, v[f]])) as Record<LengthField, string>;
  return { ...v, ...next, units, beforeSwitch: { units: v.units, typed, shown: next } };
}

/** A length from the library (metres) as text in the form's unit. */
function fromMetres(metres: number, unit: LengthUnit): string {
  return convertedText(convertLength(metres, 'm', unit), String(metres));
}

/** A target of the organisation's library, as the quick check needs it. */
export interface LibraryTarget {
  heightM: number;
  widthM: number;
  requiredVisibleM: number;
  period?: 'day' | 'night';
  lightIntensityCd?: number | null;
}

/** Fills the target's height, width and the part that must show from a library target, in the form's units. */
export function applyLibraryTarget(v: CheckFormValues, target: LibraryTarget): CheckFormValues {
  const { height } = UNIT_SYSTEMS[v.units];
  return {
    ...v,
    targetHeight: fromMetres(target.heightM, height),
    targetSize: fromMetres(target.widthM, height),
    requiredVisible: fromMetres(target.requiredVisibleM, height),
    period: target.period ?? v.period,
    lightIntensity: target.lightIntensityCd == null ? '' : String(target.lightIntensityCd),
    beforeSwitch: undefined,
  };
}

/** A condition set of the organisation's library, as the quick check needs it. */
export interface LibraryConditionSet {
  conditions: Record<string, number | string>[];
  visibilityM: number | null;
  visibilityKind: CheckFormValues['visibilityKind'];
  seaState?: number | null;
  significantWaveHeightM?: number | null;
  backgroundLighting?: CheckFormValues['backgroundLighting'];
}

/**
 * Takes a library condition set's refraction conditions and visibility into
 * the form: presets as presets, the first k as the custom k, the first lapse
 * rate as the weather. `left` counts conditions the quick check has no field
 * for (a second k, temperature pairs), which are left out.
 */
export function applyLibraryConditionSet(v: CheckFormValues, set: LibraryConditionSet): { form: CheckFormValues; left: number } {
  const presets: RefractionPresetId[] = [];
  let customK = '';
  let weather = { ...v.weather, enabled: false };
  let left = 0;
  for (const c of set.conditions) {
    if (typeof c.preset === 'string') {
      if (!presets.includes(c.preset as RefractionPresetId)) presets.push(c.preset as RefractionPresetId);
    } else if (typeof c.k === 'number' && customK === '') customK = String(c.k);
    else if (
      typeof c.pressureHpa === 'number' &&
      typeof c.temperatureC === 'number' &&
      typeof c.lapseRateKPerM === 'number' &&
      !weather.enabled
    ) {
      weather = {
        enabled: true,
        pressureHpa: String(c.pressureHpa),
        temperatureC: String(c.temperatureC),
        lapseRateKPerM: String(c.lapseRateKPerM),
      };
    } else left++;
  }
  const { distance } = UNIT_SYSTEMS[v.units];
  return {
    form: {
      ...v,
      presets,
      customK,
      weather,
      visibility: set.visibilityM === null ? '' : fromMetres(set.visibilityM, distance),
      visibilityKind: set.visibilityKind,
      seaState: set.seaState == null ? '' : String(set.seaState),
      waveHeight: set.significantWaveHeightM == null ? '' : fromMetres(set.significantWaveHeightM, UNIT_SYSTEMS[v.units].height),
      backgroundLighting: set.backgroundLighting ?? 'none',
      beforeSwitch: undefined,
    },
    left,
  };
}
