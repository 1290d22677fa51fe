// Over 300 lines: the figures of one coverage case (shares, zones, verdict, blind areas, posts) read together.
import { useRouter } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { formatCoordinate } from '@/shared/geo/format-coordinate';
import type { CoverageCase, CoverageRun } from '@/shared/schemas/coverage';
import { CautionsPanel } from '@/components/check/cautions-panel';
import { COORDINATE_FORMATS, useCoordinateFormat } from '@/components/map/coordinate-format';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Chip } from '@/components/ui/chip';
import { Notice } from '@/components/ui/states';
import { tableStyles } from '@/components/ui/table-styles';
import { colors, radius, space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { CoverageCasePicker } from './coverage-case-picker';
import { ShoreStripsPanel } from './shore-strips-panel';
import { PatrolFigures } from './patrol-figures';
import {
  caseLabel,
  conditionSpread,
  COVERAGE_CAUTIONS,
  describeDetection,
  type ReadingUnits,
  formatArea,
  formatPct,
  pickCase,
  rulesFailingFirst,
} from './coverage-format';

type Area = CoverageCase['site'];

/**
 * A finished run's figures for one target × condition: the standard's
 * verdict (failing rules first), the site's shares seen by one and by two
 * posts and with good cross-bearings, each priority zone, the largest blind
 * areas with their position, each post's share, a link to the map with the
 * run's layers, and the cautions.
 */
export function CoverageFigures({
  run,
  caseKey,
  onCase,
  units,
}: {
  run: Pick<CoverageRun, 'id' | 'siteId' | 'cases' | 'datum'> & { skippedConditions?: CoverageRun['skippedConditions'] };
  caseKey: string | null;
  onCase: (key: string) => void;
  /** The units heights and ranges are read in (the person's); metric when not given. */
  units?: ReadingUnits;
}) {
  const router = useRouter();
  const { wide } = useLayout();
  const shown = pickCase(run.cases, caseKey);
  if (!shown) {
    return <AppText tone="muted">This run has no figures: the plan had no target or condition to compute when it ran.</AppText>;
  }
  // The map with this run's layers for this case; centred on a point inside a blind area (outlined) when one is given.
  const openMap = (at: { latDeg: number; lonDeg: number; blind: boolean } | null) =>
    router.navigate({
      pathname: '/sites/[siteId]/map',
      params: {
        siteId: run.siteId,
        runId: run.id,
        caseKey: shown.key,
        ...(at ? { lat: at.latDeg.toFixed(6), lon: at.lonDeg.toFixed(6) } : {}),
        ...(at?.blind ? { blind: '1' } : {}),
      },
    });
  return (
    <View style={{ gap: space.lg }}>
      <CoverageCasePicker cases={run.cases} value={shown.key} onChange={onCase} />
      {run.skippedConditions?.length ? (
        <Notice tone="caution" title="Conditions left out">
          {run.skippedConditions.map((s) => (
            <AppText key={`${s.conditionSetName}:${s.conditionLabel}`} variant="small">
              {s.conditionSetName}: {s.conditionLabel} — {s.reason}
            </AppText>
          ))}
        </Notice>
      ) : null}
      <AppText variant="label">{caseLabel(shown)}</AppText>
      <View style={wide ? { flexDirection: 'row', gap: space.xl, alignItems: 'flex-start' } : { gap: space.lg }}>
        <View style={{ flex: wide ? 1 : undefined, gap: space.lg }}>
          <Verdict check={shown.check} />
          <DetectionLimits c={shown} units={units} />
          <ConditionBand cases={run.cases} shown={shown} onCase={onCase} />
          <SiteFigures site={shown.site} flat={run.datum === 'flat'} />
          {shown.zones.length ? <ZoneTable zones={shown.zones} /> : null}
        </View>
        <View style={{ flex: wide ? 1 : undefined, gap: space.lg }}>
          <BlindAreas c={shown} onMap={openMap} />
          <PostShares posts={shown.posts} />
          <PatrolFigures patrols={shown.patrols} distanceUnit={units?.distance} />
          <Button
            kind="secondary"
            label="Open on the map"
            role="link"
            onPress={() => openMap(null)}
            style={{ alignSelf: 'flex-start' }}
          />
        </View>
      </View>
      <ShoreStripsPanel runId={run.id} c={shown} units={units} />
      <CautionsPanel cautions={COVERAGE_CAUTIONS} />
    </View>
  );
}

/** The standard's verdict: passed or not, what it means, then each rule with the failing ones first. */
function Verdict({ check }: { check: CoverageCase['check'] }) {
  const rules = rulesFailingFirst(check.rules);
  // The verdict's reasons repeat its rules' reasons; only those no rule gives are shown at the top.
  const ruleReasons = new Set(check.rules.flatMap((r) => r.reasons));
  const extra = check.reasons.filter((r) => !ruleReasons.has(r));
  return (
    <Notice tone={check.passed ? 'info' : 'danger'} title={check.passed ? 'Meets the standard' : 'Does not meet the standard'}>
      {extra.map((r) => (
        <AppText key={r} variant="small">
          {r}
        </AppText>
      ))}
      <View role="list" aria-label="Rules of the standard" style={{ gap: space.xs, marginTop: space.xs }}>
        {rules.map((rule) => (
          <View key={rule.id} role="listitem" style={{ flexDirection: 'row', gap: space.sm }}>
            <AppText variant="label" tone={rule.passed ? 'moss' : 'danger'} aria-label={rule.passed ? 'Met' : 'Not met'}>
              {rule.passed ? '✓' : '✕'}
            </AppText>
            <View style={{ flex: 1 }}>
              <AppText variant="small">
                {rule.text} — {formatPct(rule.actualPct)} now
                {rule.passed ? '' : `, ${rule.shortfallPct.toFixed(1)} points short (${formatArea(rule.shortfallArea)})`}
              </AppText>
              {rule.passed
                ? null
                : rule.reasons.map((r) => (
                    <AppText key={r} variant="small" tone="muted">
                      {r}
                    </AppText>
                  ))}
            </View>
          </View>
        ))}
      </View>
      <AppText variant="small" tone="muted">
        Rules: {check.interpretation}
      </AppText>
    </Notice>
  );
}

/** Three figures for the whole site. */
function SiteFigures({ site, flat }: { site: Area; flat: boolean }) {
  const tiles: { label: string; m: Area['seenBy1'] }[] = [
    { label: 'Seen by 1 post or more', m: site.seenBy1 },
    { label: 'Seen by 2 posts or more', m: site.seenBy2 },
    { label: 'Good cross-bearings', m: site.goodCrossBearing },
  ];
  return (
    <View style={{ gap: space.sm }}>
      <AppText variant="heading">The site</AppText>
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm }} role="list" aria-label="Site coverage">
        {tiles.map((t) => (
          <View key={t.label} style={styles.tile} role="listitem" aria-label={`${t.label}: ${formatPct(t.m.pct)}`}>
            <AppText variant="small" tone="muted">
              {t.label}
            </AppText>
            <AppText variant="figure">{formatPct(t.m.pct)}</AppText>
            <AppText variant="small" tone="muted">
              {formatArea(t.m.area)} of {formatArea(site.total.area)}
            </AppText>
          </View>
        ))}
      </View>
      <AppText variant="small" tone="muted">
        Seen by no post: {formatPct(site.unseen.pct)} ({formatArea(site.unseen.area)})
        {site.noData.cells > 0 ? ` · no terrain data: ${formatPct(site.noData.pct)}, counted as not seen` : ''}
        {flat ? ' · worked out on a flat datum at sea level (this site has no terrain)' : ''}
      </AppText>
    </View>
  );
}

