// Over 300 lines: two plans side by side: posts, figures and the gain/loss map share one pair of queries.
import { useQuery } from '@tanstack/react-query';
import { useRouter } from 'expo-router';
import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { CoverageComparison, CoverageRun } from '@/shared/schemas/coverage';
import type { Plan } from '@/shared/schemas/plan';
import type { EncodedClassRaster } from '@/shared/terrain/encoded-class-raster';
import { useCoverageCompare, useCoverageRun, usePlanCoverage } from '@/components/data/coverage';
import { planQuery, usePlans } from '@/components/data/plans';
import { useLengthUnits } from '@/components/data/session';
import { useSite, useSitePosts } from '@/components/data/sites';
import { useSiteTerrain } from '@/components/data/terrain';
import { CautionsPanel } from '@/components/check/cautions-panel';
import { lengthIn } from '@/components/check/format';
import { COVERAGE_CHANGE_PALETTE } from '@/components/map/class-palettes';
import { useCoordinateFormat } from '@/components/map/coordinate-format';
import { ClassLegend } from '@/components/map/map-legend';
import { useDecodedRaster, type MapCoverageLayer } from '@/components/map/map-coverage-layer';
import { MapViewport } from '@/components/map/map-viewport';
import { createReadoutStore } from '@/components/map/readout-store';
import { siteMapFrame } from '@/components/map/site-map-frame';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Chip, ChipRow } from '@/components/ui/chip';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { tableStyles } from '@/components/ui/table-styles';
import { colors, radius, space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { CoverageCasePicker } from './coverage-case-picker';
import {
  caseLabel,
  comparableRun,
  compareLines,
  comparePosts,
  COVERAGE_CAUTIONS,
  formatArea,
  formatMetres,
  formatPct,
  matchingCase,
  pickCase,
} from './coverage-format';
import { PlanStatusBadge } from './plan-status';
import { isEditablePlan, usePlanSnapshot } from './use-plan-snapshot';

type Side = 'a' | 'b';

/**
 * Two plans of one site side by side: their posts and heights, their
 * coverage figures for a chosen case, and the difference map (gained, lost,
 * more or fewer posts) with the area gained and lost — e.g. a new version
 * against the approved plan it replaces.
 */
export function PlanCompareScreen({ a, b }: { a: string | null; b: string | null }) {
  const router = useRouter();
  const planA = useQuery({ ...planQuery(a ?? ''), enabled: a !== null });
  const planB = useQuery({ ...planQuery(b ?? ''), enabled: b !== null });
  const setSide = (side: Side, id: string) => router.setParams({ [side]: id });

  const title = 'Compare plans';
  if ((a && planA.isPending) || (b && planB.isPending)) return <LoadingState label="Loading the plans…" />;
  if (planA.isError) return <ErrorState error={planA.error} onRetry={() => void planA.refetch()} />;
  if (planB.isError) return <ErrorState error={planB.error} onRetry={() => void planB.refetch()} />;
  const pa = a ? planA.data : undefined;
  const pb = b ? planB.data : undefined;
  const siteId = pb?.siteId ?? pa?.siteId ?? null;
  if (!siteId) {
    return (
      <Screen title={title}>
        <EmptyState
          title="Choose a plan first"
          body="Open a plan and use “Compare with…” to compare it with another plan of the same site."
          action={<Button kind="secondary" label="Plans" onPress={() => router.navigate('/plans')} />}
        />
      </Screen>
    );
  }
  return (
    <Screen title={title} subtitle={pb?.siteName ?? pa?.siteName}>
      <PlanPickers siteId={siteId} a={pa} b={pb} onPick={setSide} />
      {pa && pb && pa.siteId !== pb.siteId ? (
        <Notice tone="danger" title="Different sites">
          <AppText>
            “{pa.title}” is for {pa.siteName} and “{pb.title}” for {pb.siteName}. Coverage can only be compared on one site’s
            ground: choose two plans of the same site.
          </AppText>
        </Notice>
      ) : pa && pb && pa.id === pb.id ? (
        <Notice tone="caution">
          <AppText>Choose two different plans.</AppText>
        </Notice>
      ) : pa && pb ? (
        <Comparison a={pa} b={pb} />
      ) : null}
    </Screen>
  );
}

const planLabel = (p: Plan) => `${p.title} · v${p.version}`;

/** Per side: the chosen plan with a "Change" button, or the site's plans to choose from. */
function PlanPickers({
  siteId,
  a,
  b,
  onPick,
}: {
  siteId: string;
  a: Plan | undefined;
  b: Plan | undefined;
  onPick: (side: Side, id: string) => void;
}) {
  const plans = usePlans({ siteId, pageSize: 100, sort: '-updatedAt' });
  const { wide } = useLayout();
  const [open, setOpen] = useState<Side | null>(null);
  if (plans.isPending) return <LoadingState label="Loading the site’s plans…" />;
  if (plans.isError) return <ErrorState error={plans.error} onRetry={() => void plans.refetch()} />;
  const name = (side: Side) => (side === 'a' ? 'Plan A (before)' : 'Plan B (after)');
  const row = (side: Side, chosen: Plan | undefined, other: Plan | undefined) =>
    chosen && open !== side ? (
      <View style={styles.chosen} role="group" aria-label={name(side)}>
        <View style={{ flex: 1, minWidth: 0, gap: 2 }}>
          <AppText variant="label" tone="muted">
            {name(side)}
          </AppText>
          <View style={{ flexDirection: 'row', gap: space.sm, alignItems: 'center', flexWrap: 'wrap' }}>
            <AppText variant="label">{planLabel(chosen)}</AppText>
            <PlanStatusBadge status={chosen.status} />
          </View>
        </View>
        <Button kind="quiet" label="Change" aria-label={`Change plan ${side.toUpperCase()}`} onPress={() => setOpen(side)} />
      </View>
    ) : (
      <ChipRow label={name(side)}>
        {plans.data.items
          .filter((p) => p.id !== other?.id)
          .map((p) => (
            <Chip
              key={p.id}
              label={`${planLabel(p)} (${p.status})`}
              on={p.id === chosen?.id}
              onPress={() => {
                setOpen(null);
                onPick(side, p.id);
              }}
            />
          ))}
      </ChipRow>
    );
  return (
    <View style={{ flexDirection: wide ? 'row' : 'column', gap: wide ? space.lg : space.sm }}>
      <View style={{ flex: wide ? 1 : undefined }}>{row('a', a, b)}</View>
      <View style={{ flex: wide ? 1 : undefined }}>{row('b', b, a)}</View>
    </View>
  );
}

/** What one plan brings to the comparison: its snapshot (posts) and the run it is compared by. */
function usePlanSide(plan: Plan) {
  const editable = isEditablePlan(plan);
  const { snapshot, error } = usePlanSnapshot(plan);
  const coverage = usePlanCoverage(plan.id, editable);
  const pick = comparableRun(editable, coverage.data, snapshot?.coverage);
  const waiting = editable ? coverage.isPending : snapshot === undefined && !error;
  const run = useCoverageRun(waiting ? null : pick.runId);
  return {
    snapshot,
    error: error ?? coverage.error ?? run.error,
    pending: waiting || (pick.runId !== null && run.isPending),
    reason: waiting ? null : pick.reason,
    run: run.data?.status === 'done' ? run.data : null,
  };
}

function Comparison({ a, b }: { a: Plan; b: Plan }) {
  const router = useRouter();
  const { wide } = useLayout();
  const sa = usePlanSide(a);
  const sb = usePlanSide(b);
  const [caseKey, setCaseKey] = useState<string | null>(null);
  const [caseKeyB, setCaseKeyB] = useState<string | null>(null);

  const caseA = sa.run ? pickCase(sa.run.cases, caseKey) : null;
  // B's case: the one picked, else the same key, else the same target and condition by name.
  const pickedB = sb.run?.cases.find((c) => c.key === caseKeyB) ?? null;
  const caseB = sb.run && caseA ? (pickedB ?? matchingCase(caseA, sb.run.cases)) : null;
  const request =
    sa.run && sb.run && caseA && caseB
      ? { a: sa.run.id, b: sb.run.id, caseKey: caseA.key, ...(caseB.key !== caseA.key ? { caseKeyB: caseB.key } : {}) }
      : null;
  const comparison = useCoverageCompare(request);

  if (sa.error || sb.error) return <ErrorState error={sa.error ?? sb.error} />;
  if (sa.pending || sb.pending) return <LoadingState label="Loading both plans’ coverage…" />;

  const missing = (
    [
      ['a', a, sa],
      ['b', b, sb],
    ] as const
  ).filter(([, , s]) => !s.run);
  const columns = (
    <View style={{ flexDirection: wide ? 'row' : 'column', gap: space.lg, alignItems: wide ? 'flex-start' : 'stretch' }}>
      <PlanColumn side="a" plan={a} run={sa.run} caseKey={caseA?.key ?? null} />
      <PlanColumn side="b" plan={b} run={sb.run} caseKey={caseB?.key ?? null} />
    </View>
  );
  return (
    <View style={{ gap: space.lg }}>
      <PostsTable a={sa.snapshot?.inputs.posts ?? []} b={sb.snapshot?.inputs.posts ?? []} />
      {missing.length ? (
        <View style={{ gap: space.sm }}>
          {missing.map(([side, plan, s]) => (
            <Notice key={side} tone="caution" title={`No coverage to compare for plan ${side.toUpperCase()}`}>
              <AppText variant="small">
                {planLabel(plan)}. {s.reason ?? 'It has no finished coverage run.'}
              </AppText>
              <Button
                kind="quiet"
                role="link"
                label="Open its plan page"
                style={{ alignSelf: 'flex-start' }}
                onPress={() => router.navigate({ pathname: '/plans/[planId]', params: { planId: plan.id } })}
              />
            </Notice>
          ))}
        </View>
      ) : null}
      {sa.run && sb.run && caseA && caseB ? (
        <>
          <View style={{ gap: space.sm }}>
            <CoverageCasePicker
              cases={sa.run.cases}
              value={caseA.key}
              onChange={(k) => {
                setCaseKey(k);
                setCaseKeyB(null);
              }}
              label="Plan A"
            />
            {pickedB === null && sb.run.cases.some((c) => c.key === caseA.key) ? null : (
              <CoverageCasePicker cases={sb.run.cases} value={caseB.key} onChange={setCaseKeyB} label="Plan B" />
            )}
            {caseB.key !== caseA.key ? (
              <AppText variant="small" tone="muted">
                Plan B has no case with the same target and condition ids; it is compared by “{caseLabel(caseB)}”.
              </AppText>
            ) : null}
          </View>
          {columns}
          {comparison.isPending ? (
            <LoadingState label="Working out the difference…" />
          ) : comparison.isError ? (
            <ErrorState error={comparison.error} onRetry={() => void comparison.refetch()} />
          ) : (
            <Difference siteId={a.siteId} comparison={comparison.data} />
          )}
        </>
      ) : (
        columns
      )}
      <CautionsPanel cautions={COVERAGE_CAUTIONS} />
    </View>
  );
}

/** Each post's height above its ground in A and B, and what changed. */
function PostsTable({ a, b }: { a: readonly Record<string, unknown>[]; b: readonly Record<string, unknown>[] }) {
  const { height } = useLengthUnits();
  const rows = comparePosts(a, b, height);
  if (!rows.length) return null;
  const Head = ({ children, flex = 1 }: { children: string; flex?: number }) => (
    <View style={[tableStyles.th, { flex }]} role="columnheader">
      <AppText variant="label" tone="muted">
        {children}
      </AppText>
    </View>
  );
  const Cell = ({ children, flex = 1, tone }: { children: string; flex?: number; tone?: 'ember' | 'muted' }) => (
    <View style={[tableStyles.td, { flex }]} role="cell">
      <AppText variant="small" tone={tone} style={{ fontVariant: ['tabular-nums'] }}>
        {children}
      </AppText>
    </View>
  );
  return (
    <View style={{ gap: space.sm }}>
      <AppText variant="heading">Posts (structure + eye above the ground)</AppText>
      <View style={tableStyles.table} role="table" aria-label="Posts in both plans">
        <View style={[tableStyles.tr, tableStyles.head]} role="row">
          <Head flex={2}>Post</Head>
          <Head>A</Head>
          <Head>B</Head>
          <Head>Change</Head>
        </View>
        {rows.map((r) => (
          <View key={r.id} style={tableStyles.tr} role="row">
            <Cell flex={2}>{r.name}</Cell>
            <Cell tone={r.a === null ? 'muted' : undefined}>{r.a === null ? '—' : lengthIn(r.a, height, formatMetres)}</Cell>
            <Cell tone={r.b === null ? 'muted' : undefined}>{r.b === null ? '—' : lengthIn(r.b, height, formatMetres)}</Cell>
            <Cell tone="ember">{r.change}</Cell>
          </View>
        ))}
      </View>
    </View>
  );
}

/** One plan's figures for its case. */
function PlanColumn({ side, plan, run, caseKey }: { side: Side; plan: Plan; run: CoverageRun | null; caseKey: string | null }) {
  const c = run ? pickCase(run.cases, caseKey) : null;
  return (
    <Card style={{ flex: 1, gap: space.sm }} aria-label={`Plan ${side.toUpperCase()}`} role="region">
      <View style={{ flexDirection: 'row', gap: space.sm, alignItems: 'center', flexWrap: 'wrap' }}>
        <AppText variant="label" tone="muted">
          {side.toUpperCase()}
        </AppText>
        <AppText variant="heading" style={{ flexShrink: 1 }}>
          {planLabel(plan)}
        </AppText>
        <PlanStatusBadge status={plan.status} />
      </View>
      {c ? (
        <>
          <AppText variant="small" tone="muted">
            {caseLabel(c)}
          </AppText>
          {(
            [
              ['Seen by 1 post or more', c.site.seenBy1],
              ['Seen by 2 posts or more', c.site.seenBy2],
              ['Good cross-bearings', c.site.goodCrossBearing],
            ] as const
          ).map(([label, m]) => (
            <View key={label} style={styles.figure}>
              <AppText variant="small" style={{ flex: 1 }}>
                {label}
              </AppText>
              <AppText variant="label" style={{ fontVariant: ['tabular-nums'] }}>
                {formatPct(m.pct)} · {formatArea(m.area)}
              </AppText>
            </View>
          ))}
          <AppText variant="small" tone={c.check.passed ? 'moss' : 'danger'}>
            {c.check.passed ? '✓ Meets the standard' : '✕ Does not meet the standard'}
          </AppText>
        </>
      ) : (
        <AppText variant="small" tone="muted">
          No figures: see above.
        </AppText>
      )}
    </Card>
  );
}

/** The difference map over the hillshade and the area gained and lost. */
function Difference({ siteId, comparison }: { siteId: string; comparison: CoverageComparison }) {
  const { wide } = useLayout();
  const lines = compareLines(comparison.statistics);
  const layer: MapCoverageLayer = useMemo(
    () => ({
      id: 'difference',
      title: 'Change in coverage',
      raster: comparison.difference as EncodedClassRaster,
      palette: COVERAGE_CHANGE_PALETTE,
    }),
    [comparison.difference],
  );
  const decoded = useDecodedRaster(layer.raster);
  return (
    <View style={{ gap: space.md }}>
      <AppText variant="heading">What changes from A to B</AppText>
      <View style={tableStyles.table} role="table" aria-label="Change in coverage">
        <View style={[tableStyles.tr, tableStyles.head]} role="row">
          {['', 'Gained', 'Lost', 'Net'].map((h, i) => (
            <View key={h || 'what'} style={[tableStyles.th, { flex: i === 0 ? 2 : 1 }]} role="columnheader">
              <AppText variant="label" tone="muted">
                {h}
              </AppText>
            </View>
          ))}
        </View>
        {lines.map((l) => (
          <View key={l.label} style={tableStyles.tr} role="row">
            <View style={[tableStyles.td, { flex: 2 }]} role="cell">
              <AppText variant="small">{l.label}</AppText>
            </View>
            {[l.gained, l.lost].map((v, i) => (
              <View key={i} style={[tableStyles.td, { flex: 1 }]} role="cell">
                <AppText variant="small" style={{ fontVariant: ['tabular-nums'] }}>
                  {v}
                </AppText>
              </View>
            ))}
            <View style={[tableStyles.td, { flex: 1 }]} role="cell">
              <AppText
                variant="label"
                tone={l.sign > 0 ? 'moss' : l.sign < 0 ? 'danger' : 'ink'}
                style={{ fontVariant: ['tabular-nums'] }}
              >
                {l.net}
              </AppText>
            </View>
          </View>
        ))}
      </View>
      <AppText variant="small" tone="muted">
        Site seen by 1 post or more: {formatPct(comparison.a.site.seenBy1.pct)} in A, {formatPct(comparison.b.site.seenBy1.pct)}{' '}
        in B; by 2 or more: {formatPct(comparison.a.site.seenBy2.pct)} in A, {formatPct(comparison.b.site.seenBy2.pct)} in B.
      </AppText>
      {decoded.error ? (
        <Notice tone="danger" title="The difference map cannot be drawn">
          <AppText variant="small">{decoded.error}</AppText>
        </Notice>
      ) : decoded.values ? (
        <View style={{ flexDirection: wide ? 'row' : 'column', gap: space.lg }}>
          <View style={[styles.map, { height: wide ? 520 : 420, flex: wide ? 2 : undefined }]}>
            <DifferenceMap siteId={siteId} layer={layer} values={decoded.values} />
          </View>
          <View style={{ flex: wide ? 1 : undefined }}>
            <ClassLegend palette={COVERAGE_CHANGE_PALETTE} />
          </View>
        </View>
      ) : null}
    </View>
  );
}

/** The site's map (hillshade, boundary, zones, posts) with the difference layer; tap or point to read the change. */
function DifferenceMap({ siteId, layer, values }: { siteId: string; layer: MapCoverageLayer; values: Uint8Array }) {
  const site = useSite(siteId);
  const posts = useSitePosts(siteId);
  const terrain = useSiteTerrain(siteId);
  const [format, setFormat] = useCoordinateFormat();
  const [readout] = useState(createReadoutStore);
  const frame = useMemo(
    () => (site.data && posts.data && terrain.data !== undefined ? siteMapFrame(site.data, posts.data, terrain.data) : null),
    [site.data, posts.data, terrain.data],
  );
  const shown = useMemo(() => ({ layer, values }), [layer, values]);
  if (site.isPending || posts.isPending || terrain.isPending) return <LoadingState label="Loading the map…" />;
  if (site.isError || posts.isError || terrain.isError) return <ErrorState error={site.error ?? posts.error ?? terrain.error} />;
  if (!frame) return <EmptyState title="Nothing to map" body="This site has no boundary, zones, posts or terrain." />;
  return (
    <MapViewport
      frame={frame}
      units={site.data.defaultUnits}
      chosenPostId={null}
      targets={[]}
      shown={shown}
      focus={null}
      readout={readout}
      format={format}
      onFormat={setFormat}
      onTap={() => {}}
    />
  );
}

const styles = StyleSheet.create({
  chosen: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.sm,
    padding: space.md,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.line,
    backgroundColor: colors.surface,
  },
  figure: { flexDirection: 'row', gap: space.sm, alignItems: 'baseline', flexWrap: 'wrap' },
  map: {
    borderRadius: radius.lg,
    overflow: 'hidden',
    borderWidth: 1,
    borderColor: colors.line,
    backgroundColor: colors.surface,
  },
});
