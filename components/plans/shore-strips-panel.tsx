// Over 300 lines: the shore strips, their gaps and the hour-by-hour chart and table of one case, read together.
import { useState } from 'react';
import { View, type LayoutChangeEvent } from 'react-native';
import Svg, { G, Line, Rect, Text as SvgText } from 'react-native-svg';
import type { CaseBand, CoverageCase, HourlySeries } from '@/shared/schemas/coverage';
import type { LengthUnit } from '@/shared/units/length';
import { distanceIn, lengthIn } from '@/components/check/format';
import { useCoverageHourly } from '@/components/data/coverage';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/states';
import { tableStyles } from '@/components/ui/table-styles';
import { colors, space } from '@/components/ui/theme';
import { formatPct, type ReadingUnits } from './coverage-format';

/** Strip colours: Kenning's coverage scale — amber where nobody watches, deeper blue where more posts do. */
export const STRIP_COLOURS = { none: '#E3A33B', one: '#8DB3D9', two: '#2F5E9E', post: colors.ink } as const;

const METRIC: ReadingUnits = { height: 'm', distance: 'km' };

/** A chainage for people, in the distance unit ("3.42 km", "1.85 nmi"). */
export const chainageText = (m: number, unit: LengthUnit) => distanceIn(m, unit);

/** How many posts watch each point of the shore in a band, as runs of equal count along the chainage. */
export function countRuns(band: Pick<CaseBand, 'posts'>, lengthM: number): { fromM: number; toM: number; count: number }[] {
  const ends = new Set<number>([0, lengthM]);
  for (const p of band.posts) for (const [a, b] of p.watched) ends.add(a).add(b);
  const sorted = [...ends].filter((x) => x >= 0 && x <= lengthM).sort((a, b) => a - b);
  const runs: { fromM: number; toM: number; count: number }[] = [];
  for (let i = 0; i + 1 < sorted.length; i++) {
    const a = sorted[i]!;
    const b = sorted[i + 1]!;
    const mid = (a + b) / 2;
    const count = band.posts.filter((p) => p.watched.some(([x, y]) => x <= mid && mid <= y)).length;
    const last = runs[runs.length - 1];
    if (last && last.count === count) last.toM = b;
    else runs.push({ fromM: a, toM: b, count });
  }
  return runs;
}

/**
 * A coast case's shore figures: each band's watched share and length by ≥ 1
 * and ≥ 2 posts, the strip chart along the chainage (posts as columns above
 * it), the gaps with the post that could close them, and the hour by hour.
 */
export function ShoreStripsPanel({ runId, c, units = METRIC }: { runId: string; c: CoverageCase; units?: ReadingUnits }) {
  if (!c.shore || c.bands.length === 0) return null;
  return (
    <View style={{ gap: space.lg }} aria-label="Shore watch">
      <View style={{ gap: space.xs }}>
        <AppText variant="heading">Along the shore</AppText>
        <AppText tone="muted" variant="small">
          {chainageText(c.shore.lengthM, units.distance)} of shoreline. A place on the shore counts as watched in a band when one
          post sees the target across the whole width of the band there.
        </AppText>
      </View>
      <StripChart c={c} units={units} />
      <BandTable bands={c.bands} units={units} />
      <GapList c={c} units={units} />
      <HourByHour runId={runId} c={c} />
    </View>
  );
}

