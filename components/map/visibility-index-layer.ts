import type { VisibilityIndexMapLayer } from '@/shared/schemas/visibility-index';
import { METRES_PER_LENGTH_UNIT, type LengthUnit } from '@/shared/units/length';
import type { ClassPalette, PaletteClass } from './class-palettes';
import type { MapCoverageLayer } from './map-coverage-layer';

/** Id of the heat map layer on the site map (keeps the pick while parameters change). */
export const VISIBILITY_INDEX_LAYER_ID = 'visibility-index';

/**
 * Light to deep green-blue, one step per class: lightness falls along the
 * scale like every ordered scale of Kenning's palettes, in a hue of its own
 * (this layer is about places to stand, not about what posts see).
 */
const RAMP = ['#E2F2E6', '#A9D6B6', '#67B393', '#2F8878', '#135B55', '#06302F'];

/** An area in the person's units, two or three significant digits: "12.5 km²", "3.6 nmi²". */
export function areaText(m2: number, distanceUnit: LengthUnit): string {
  const perUnit = METRES_PER_LENGTH_UNIT[distanceUnit] ** 2;
  const value = m2 / perUnit;
  const unit = `${distanceUnit}²`;
  if (value === 0) return `0 ${unit}`;
  const digits = value >= 100 ? 0 : value >= 10 ? 1 : 2;
  return `${value.toFixed(digits)} ${unit}`;
}

/**
 * The heat map as a map layer: one class per step of seen area, labelled in
 * the person's area units (km², nmi² or mi² after their distance unit).
 *
 * @example
 * visibilityIndexMapLayer(index.layer, '20 m', 'km').palette.classes[0].label; // "up to 4.10 km²"
 */
export function visibilityIndexMapLayer(
  layer: VisibilityIndexMapLayer,
  heightText: string,
  distanceUnit: LengthUnit,
): MapCoverageLayer {
  const classes: PaletteClass[] = layer.classUpperM2.map((upper, c) => ({
    code: c + 1,
    label: `${c === 0 ? 'up to' : areaText(layer.classUpperM2[c - 1] as number, distanceUnit) + ' –'} ${areaText(upper, distanceUnit)}`,
    meaning: `A ${heightText} tower here would see ${c === 0 ? 'up to' : 'between ' + areaText(layer.classUpperM2[c - 1] as number, distanceUnit) + ' and'} ${areaText(upper, distanceUnit)} of the site's ground within the radius.`,
    color: RAMP[Math.round((c * (RAMP.length - 1)) / Math.max(1, layer.classUpperM2.length - 1))] ?? null,
  }));
  classes.push({ code: 0, label: 'Not assessed', meaning: 'No terrain data at this cell.', color: null });
  const palette: ClassPalette = {
    id: 'visibility-index',
    title: 'Ground a tower here would see',
    opacity: 0.7,
    classes,
  };
  return { id: VISIBILITY_INDEX_LAYER_ID, title: 'Tower heat map', raster: layer.raster, palette };
}