const Th = ({ children, flex = 1 }: { children: string; flex?: number }) => (
  <View style={[tableStyles.th, { flex }]} role="columnheader">
    <AppText variant="label" tone="muted">
      {children}
    </AppText>
  </View>
);

const Td = ({ main, sub, flex = 1, strong }: { main: string; sub?: string; flex?: number; strong?: boolean }) => (
  <View style={[tableStyles.td, { flex }]} role="cell">
    <AppText variant={strong ? 'label' : 'small'} style={{ fontVariant: ['tabular-nums'] }}>
      {main}
    </AppText>
    {sub ? (
      <AppText variant="small" tone="muted" style={{ fontVariant: ['tabular-nums'] }}>
        {sub}
      </AppText>
    ) : null}
  </View>
);

function ZoneTable({ zones }: { zones: CoverageCase['zones'] }) {
  return (
    <View style={{ gap: space.sm }}>
      <AppText variant="heading">Priority zones</AppText>
      <View style={tableStyles.table} role="table" aria-label="Priority zones">
        <View style={[tableStyles.tr, tableStyles.head]} role="row">
          <Th flex={1.4}>Zone</Th>
          <Th>1+ posts</Th>
          <Th>2+ posts</Th>
          <Th>Good fix</Th>
        </View>
        {zones.map((z) => (
          <View key={z.name} style={tableStyles.tr} role="row">
            <Td flex={1.4} strong main={z.name} sub={`${formatArea(z.total.area)} · weight ${z.weight}`} />
            <Td main={formatPct(z.seenBy1.pct)} sub={formatArea(z.seenBy1.area)} />
            <Td main={formatPct(z.seenBy2.pct)} sub={formatArea(z.seenBy2.area)} />
            <Td main={formatPct(z.goodCrossBearing.pct)} sub={formatArea(z.goodCrossBearing.area)} />
          </View>
        ))}
      </View>
    </View>
  );
}