function StripChart({ c, units }: { c: CoverageCase; units: ReadingUnits }) {
  const [width, setWidth] = useState(0);
  const shore = c.shore!;
  const left = 8;
  const right = 8;
  const postRow = 34;
  const bandH = 22;
  const bandGap = 18;
  const height = postRow + c.bands.length * (bandH + bandGap) + 18;
  const x = (m: number) => left + (Math.max(0, Math.min(shore.lengthM, m)) / (shore.lengthM || 1)) * (width - left - right);
  const onLayout = (e: LayoutChangeEvent) => setWidth(Math.round(e.nativeEvent.layout.width));
  return (
    <View
      onLayout={onLayout}
      role="img"
      aria-label={`Strip chart of the shore: ${c.bands
        .map((b) => `${b.name} watched along ${formatPct(b.watched1.pct)} by one post or more`)
        .join('; ')}`}
    >
      {width > 0 ? (
        <Svg width={width} height={height}>
          {shore.posts.map((p) => (
            <Line
              key={p.postId}
              x1={x(p.chainageM)}
              x2={x(p.chainageM)}
              y1={postRow - 6}
              y2={height - 18}
              stroke={STRIP_COLOURS.post}
              strokeWidth={1}
              strokeDasharray="3 3"
              opacity={0.5}
            />
          ))}
          {shore.posts.map((p, i) => (
            <SvgText
              key={`t${p.postId}`}
              x={x(p.chainageM)}
              y={i % 2 === 0 ? 12 : 24}
              fontSize={11}
              fill={colors.ink}
              textAnchor="middle"
            >
              {p.postName.length > 14 ? `${p.postName.slice(0, 13)}…` : p.postName}
            </SvgText>
          ))}
          {c.bands.map((band, b) => {
            const y = postRow + b * (bandH + bandGap);
            return (
              <G key={band.name}>
                <SvgText x={left} y={y + 10} fontSize={11} fill={colors.muted}>
                  {band.name}
                </SvgText>
                {countRuns(band, shore.lengthM).map((r) => (
                  <Rect
                    key={`${band.name}${r.fromM}`}
                    x={x(r.fromM)}
                    y={y + 14}
                    width={Math.max(0.5, x(r.toM) - x(r.fromM))}
                    height={bandH - 8}
                    fill={r.count >= 2 ? STRIP_COLOURS.two : r.count === 1 ? STRIP_COLOURS.one : STRIP_COLOURS.none}
                  />
                ))}
                {c.gaps
                  .filter((g) => g.band === band.name && g.kind === 'seam')
                  .map((g) => (
                    <Line
                      key={`s${g.fromM}`}
                      x1={x(g.fromM)}
                      x2={x(g.fromM)}
                      y1={y + 10}
                      y2={y + bandH + 2}
                      stroke={colors.danger}
                      strokeWidth={2}
                    />
                  ))}
              </G>
            );
          })}
          <SvgText x={left} y={height - 4} fontSize={11} fill={colors.muted}>
            0
          </SvgText>
          <SvgText x={width - right} y={height - 4} fontSize={11} fill={colors.muted} textAnchor="end">
            {chainageText(shore.lengthM, units.distance)}
          </SvgText>
        </Svg>
      ) : null}
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.md }}>
        {(
          [
            ['two', 'two or more posts'],
            ['one', 'one post'],
            ['none', 'nobody'],
          ] as const
        ).map(([k, text]) => (
          <View key={k} style={{ flexDirection: 'row', alignItems: 'center', gap: space.xs }}>
            <View style={{ width: 14, height: 10, backgroundColor: STRIP_COLOURS[k] }} />
            <AppText variant="small">{text}</AppText>
          </View>
        ))}
        <View style={{ flexDirection: 'row', alignItems: 'center', gap: space.xs }}>
          <View style={{ width: 3, height: 12, backgroundColor: colors.danger }} />
          <AppText variant="small">strips only just meet</AppText>
        </View>
      </View>
    </View>
  );
}

function BandTable({ bands, units }: { bands: CaseBand[]; units: ReadingUnits }) {
  return (
    <View style={tableStyles.table} role="table" aria-label="Bands along the shore">
      <View style={[tableStyles.tr, tableStyles.head]} role="row">
        <Cell flex={2} head text="Band" />
        <Cell head text="≥ 1 post" />
        <Cell head text="≥ 2 posts" />
      </View>
      {bands.map((b) => (
        <View key={b.name} style={tableStyles.tr} role="row">
          <Cell
            flex={2}
            text={b.name}
            sub={`${distanceIn(b.fromM, units.distance)} – ${distanceIn(b.toM, units.distance)} offshore`}
          />
          <Cell text={formatPct(b.watched1.pct)} sub={distanceIn(b.watched1.lengthM, units.distance)} />
          <Cell text={formatPct(b.watched2.pct)} sub={distanceIn(b.watched2.lengthM, units.distance)} />
        </View>
      ))}
    </View>
  );
}

function Cell({ text, sub, flex = 1, head }: { text: string; sub?: string; flex?: number; head?: boolean }) {
  return (
    <View style={[head ? tableStyles.th : tableStyles.td, { flex }]} role={head ? 'columnheader' : 'cell'}>
      <AppText variant={head ? 'label' : 'small'} style={{ fontVariant: ['tabular-nums'] }}>
        {text}
      </AppText>
      {sub ? (
        <AppText variant="small" tone="muted">
          {sub}
        </AppText>
      ) : null}
    </View>
  );
}

/** What closing a gap would take, in words. */
export function closerText(g: CoverageCase['gaps'][number], units: ReadingUnits): string {
  const k = g.closer;
  if (!k) return 'No post to close it.';
  if (k.blockedBy === 'range-limit') return `Nearest: ${k.postName} — beyond its detection range; height does not help.`;
  if (k.blockedBy === 'sector') return `Nearest: ${k.postName} — outside its viewing sector.`;
  if (k.raiseByM === 0)
    return `Nearest: ${k.postName} — high enough on a smooth sea; the ground or the grid hides it, not the horizon.`;
  return `Nearest: ${k.postName} — about ${lengthIn(Math.ceil(k.raiseByM!), units.height)} higher (eye ${lengthIn(
    Math.ceil(k.neededEyeM!),
    units.height,
  )} above the water), on a smooth sea.`;
}

