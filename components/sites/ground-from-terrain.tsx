import { useState } from 'react';
import { View } from 'react-native';
import type { LatLon } from '@/shared/geo/types';
import { convertLength, type LengthUnit } from '@/shared/units/length';
import { useSiteTerrain, useTerrainElevation } from '@/components/data/terrain';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { space } from '@/components/ui/theme';

/**
 * "From terrain": fills a ground elevation from the site's terrain at the
 * location typed. Renders nothing while the site has no terrain.
 */
export function GroundFromTerrain({
  siteId,
  location,
  unit = 'm',
  onElevation,
}: {
  siteId: string;
  location: LatLon | null;
  /** The unit the form shows heights in (the message follows it). */
  unit?: LengthUnit;
  onElevation: (metres: number) => void;
}) {
  const terrain = useSiteTerrain(siteId);
  const lookup = useTerrainElevation(siteId);
  const [message, setMessage] = useState('');
  if (!terrain.data) return null;
  const run = () => {
    setMessage('');
    if (!location) {
      setMessage('Enter the location first.');
      return;
    }
    lookup.mutate(location, {
      onSuccess: (r) => {
        const metres = Math.round(r.elevationM * 10) / 10;
        onElevation(metres);
        setMessage(`Ground from the terrain: ${convertLength(metres, 'm', unit).toFixed(1)} ${unit}.`);
      },
      onError: (e) => setMessage(e.message),
    });
  };
  return (
    <View style={{ flexDirection: 'row', alignItems: 'center', gap: space.md, flexWrap: 'wrap' }}>
      <Button kind="secondary" label="From terrain" onPress={run} busy={lookup.isPending} />
      {message ? (
        <AppText
          variant="small"
          tone={lookup.isError || !location ? 'danger' : 'muted'}
          role={lookup.isError ? 'alert' : undefined}
          style={{ flexShrink: 1 }}
        >
          {message}
        </AppText>
      ) : null}
    </View>
  );
}