/** The largest patches no post sees, with where they are in the person's coordinate format. */
function BlindAreas({ c, onMap }: { c: CoverageCase; onMap: (at: { latDeg: number; lonDeg: number; blind: boolean }) => void }) {
  const [format, setFormat] = useCoordinateFormat();
  const { blindAreas, blindSummary } = c;
  return (
    <View style={{ gap: space.sm }}>
      <AppText variant="heading">Largest blind areas</AppText>
      <AppText variant="small" tone="muted">
        {blindSummary.count === 0
          ? `No patch of ${formatArea(blindSummary.minArea)} or more goes unseen.`
          : `${blindSummary.count} patch${blindSummary.count === 1 ? '' : 'es'} of ${formatArea(blindSummary.minArea)} or more unseen, ${formatArea(blindSummary.area)} in all${blindAreas.length < blindSummary.count ? `; the ${blindAreas.length} largest:` : ':'}`}
      </AppText>
      {blindAreas.length ? (
        <>
          <View
            role="radiogroup"
            aria-label="Coordinate format"
            style={{ flexDirection: 'row', gap: space.xs, flexWrap: 'wrap' }}
          >
            {COORDINATE_FORMATS.map((f) => (
              <Chip key={f.id} label={f.label} on={f.id === format} onPress={() => setFormat(f.id)} />
            ))}
          </View>
          <View role="list" aria-label="Blind areas" style={{ gap: space.xs }}>
            {blindAreas.map((b, i) => (
              <View key={`${b.centroid.x}:${b.centroid.y}`} role="listitem" style={styles.blind}>
                <AppText variant="label" style={{ minWidth: 84, fontVariant: ['tabular-nums'] }}>
                  {i + 1}. {formatArea(b.area)}
                </AppText>
                <AppText variant="small" style={{ flex: 1, fontVariant: ['tabular-nums'] }} selectable>
                  {b.interior ? 'in it at' : 'around'}{' '}
                  {formatCoordinate(
                    { latDeg: (b.interior ?? b.centroid).latDeg, lonDeg: (b.interior ?? b.centroid).lonDeg },
                    format,
                  )}
                </AppText>
                <Button
                  kind="quiet"
                  role="link"
                  label="Map"
                  aria-label={`Blind area ${i + 1} on the map`}
                  // Older runs have only the centroid, which may lie outside a non-convex area: no outline then.
                  onPress={() => onMap(b.interior ? { ...b.interior, blind: true } : { ...b.centroid, blind: false })}
                  style={{ minHeight: 32, paddingHorizontal: space.sm }}
                />
              </View>
            ))}
          </View>
        </>
      ) : null}
    </View>
  );
}

