import { useState } from 'react';
import { formatCoordinate } from '@/shared/geo/format-coordinate';
import { Button } from '@/components/ui/button';
import { GeometryEntry, GeometryFieldBox } from './geometry-field-box';
import { GeoJsonImport } from './geojson-import';
import { RingDrawMap, type RingDrawContext } from './ring-draw-map';
import { RingTextEntry, type Ring } from './ring-text-entry';

type Mode = 'draw' | 'type' | 'import';

/** How many distinct corners a ring has (a closing corner is not counted). */
export function cornerCount(ring: Ring | null): number {
  if (!ring || ring.length === 0) return 0;
  const first = ring[0]!;
  const last = ring[ring.length - 1]!;
  return ring.length > 1 && first[0] === last[0] && first[1] === last[1] ? ring.length - 1 : ring.length;
}

/**
 * One outline (the site's boundary or a priority zone): what it is now and the
 * ways to enter it. The error (from the form's schema or the server) shows
 * under it and is announced.
 */
export function RingField({
  label,
  ring,
  onChange,
  error,
  optional,
  drawContext,
}: {
  label: string;
  ring: Ring | null;
  onChange: (ring: Ring | null) => void;
  error?: string;
  optional?: boolean;
  /** What the drawing map shows around the outline. */
  drawContext: RingDrawContext;
}) {
  const [mode, setMode] = useState<Mode>('draw');
  const [editing, setEditing] = useState(false);
  const n = cornerCount(ring);
  const done = (entered: Ring) => {
    onChange(entered);
    setEditing(false);
  };
  return (
    <GeometryFieldBox
      label={label}
      error={error}
      summary={
        ring && n > 0
          ? `${n} corners, from ${formatCoordinate({ latDeg: ring[0]![1], lonDeg: ring[0]![0] }, 'dd')}.`
          : optional
            ? 'None yet: draw it, type its corners or import it.'
            : 'No outline yet: draw it, type its corners or import it.'
      }
    >
      <GeometryEntry
        editing={editing}
        openLabel={n > 0 ? `Change ${label.toLowerCase()}` : `Enter ${label.toLowerCase()}`}
        onOpen={() => setEditing(true)}
        removeLabel="Remove"
        onRemove={n > 0 && optional ? () => onChange(null) : undefined}
        mode={mode}
        onMode={setMode}
        otherModes={[
          { value: 'type', label: 'Typing corners' },
          { value: 'import', label: 'Importing GeoJSON' },
        ]}
      >
        {mode === 'draw' ? (
          <RingDrawMap label={label} ring={ring} context={drawContext} onDone={done} onCancel={() => setEditing(false)} />
        ) : null}
        {mode === 'import' ? <GeoJsonImport label={`${label} from a file`} onUse={(p) => done(p.ring)} /> : null}
        {mode === 'type' ? <RingTextEntry label={label} ring={ring} onRing={done} /> : null}
        {mode !== 'draw' ? (
          <Button kind="quiet" label="Close" onPress={() => setEditing(false)} style={{ alignSelf: 'flex-start' }} />
        ) : null}
      </GeometryEntry>
    </GeometryFieldBox>
  );
}