function GapList({ c, units }: { c: CoverageCase; units: ReadingUnits }) {
  if (c.gaps.length === 0) return <AppText tone="muted">No gaps: every band is watched along the whole shore.</AppText>;
  return (
    <View style={{ gap: space.sm }}>
      <AppText variant="heading">Gaps</AppText>
      <View role="list" aria-label="Gaps along the shore" style={{ gap: space.sm }}>
        {c.gaps.map((g, i) => (
          <View key={`${g.band}${g.fromM}${i}`} role="listitem" style={{ gap: 2 }}>
            <AppText variant="label">
              {g.band}: {chainageText(g.fromM, units.distance)}
              {g.kind === 'seam' ? ' — the strips only just meet' : ` – ${chainageText(g.toM, units.distance)}`}
              {g.kind === 'unwatched' ? ` (${distanceIn(g.lengthM, units.distance)})` : ''}
            </AppText>
            <AppText variant="small" tone="muted">
              {closerText(g, units)}
            </AppText>
          </View>
        ))}
      </View>
    </View>
  );
}

function HourByHour({ runId, c }: { runId: string; c: CoverageCase }) {
  const [week, setWeek] = useState(false);
  const asked = useCoverageHourly(runId, week ? { caseKey: c.key, days: 7 } : { caseKey: c.key, days: 1 });
  const series: HourlySeries | null = asked.data ?? c.hourly;
  if (!series) return null;
  return (
    <View style={{ gap: space.sm }} aria-label="Hour by hour">
      <AppText variant="heading">Hour by hour</AppText>
      <AppText variant="small" tone="muted">
        {series.days === 1 ? `${series.date}` : `${series.days} days from ${series.date}`} ({series.timeZone}), from the roster: a
        post counts in an hour when someone is on watch there for the whole hour.
      </AppText>
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button kind={week ? 'quiet' : 'secondary'} label="Today" onPress={() => setWeek(false)} />
        <Button kind={week ? 'secondary' : 'quiet'} label="Seven days" onPress={() => setWeek(true)} />
      </View>
      {series.unwatchedHours.length ? (
        <Notice tone="caution" title="Unwatched hours">
          {series.unwatchedHours.slice(0, 24).map((u) => (
            <AppText key={u.startsAt} variant="small">
              {u.local}: nobody watches {u.bands.join(', ')}
            </AppText>
          ))}
          {series.unwatchedHours.length > 24 ? (
            <AppText variant="small">…and {series.unwatchedHours.length - 24} more</AppText>
          ) : null}
        </Notice>
      ) : null}
      <HourlyChart series={series} />
      <HourlyTable series={series} />
    </View>
  );
}

function HourlyChart({ series }: { series: HourlySeries }) {
  const [width, setWidth] = useState(0);
  const names = series.hours[0]?.bands.map((b) => b.name) ?? [];
  const rowH = 36;
  const height = names.length * rowH + 16;
  const n = series.hours.length || 1;
  const colW = (width - 8) / n;
  return (
    <View
      onLayout={(e) => setWidth(Math.round(e.nativeEvent.layout.width))}
      role="img"
      aria-label="Chart of the share of the shore watched in each band, hour by hour"
    >
      {width > 0 ? (
        <Svg width={width} height={height}>
          {names.map((name, b) => (
            <SvgText key={name} x={4} y={b * rowH + 10} fontSize={10} fill={colors.muted}>
              {name}
            </SvgText>
          ))}
          {series.hours.map((h, i) =>
            h.bands.map((band, b) => {
              const full = rowH - 16;
              const bar = (full * band.watched1Pct) / 100;
              return (
                <Rect
                  key={`${h.startsAt}${band.name}`}
                  x={4 + i * colW}
                  y={b * rowH + 12 + (full - bar)}
                  width={Math.max(1, colW - 1)}
                  height={Math.max(band.watched1Pct === 0 ? full : bar, 1)}
                  fill={band.watched1Pct === 0 ? STRIP_COLOURS.none : STRIP_COLOURS.one}
                  opacity={band.watched1Pct === 0 ? 0.6 : 1}
                />
              );
            }),
          )}
          {series.hours.map((h, i) =>
            h.hour % 6 === 0 ? (
              <SvgText key={`l${h.startsAt}`} x={4 + i * colW} y={height - 2} fontSize={9} fill={colors.muted}>
                {series.days > 1 && h.hour === 0 ? h.local.slice(5, 10) : `${String(h.hour).padStart(2, '0')}`}
              </SvgText>
            ) : null,
          )}
        </Svg>
      ) : null}
    </View>
  );
}

function HourlyTable({ series }: { series: HourlySeries }) {
  const names = series.hours[0]?.bands.map((b) => b.name) ?? [];
  const shown = series.days === 1 ? series.hours : series.hours.filter((h) => h.bands.some((b) => b.watched1Pct === 0));
  return (
    <View style={tableStyles.table} role="table" aria-label="Watched share of each band by hour">
      <View style={[tableStyles.tr, tableStyles.head]} role="row">
        <Cell head text="Hour" />
        <Cell head text="On watch" />
        {names.map((n) => (
          <Cell key={n} head text={n} />
        ))}
      </View>
      {shown.map((h) => (
        <View key={h.startsAt} style={tableStyles.tr} role="row">
          <Cell text={series.days === 1 ? h.local.slice(11) : h.local.slice(5)} />
          <Cell text={String(h.postIds.length)} />
          {h.bands.map((b) => (
            <Cell key={b.name} text={formatPct(b.watched1Pct)} />
          ))}
        </View>
      ))}
    </View>
  );
}
