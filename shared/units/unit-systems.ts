import type { LengthUnit } from '@/shared/units/length';

/** The unit systems a site defaults to and a person may prefer (`Site.defaultUnits`, `User.unitPreference`). */
export const UNIT_SYSTEM_IDS = ['metric', 'nautical', 'imperial'] as const;
export type UnitSystem = (typeof UNIT_SYSTEM_IDS)[number];

/**
 * Which length unit each system uses for heights (eye, structure, target,
 * waves) and for distances (range, visibility), with the short label of a
 * unit switch and the longer name of a settings choice. The one list: forms,
 * read-outs, scale bars and the account page all take it from here.
 */
export const UNIT_SYSTEMS = {
  metric: { height: 'm', distance: 'km', label: 'm · km', name: 'Metric (m, km)' },
  nautical: { height: 'ft', distance: 'nmi', label: 'ft · nmi', name: 'Nautical (ft, nmi)' },
  imperial: { height: 'ft', distance: 'mi', label: 'ft · mi', name: 'Imperial (ft, mi)' },
} as const satisfies Record<UnitSystem, { height: LengthUnit; distance: LengthUnit; label: string; name: string }>;

/** Whether a length is a height or a distance: which unit of a system it takes. */
export type LengthKind = 'height' | 'distance';

/** A stored value that may name a unit system, or the fallback. */
export function unitSystemOr(value: unknown, fallback: UnitSystem = 'metric'): UnitSystem {
  return typeof value === 'string' && (UNIT_SYSTEM_IDS as readonly string[]).includes(value) ? (value as UnitSystem) : fallback;
}

/** The units a person sees: their own choice, else the site's default, else metric. */
export function unitSystemFor(preference: UnitSystem | null | undefined, siteDefault?: UnitSystem | null): UnitSystem {
  return preference ?? siteDefault ?? 'metric';
}

/** The length unit of `kind` in `system`. */
export const lengthUnitOf = (system: UnitSystem, kind: LengthKind): LengthUnit => UNIT_SYSTEMS[system][kind];

/** Names of the units as words, for sentences ("must be a number of feet"). */
export const LENGTH_UNIT_WORDS: Readonly<Record<LengthUnit, string>> = Object.freeze({
  m: 'metres',
  km: 'kilometres',
  ft: 'feet',
  yd: 'yards',
  mi: 'statute miles',
  nmi: 'nautical miles',
});
