import { useState } from 'react';
import { View } from 'react-native';
import { colors, radius } from '@/components/ui/theme';
import { useCoordinateFormat } from './coordinate-format';
import { MapViewport, type MapViewportProps } from './map-viewport';
import { createReadoutStore } from './readout-store';

/**
 * A framed map for entering places (picking candidates, drawing an outline or
 * a route): no post chosen, no targets, no coverage; taps go to `onTap` and
 * `overlay` draws what is being entered. `height` is in pixels.
 */
export function PickingMap({
  height,
  ...viewport
}: { height: number } & Pick<MapViewportProps, 'frame' | 'units' | 'onTap' | 'handles' | 'label' | 'overlay'>) {
  const [readout] = useState(createReadoutStore);
  const [format, setFormat] = useCoordinateFormat();
  return (
    <View style={{ height, borderRadius: radius.md, overflow: 'hidden', borderWidth: 1, borderColor: colors.line }}>
      <MapViewport
        {...viewport}
        chosenPostId={null}
        targets={[]}
        shown={null}
        focus={null}
        readout={readout}
        format={format}
        onFormat={setFormat}
      />
    </View>
  );
}
