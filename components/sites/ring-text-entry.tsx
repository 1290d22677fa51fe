import { useState } from 'react';
import { View } from 'react-native';
import { formatCoordinate } from '@/shared/geo/format-coordinate';
import { parseRingText, RingTextError } from '@/shared/geo/parse-ring-text';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { space } from '@/components/ui/theme';

export type Ring = [number, number][];

/** The corners of a ring as text, one per line, latitude first (the closing corner left out). */
export function ringToText(ring: Ring | null): string {
  if (!ring) return '';
  const open =
    ring.length > 1 && ring[0]![0] === ring[ring.length - 1]![0] && ring[0]![1] === ring[ring.length - 1]![1]
      ? ring.slice(0, -1)
      : ring;
  return open.map(([lonDeg, latDeg]) => formatCoordinate({ latDeg, lonDeg }, 'dd')).join('\n');
}

/** Typing or pasting an outline's corners, one per line, in any coordinate format the app reads. */
export function RingTextEntry({ label, ring, onRing }: { label: string; ring: Ring | null; onRing: (ring: Ring) => void }) {
  const [text, setText] = useState(() => ringToText(ring));
  const [error, setError] = useState('');
  const use = () => {
    try {
      onRing(parseRingText(text));
      setError('');
    } catch (e) {
      setError(e instanceof RingTextError ? e.message : 'These corners cannot be read.');
    }
  };
  return (
    <View style={{ gap: space.sm }}>
      <TextField
        label={`${label}: corners, one per line`}
        value={text}
        onChangeText={setText}
        multiline
        numberOfLines={6}
        style={{ minHeight: 120, paddingTop: space.sm, textAlignVertical: 'top' }}
        autoCapitalize="characters"
        error={error || undefined}
        hint="WGS 84, latitude first: decimal degrees (61.05, 14.1), degrees-minutes, DMS, UTM (33V 505400 6766000) or MGRS. The ring closes itself."
      />
      <Button kind="secondary" label="Use these corners" onPress={use} style={{ alignSelf: 'flex-start' }} />
    </View>
  );
}