function PostShares({ posts }: { posts: CoverageCase['posts'] }) {
  const sorted = [...posts].sort((a, b) => b.seenPct - a.seenPct);
  return (
    <View style={{ gap: space.sm }}>
      <AppText variant="heading">Each post alone</AppText>
      <View style={tableStyles.table} role="table" aria-label="Share of the site each post sees">
        <View style={[tableStyles.tr, tableStyles.head]} role="row">
          <Th flex={2}>Post</Th>
          <Th>Sees of the site</Th>
        </View>
        {sorted.map((p) => (
          <View key={p.postId} style={tableStyles.tr} role="row">
            <Td flex={2} strong main={p.postName} />
            <View style={[tableStyles.td, { flex: 1, gap: 2 }]} role="cell">
              <AppText variant="small" style={{ fontVariant: ['tabular-nums'] }}>
                {formatPct(p.seenPct)}
              </AppText>
              <View style={styles.barTrack}>
                <View style={[styles.barFill, { width: `${Math.min(100, Math.max(0, p.seenPct))}%` }]} />
              </View>
            </View>
          </View>
        ))}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  tile: {
    flexGrow: 1,
    flexBasis: 150,
    padding: space.md,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.line,
    backgroundColor: colors.paper,
    gap: 2,
  },
  blind: { flexDirection: 'row', gap: space.sm, alignItems: 'baseline', flexWrap: 'wrap' },
  barTrack: { height: 6, borderRadius: radius.pill, backgroundColor: colors.line, overflow: 'hidden' },
  barFill: { height: '100%', backgroundColor: colors.moss },
});

/** What limits detection in this case: the range and its limit, what decided the rest, the areas. */
function DetectionLimits({ c, units }: { c: CoverageCase; units?: ReadingUnits }) {
  const lines = describeDetection(c, units);
  if (!lines) {
    return (
      <Notice tone="caution" title="Made before the detection model">
        <AppText variant="small">
          This run counted the view and the visibility only, not the target’s size, light or the sea. Compute again for figures of
          detectable targets.
        </AppText>
      </Notice>
    );
  }
  return (
    <View style={{ gap: space.xs }} aria-label="What limits detection">
      <AppText variant="heading">What limits detection</AppText>
      <AppText>{lines.range}</AppText>
      {lines.decided ? <AppText variant="small">{lines.decided}</AppText> : null}
      {lines.waves ? <AppText variant="small">{lines.waves}</AppText> : null}
      {lines.sea ? <AppText variant="small">{lines.sea}</AppText> : null}
      <View style={tableStyles.table}>
        {lines.areas.map((a) => (
          <View key={a.label} style={tableStyles.tr}>
            <View style={[tableStyles.td, { flex: 1 }]}>
              <AppText variant="small">{a.label}</AppText>
            </View>
            <View style={tableStyles.td}>
              <AppText variant="small">{a.area}</AppText>
            </View>
          </View>
        ))}
      </View>
      <AppText variant="small" tone="muted">
        Detection model {c.detectionModel ?? 'unknown'}: visibility is not detection; a lookout searching a wide arc sees less
        than these limits.
      </AppText>
    </View>
  );
}

/**
 * The shown target under every condition of the run, by k: how far the seen
 * share and the verdict move with refraction and weather. A reviewer reads
 * here whether the verdict holds across the plan's conditions.
 */
function ConditionBand({
  cases,
  shown,
  onCase,
}: {
  cases: readonly CoverageCase[];
  shown: CoverageCase;
  onCase: (key: string) => void;
}) {
  const spread = conditionSpread(cases, shown.targetId);
  if (!spread) return null;
  return (
    <View style={{ gap: space.xs }} aria-label="Sensitivity to conditions">
      <AppText variant="heading">Across the plan’s conditions</AppText>
      <AppText>
        {shown.targetName}: {formatPct(spread.minPct)} – {formatPct(spread.maxPct)} of the site seen. {spread.verdict}
      </AppText>
      <View style={tableStyles.table}>
        {spread.rows.map((r) => (
          <View key={r.key} style={[tableStyles.tr, r.key === shown.key ? { backgroundColor: colors.paper } : null]}>
            <View style={[tableStyles.td, { flex: 1 }]}>
              <AppText variant="small" onPress={() => onCase(r.key)} role="link">
                {r.label}
              </AppText>
            </View>
            <View style={tableStyles.td}>
              <AppText variant="small">{formatPct(r.seenPct)}</AppText>
            </View>
            <View style={tableStyles.td}>
              <AppText variant="small" tone={r.passed ? 'moss' : 'danger'}>
                {r.passed ? 'meets' : 'fails'}
              </AppText>
            </View>
          </View>
        ))}
      </View>
      <AppText variant="small" tone="muted">
        Refraction changes from hour to hour; a plan that meets its standard only under some conditions should say which ones it
        relies on.
      </AppText>
    </View>
  );
}
