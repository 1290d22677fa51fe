import { useState } from 'react';
import type { Control, FieldValues, Path } from 'react-hook-form';
import { View } from 'react-native';
import { CoordinateError } from '@/shared/geo/coordinate-error';
import { formatCoordinate } from '@/shared/geo/format-coordinate';
import { parseCoordinate } from '@/shared/geo/parse-coordinate';
import type { LatLon } from '@/shared/geo/types';
import { routeLegs } from '@/shared/patrol/route-legs';
import { convertLength } from '@/shared/units/length';
import { convertSpeed, SPEED_UNIT_OF_SYSTEM, type SpeedUnit } from '@/shared/units/speed';
import { UNIT_SYSTEMS, type UnitSystem } from '@/shared/units/unit-systems';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { FieldRow } from '@/components/ui/field-row';
import { FormTextField } from '@/components/ui/form-text-field';
import { colors, radius, space } from '@/components/ui/theme';
import type { RingDrawContext } from './ring-draw-map';
import { RouteDrawMap } from './route-draw-map';

/**
 * The waypoints typed, one a line (any usual coordinate format; blank lines
 * skipped), or why a line is not a position. '' → null (no route).
 */
export function readRouteText(text: string): LatLon[] | null | { line: number; message: string } {
  const lines = text
    .split(/\r?\n/)
    .map((l) => l.trim())
    .filter(Boolean);
  if (lines.length === 0) return null;
  const out: LatLon[] = [];
  for (let i = 0; i < lines.length; i++) {
    try {
      const p = parseCoordinate(lines[i]!);
      out.push({ latDeg: p.latDeg, lonDeg: p.lonDeg });
    } catch (e) {
      return { line: i + 1, message: e instanceof CoordinateError ? e.message : 'Not a coordinate.' };
    }
  }
  return out;
}

/** A route as the form's text: one waypoint a line, decimal degrees. */
export const routeText = (route: readonly LatLon[] | null | undefined) =>
  route ? route.map((p) => formatCoordinate(p, 'dd')).join('\n') : '';

/** A speed stored in m/s as text in `unit` (3 significant digits), '' for none. */
export const speedText = (mps: number | null | undefined, unit: SpeedUnit) =>
  mps == null ? '' : String(Number(convertSpeed(mps, 'm/s', unit).toPrecision(3)));

const minutes = (s: number) => (s < 600 ? (s / 60).toFixed(1) : String(Math.round(s / 60)));

/**
 * A vessel's or aircraft's patrol on the post form: the route (drawn on the
 * site's map or typed as waypoints) with each leg's length and the time one
 * run takes at the speed, the speed in the person's units (knots when
 * nautical) and the cycle. The form holds text; it saves metres per second
 * and minutes.
 */
export function PatrolFields<T extends FieldValues, TOut>({
  control,
  units,
  routeValue,
  speedValue,
  cycleValue,
  onRoute,
  drawContext,
  near,
}: {
  control: Control<T, unknown, TOut>;
  units: UnitSystem;
  routeValue: string;
  speedValue: string;
  cycleValue: string;
  onRoute: (text: string) => void;
  drawContext: RingDrawContext;
  near: LatLon | null;
}) {
  const [drawing, setDrawing] = useState(false);
  const speedUnit = SPEED_UNIT_OF_SYSTEM[units];
  const distanceUnit = UNIT_SYSTEMS[units].distance;
  const read = readRouteText(routeValue);
  const route = Array.isArray(read) ? read : null;
  const typedSpeed = Number(speedValue.replace(',', '.'));
  const speedMps =
    speedValue.trim() && Number.isFinite(typedSpeed) && typedSpeed > 0 ? convertSpeed(typedSpeed, speedUnit) : null;
  const legs = route && route.length >= 2 ? routeLegs(route, speedMps) : null;
  const cycle = Number(cycleValue.replace(',', '.'));
  const cycleS = cycleValue.trim() && Number.isFinite(cycle) && cycle > 0 ? cycle * 60 : null;
  const dist = (m: number) => `${convertLength(m, 'm', distanceUnit).toFixed(2)} ${distanceUnit}`;

  return (
    <View
      style={{ gap: space.sm, padding: space.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line }}
      aria-label="Patrol route"
    >
      <AppText variant="label">Patrol route</AppText>
      <AppText tone="muted" variant="small">
        The craft runs the route from the first waypoint to the last once per cycle, then holds at the last waypoint until the
        cycle ends. End at the first waypoint for a loop or an out-and-back run. Leave it empty for a craft that stays at its
        location.
      </AppText>
      {drawing ? (
        <RouteDrawMap
          route={route}
          context={drawContext}
          near={route?.[0] ?? near}
          onDone={(r) => {
            onRoute(routeText(r));
            setDrawing(false);
          }}
          onCancel={() => setDrawing(false)}
        />
      ) : (
        <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
          <Button
            kind="secondary"
            label={route ? 'Redraw on the map' : 'Draw the route on the map'}
            onPress={() => setDrawing(true)}
          />
          {route ? <Button kind="quiet" label="Clear the route" onPress={() => onRoute('')} /> : null}
        </View>
      )}
      <FormTextField
        control={control}
        name={'route' as Path<T>}
        label="Waypoints, one a line"
        multiline
        numberOfLines={Math.min(8, Math.max(3, (route?.length ?? 0) + 1))}
        autoCapitalize="characters"
        hint="WGS 84, latitude first, in any usual format (decimal degrees, degrees-minutes, DMS, UTM, MGRS)."
      />
      {read && !Array.isArray(read) ? (
        <AppText variant="small" tone="danger" role="alert">
          Line {read.line}: {read.message}
        </AppText>
      ) : null}
      {legs ? (
        <View style={{ gap: 2 }} aria-label="Legs of the route">
          {legs.legLengthsM.map((m, i) => (
            <AppText key={i} variant="small">
              Leg {i + 1}: waypoint {i + 1} → {i + 2}, {dist(m)}
            </AppText>
          ))}
          <AppText variant="small" style={{ fontWeight: '700' }}>
            Route {dist(legs.totalM)}
            {legs.transitS !== null
              ? ` · one run takes ${minutes(legs.transitS)} min at this speed`
              : ' · give the speed for the time'}
            {legs.transitS !== null && cycleS !== null
              ? legs.transitS <= cycleS
                ? ` · held ${minutes(cycleS - legs.transitS)} min at the last waypoint`
                : ' · longer than the cycle'
              : ''}
          </AppText>
        </View>
      ) : null}
      <FieldRow minWidth={140} gap={space.md}>
        <FormTextField control={control} name={'speedMps' as Path<T>} label="Speed" unit={speedUnit} inputMode="decimal" />
        <FormTextField
          control={control}
          name={'cycleMinutes' as Path<T>}
          label="Cycle (time on station)"
          unit="min"
          inputMode="decimal"
        />
      </FieldRow>
      {speedMps !== null && !Number.isNaN(speedMps) ? (
        <AppText variant="small" tone="muted">
          {speedValue.trim()} {speedUnit} = {speedMps.toFixed(2)} m/s (stored)
        </AppText>
      ) : null}
    </View>
  );
}
