import { useState } from 'react';
import { View } from 'react-native';
import type { LatLon } from '@/shared/geo/types';
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
  onElevation,
}: {
  siteId: string;
  location: LatLon | null;
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
        setMessage(`Ground from the terrain: ${metres.toFixed(1)} m.`);
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
