import { useState, type ReactNode } from 'react';
import { View } from 'react-native';
import type { UnitSystem } from '@/shared/units/unit-systems';
import { convertLength } from '@/shared/units/length';
import { useLengthUnits } from '@/components/data/session';
import { useVisibilityIndex } from '@/components/data/visibility-index';
import { CautionsPanel } from '@/components/check/cautions-panel';
import { AppText } from '@/components/ui/app-text';
import { Chip, ChipRow } from '@/components/ui/chip';
import { space } from '@/components/ui/theme';
import type { MapCoverageLayer } from './map-coverage-layer';
import { visibilityIndexMapLayer } from './visibility-index-layer';

/** Tower heights offered, metres (shown in the person's height unit). */
const HEIGHTS_M = [10, 20, 30];
/** Radii offered, metres (shown in the person's distance unit). */
const RADII_M = [5000, 10_000, 20_000];

const HEAT_MAP_CAUTIONS = [
  {
    code: 'estimates-only',
    message:
      'Estimates only, sampled along 64 rays from every few cells of the terrain grid (about 1–3 % from exact viewsheds on hill country); trees and buildings are not included.',
  },
  {
    code: 'refraction-varies',
    message: 'Refraction near the horizon varies widely; this layer uses standard optical refraction (k = 0.13).',
  },
  {
    code: 'visibility-not-detection',
    message: 'Visibility is not detection: a place that sees much ground still needs a site visit.',
  },
  { code: 'follow-procedures', message: 'Follow your agency’s procedures, local regulations and licensed practice.' },
];

/**
 * The site map's optional "tower heat map": off until turned on; then the
 * chosen tower height and radius are asked of the API, which computes the
 * layer once per terrain and parameters (polled while it runs).
 *
 * @returns the layer to draw (once computed) and the panel above the layer chips
 */
export function useVisibilityIndexOverlay(
  siteId: string,
  siteUnits: UnitSystem | null | undefined,
): { layer: MapCoverageLayer | null; panel: ReactNode } {
  const units = useLengthUnits(siteUnits);
  const [on, setOn] = useState(false);
  const [heightM, setHeightM] = useState(20);
  const [radiusM, setRadiusM] = useState(10_000);
  const index = useVisibilityIndex(siteId, on ? { heightM, radiusM } : null);
  const data = on ? index.data : undefined;
  const lengthLabel = (m: number, unit: typeof units.height) => `${Math.round(convertLength(m, 'm', unit))} ${unit}`;
  const layer = data?.layer ? visibilityIndexMapLayer(data.layer, lengthLabel(heightM, units.height), units.distance) : null;

  let status: string | null = null;
  if (on && index.isError) status = `The heat map could not be loaded: ${index.error.message}`;
  else if (data?.status === 'queued') status = 'Waiting for a worker to compute the heat map…';
  else if (data?.status === 'running') status = `Computing the heat map… ${Math.round(data.progress * 100)} %`;
  else if (data?.status === 'failed') status = `The heat map failed: ${data.error ?? 'no reason given'}`;
  else if (data?.status === 'done' && data.strideCells !== null) {
    status = `${data.strideCells === 1 ? 'Every cell' : `One cell in ${data.strideCells} each way`} of the terrain, ${data.rays} rays from each.`;
  } else if (on && index.isPending) status = 'Asking for the heat map…';

  const panel = (
    <View style={{ gap: space.sm }}>
      <ChipRow label="Tower heat map: where would a tower see the most of the site?">
        <Chip label="Off" on={!on} onPress={() => setOn(false)} />
        <Chip label="On" on={on} onPress={() => setOn(true)} />
      </ChipRow>
      {on ? (
        <>
          <ChipRow label="Tower height">
            {HEIGHTS_M.map((m) => (
              <Chip key={m} label={lengthLabel(m, units.height)} on={m === heightM} onPress={() => setHeightM(m)} />
            ))}
          </ChipRow>
          <ChipRow label="Counted within">
            {RADII_M.map((m) => (
              <Chip key={m} label={lengthLabel(m, units.distance)} on={m === radiusM} onPress={() => setRadiusM(m)} />
            ))}
          </ChipRow>
          {status ? (
            <AppText variant="small" tone="muted" role="status">
              {status}
            </AppText>
          ) : null}
          <CautionsPanel cautions={HEAT_MAP_CAUTIONS} />
        </>
      ) : null}
    </View>
  );
  return { layer, panel };
}
