import { refractionPreset, type RefractionPresetId } from '@/shared/sightline/refraction-presets';

/** A refraction condition as people read it: the preset's label, `k = …`, or its weather readings. */
export const describeCondition = (c: Record<string, number | string>) =>
  typeof c.preset === 'string'
    ? refractionPreset(c.preset as RefractionPresetId).label
    : typeof c.k === 'number'
      ? `k = ${c.k}`
      : Object.entries(c)
          .map(([k, v]) => `${k} ${v}`)
          .join(', ');
