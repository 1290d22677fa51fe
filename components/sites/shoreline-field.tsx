import { useState } from 'react';
import { View } from 'react-native';
import { formatCoordinate } from '@/shared/geo/format-coordinate';
import { GeoJsonLineError, linesFromGeoJson } from '@/shared/geo/lines-from-geojson';
import { ShorelineSchema } from '@/shared/schemas/site';
import type { LengthUnit } from '@/shared/units/length';
import { typedToMetres } from '@/shared/units/typed-lengths';
import { ApiRequestError } from '@/components/data/api-client';
import { useTraceShoreline } from '@/components/data/placement';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { space } from '@/components/ui/theme';
import { GeometryEntry, GeometryFieldBox } from './geometry-field-box';
import { RingDrawMap, type RingDrawContext } from './ring-draw-map';

type Line = [number, number][];
type Mode = 'draw' | 'paste' | 'trace';

/**
 * The site's shoreline: drawn on the map from its start (chainage 0) along the
 * shore, or pasted as a GeoJSON LineString. Errors (the form's or the
 * server's) show under it and are announced.
 */
export function ShorelineField({
  line,
  onChange,
  error,
  drawContext,
  heightUnit = 'm',
}: {
  heightUnit?: LengthUnit;
  line: Line | null;
  onChange: (line: Line | null) => void;
  error?: string;
  drawContext: RingDrawContext;
}) {
  const [editing, setEditing] = useState(false);
  const [mode, setMode] = useState<Mode>('draw');
  const [text, setText] = useState('');
  const [problem, setProblem] = useState('');
  const n = line?.length ?? 0;
  const done = (entered: Line) => {
    onChange(entered);
    setEditing(false);
  };
  const trace = useTraceShoreline(drawContext.site?.id ?? '');
  const [levelText, setLevelText] = useState('0');
  const canTrace = !!drawContext.site && !!drawContext.terrain;
  const traceNow = () => {
    const metres = typedToMetres(levelText, heightUnit);
    if (typeof metres !== 'number' || !Number.isFinite(metres)) {
      setProblem('Give the level as a number.');
      return;
    }
    setProblem('');
    trace.mutate(metres, {
      onSuccess: (r) => done(r.shoreline),
      onError: (e) => setProblem(e instanceof ApiRequestError ? e.message : 'The shoreline could not be traced.'),
    });
  };
  const usePasted = () => {
    try {
      const [first] = linesFromGeoJson(text);
      const checked = ShorelineSchema.safeParse(first!.line);
      if (!checked.success) {
        setProblem(checked.error.issues[0]?.message ?? 'This line cannot be used.');
        return;
      }
      setProblem('');
      done(checked.data);
    } catch (e) {
      setProblem(e instanceof GeoJsonLineError ? e.message : 'This line cannot be used.');
    }
  };
  return (
    <GeometryFieldBox
      label="Shoreline"
      ariaLabel="Shoreline"
      error={error}
      summary={
        line && n > 1
          ? `${n} corners, chainage 0 at ${formatCoordinate({ latDeg: line[0]![1], lonDeg: line[0]![0] }, 'dd')}.`
          : 'None yet: draw it along the shore from where chainage starts, or paste a GeoJSON line.'
      }
    >
      <GeometryEntry
        editing={editing}
        openLabel={n > 1 ? 'Change the shoreline' : 'Enter the shoreline'}
        onOpen={() => setEditing(true)}
        removeLabel="Remove the shoreline"
        onRemove={n > 1 ? () => onChange(null) : undefined}
        mode={mode}
        onMode={setMode}
        otherModes={[
          { value: 'paste', label: 'Pasting GeoJSON' },
          ...(canTrace ? [{ value: 'trace' as const, label: 'Tracing the terrain' }] : []),
        ]}
      >
        {mode === 'draw' ? (
          <RingDrawMap
            line
            label="Shoreline"
            ring={line}
            context={drawContext}
            onDone={done}
            onCancel={() => setEditing(false)}
          />
        ) : mode === 'trace' ? (
          <View style={{ gap: space.sm }}>
            <TextField
              label="Level of the shoreline"
              value={levelText}
              onChangeText={setLevelText}
              onSubmitEditing={traceNow}
              unit={heightUnit}
              inputMode="decimal"
              error={problem || undefined}
              hint="The terrain's height where land meets sea (e.g. 0 for mean sea level): the longest contour at that level becomes the shoreline, sea on its left."
            />
            <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
              <Button kind="secondary" label="Trace it" onPress={traceNow} busy={trace.isPending} />
              <Button kind="quiet" label="Close" onPress={() => setEditing(false)} />
            </View>
          </View>
        ) : (
          <View style={{ gap: space.sm }}>
            <TextField
              label="GeoJSON LineString"
              value={text}
              onChangeText={setText}
              multiline
              numberOfLines={4}
              style={{ minHeight: 96 }}
              autoCapitalize="none"
              error={problem || undefined}
              hint="A LineString (or a Feature holding one), WGS 84 longitude first. The first corner is chainage 0."
            />
            <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
              <Button kind="secondary" label="Use this line" onPress={usePasted} disabled={!text.trim()} />
              <Button kind="quiet" label="Close" onPress={() => setEditing(false)} />
            </View>
          </View>
        )}
      </GeometryEntry>
    </GeometryFieldBox>
  );
}
