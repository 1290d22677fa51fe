// Over 300 lines: the request form and the result of one run share the screen's state (the chosen run).
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { View } from 'react-native';
import type { Post, Site } from '@/shared/schemas/site';
import type { SitingRun, SitingRunInput } from '@/shared/schemas/siting';
import { convertLength } from '@/shared/units/length';
import { ApiRequestError } from '@/components/data/api-client';
import { useTargets, useConditionSets } from '@/components/data/library';
import { usePlans } from '@/components/data/plans';
import { useLengthUnits, useSession } from '@/components/data/session';
import { useSite, useSitePosts } from '@/components/data/sites';
import {
  isActiveSiting,
  useCancelSiting,
  useSiteSitingRuns,
  useSitingPlan,
  useSitingRun,
  useStartSiting,
} from '@/components/data/siting';
import { COVERAGE_CAUTIONS, formatArea, formatAreaChange, formatMetres, formatPct } from '@/components/plans/coverage-format';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { CheckRow } from '@/components/ui/check-row';
import { Chip, ChipRow } from '@/components/ui/chip';
import { ProgressBar } from '@/components/ui/progress-bar';
import { Screen } from '@/components/ui/screen';
import { ErrorState, FormError, LoadingState, Notice } from '@/components/ui/states';
import { TextField } from '@/components/ui/text-field';
import { space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { AddedAreaMap, type MapMarker } from './added-area-map';
import { CandidatePickMap } from './candidate-pick-map';
import { CoverageCurveChart } from './coverage-curve-chart';
import { coverageCurve, parseHeights, parseLatLon, readAccessLine, readSitingLimits } from './siting-format';

interface TypedPoint {
  latDeg: number;
  lonDeg: number;
  name: string;
}

/**
 * Where to put the next tower: a planner picks candidates (the site's
 * proposed posts, typed points, or places taken from the terrain), tower
 * heights, how many new towers, the target, condition set and objective;
 * a queued run then shows its progress (cancel at any time) and, when done,
 * the chosen towers in order with what each adds, the coverage curve, a map
 * of the ground each adds, and a button that turns the result into a draft
 * plan to compute, compare and submit as usual.
 */
export function SitingScreen({ siteId, runId }: { siteId: string; runId: string | null }) {
  const site = useSite(siteId);
  const posts = useSitePosts(siteId);
  const runs = useSiteSitingRuns(siteId);
  const { data: user } = useSession();
  const { wide } = useLayout();
  const [picked, setPicked] = useState<string | null>(runId);
  if (site.isPending || posts.isPending) return <LoadingState label="Loading the site…" />;
  if (site.isError) return <ErrorState error={site.error} onRetry={() => void site.refetch()} />;
  if (posts.isError) return <ErrorState error={posts.error} onRetry={() => void posts.refetch()} />;
  const shown = picked ?? runs.data?.[0]?.id ?? null;
  const planner = user?.role === 'planner';
  return (
    <Screen title="Where to put the next tower" subtitle={site.data.name} maxWidth={1360}>
      <Notice tone="caution" title="Estimates to plan with">
        {COVERAGE_CAUTIONS.map((c) => (
          <AppText key={c.code} variant="small">
            {c.message}
          </AppText>
        ))}
      </Notice>
      {/* On a phone the result of a run comes first (the form is long); on a wide screen the form sits on the left. */}
      <View
        style={{
          flexDirection: wide ? 'row' : shown ? 'column-reverse' : 'column',
          gap: space.xl,
          alignItems: wide ? 'flex-start' : 'stretch',
        }}
      >
        {planner ? (
          <View style={{ flex: wide ? 2 : undefined, width: wide ? undefined : '100%' }}>
            <SitingForm site={site.data} posts={posts.data} onStarted={setPicked} />
          </View>
        ) : null}
        <View style={{ flex: wide ? 3 : undefined, width: wide ? undefined : '100%', gap: space.lg }}>
          {shown ? (
            <SitingResult siteId={siteId} runId={shown} posts={posts.data} siteUnits={site.data.defaultUnits} />
          ) : (
            <AppText tone="muted">No siting run on this site yet.</AppText>
          )}
          {(runs.data?.length ?? 0) > 1 ? (
            <ChipRow label="Earlier runs">
              {runs.data!.map((r) => (
                <Chip
                  key={r.id}
                  label={`${new Date(r.createdAt).toLocaleString()} · ${r.status}`}
                  on={r.id === shown}
                  onPress={() => setPicked(r.id)}
                />
              ))}
            </ChipRow>
          ) : null}
        </View>
      </View>
    </Screen>
  );
}

type SiteUnits = Parameters<typeof useLengthUnits>[0];

function SitingForm({ site, posts, onStarted }: { site: Site; posts: Post[]; onStarted: (runId: string) => void }) {
  const siteId = site.id;
  const { height: heightUnit } = useLengthUnits(site.defaultUnits);
  const [mapOpen, setMapOpen] = useState(false);
  const targets = useTargets();
  const sets = useConditionSets();
  const start = useStartSiting(siteId);
  const [source, setSource] = useState<'listed' | 'terrain'>('listed');
  const [candidatePosts, setCandidatePosts] = useState<string[]>(posts.filter((p) => p.status === 'proposed').map((p) => p.id));
  const [kept, setKept] = useState<string[]>(posts.filter((p) => p.status === 'existing').map((p) => p.id));
  const [points, setPoints] = useState<TypedPoint[]>([]);
  const [pointText, setPointText] = useState('');
  const [pointName, setPointName] = useState('');
  const [pointError, setPointError] = useState<string | null>(null);
  const [spacing, setSpacing] = useState('1500');
  const [maxText, setMaxText] = useState('20');
  const [lineOn, setLineOn] = useState(false);
  const [linePoints, setLinePoints] = useState<{ latDeg: number; lonDeg: number }[]>([]);
  const [withinText, setWithinText] = useState('1000');
  const [costsText, setCostsText] = useState('');
  const [budgetText, setBudgetText] = useState('');
  const [goalText, setGoalText] = useState('');
  const [heightsText, setHeightsText] = useState(heightUnit === 'm' ? '0, 15, 30' : '0, 50, 100');
  const [countText, setCountText] = useState('2');
  const [targetId, setTargetId] = useState<string | null>(null);
  const [setId, setSetId] = useState<string | null>(null);
  const [minPosts, setMinPosts] = useState<1 | 2>(1);
  const [zoneWeights, setZoneWeights] = useState(true);
  const [local, setLocal] = useState<Record<string, string>>({});
  // A new point answers "tap at least two points": that message goes with the change.
  const setLine = (next: { latDeg: number; lonDeg: number }[]) => {
    setLinePoints(next);
    const { ['candidates.fromTerrain.accessLine.line']: _answered, ...rest } = local;
    setLocal(rest);
  };
  const toggle = (list: string[], id: string) => (list.includes(id) ? list.filter((x) => x !== id) : [...list, id]);

  const addPoint = () => {
    const at = parseLatLon(pointText);
    if (!at) return setPointError('Type latitude and longitude in decimal degrees, e.g. 51.68, 15.27.');
    if (pointName.trim() === '') return setPointError('Name the place.');
    setPoints([...points, { ...at, name: pointName.trim() }]);
    setPointText('');
    setPointName('');
    setPointError(null);
  };

  const submit = () => {
    const heightsM = parseHeights(heightsText, (v) => convertLength(v, heightUnit, 'm'));
    const count = Number(countText);
    const errors: Record<string, string> = {};
    if (!heightsM) errors.heightsM = 'Type the heights as numbers, e.g. 0, 15, 30.';
    if (!Number.isInteger(count) || count < 1) errors.count = 'A whole number, at least 1.';
    if (!targetId) errors.targetId = 'Choose a target.';
    if (!setId) errors.conditionSetId = 'Choose a condition set.';
    const limits = readSitingLimits({ costs: costsText, budget: budgetText, goalPct: goalText }, heightsM?.length ?? null);
    Object.assign(errors, limits.errors);
    let candidates: SitingRunInput['candidates'];
    if (source === 'terrain') {
      const spacingM = Number(spacing.trim());
      if (spacing.trim() === '' || !Number.isFinite(spacingM)) {
        errors['candidates.fromTerrain.spacingM'] = 'The spacing must be a number of metres.';
      }
      const maxCandidates = Number(maxText.trim());
      if (!Number.isInteger(maxCandidates) || maxCandidates < 1 || maxCandidates > 100) {
        errors['candidates.fromTerrain.maxCandidates'] = 'A whole number from 1 to 100.';
      }
      const access = lineOn ? readAccessLine(linePoints, withinText) : { accessLine: null, errors: {} };
      Object.assign(errors, access.errors);
      candidates = { fromTerrain: { spacingM, maxCandidates, accessLine: access.accessLine } };
    } else {
      candidates = [...candidatePosts.map((postId) => ({ postId })), ...points];
    }
    if (Array.isArray(candidates) && candidates.length === 0) errors.candidates = 'Pick or add at least one candidate.';
    setLocal(errors);
    if (Object.keys(errors).length > 0) return;
    start.mutate(
      {
        candidates,
        heightsM: heightsM!,
        keepPostIds: kept,
        count,
        targetId: targetId!,
        conditionSetId: setId!,
        objective: { minPosts, zoneWeights },
        costs: limits.costs,
        budget: limits.budget,
        goalPct: limits.goalPct,
      },
      { onSuccess: (run) => onStarted(run.id) },
    );
  };
  const server = start.error instanceof ApiRequestError ? start.error.fields : {};
  const fieldError = (name: string) =>
    local[name] ?? Object.entries(server).find(([k]) => k === name || k.startsWith(`${name}.`))?.[1];

  return (
    <Card style={{ gap: space.lg }}>
      <AppText variant="heading">Candidates</AppText>
      <ChipRow label="Where the candidates come from">
        <Chip label="Posts and typed points" on={source === 'listed'} onPress={() => setSource('listed')} />
        <Chip label="High ground of the terrain" on={source === 'terrain'} onPress={() => setSource('terrain')} />
      </ChipRow>
      {source === 'listed' ? (
        <View style={{ gap: space.sm }}>
          {posts
            .filter((p) => !kept.includes(p.id))
            .map((p) => (
              <CheckRow
                key={p.id}
                label={p.name}
                detail={p.status === 'proposed' ? 'proposed post' : 'existing post, not kept'}
                checked={candidatePosts.includes(p.id)}
                onToggle={() => setCandidatePosts(toggle(candidatePosts, p.id))}
              />
            ))}
          {points.map((p, i) => (
            <CheckRow
              key={`${p.name}${i}`}
              label={p.name}
              detail={`${p.latDeg.toFixed(5)}, ${p.lonDeg.toFixed(5)} · untick to remove`}
              checked
              onToggle={() => setPoints(points.filter((_, j) => j !== i))}
            />
          ))}
          <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'flex-end' }}>
            <View style={{ flexGrow: 1, minWidth: 160 }}>
              <TextField label="Point (lat, lon)" value={pointText} onChangeText={setPointText} placeholder="51.68, 15.27" />
            </View>
            <View style={{ flexGrow: 1, minWidth: 140 }}>
              <TextField label="Its name" value={pointName} onChangeText={setPointName} placeholder="Fox hill" />
            </View>
            <Button kind="secondary" label="Add the point" onPress={addPoint} />
          </View>
          <Button
            kind="quiet"
            label={mapOpen ? 'Hide the map' : 'Pick a point on the map'}
            onPress={() => setMapOpen(!mapOpen)}
            style={{ alignSelf: 'flex-start' }}
          />
          {mapOpen ? (
            <CandidatePickMap
              site={site}
              posts={posts}
              picked={points}
              onPick={(at) => setPointText(`${at.latDeg.toFixed(6)}, ${at.lonDeg.toFixed(6)}`)}
            />
          ) : null}
          <FormError message={pointError} />
          <FormError message={fieldError('candidates')} />
        </View>
      ) : (
        <View style={{ gap: space.md }}>
          <TextField
            label="Least distance between candidates"
            unit="m"
            keyboardType="numeric"
            value={spacing}
            onChangeText={setSpacing}
            hint="Summits and ridge crests inside the site, the highest first."
            error={fieldError('candidates.fromTerrain.spacingM')}
          />
          <TextField
            label="Most candidates"
            keyboardType="numeric"
            value={maxText}
            onChangeText={setMaxText}
            error={fieldError('candidates.fromTerrain.maxCandidates')}
          />
          <CheckRow
            label="Only near an access line"
            detail="Draw the road or track on the map; only places within the distance of it are candidates."
            checked={lineOn}
            onToggle={() => setLineOn(!lineOn)}
          />
          {lineOn ? (
            <View style={{ gap: space.sm }} testID="siting-access-line">
              <CandidatePickMap
                site={site}
                posts={posts}
                picked={[]}
                line={linePoints}
                onPick={(at) => setLine([...linePoints, at])}
                label="Site map: tap the access line's points in order"
              />
              <AppText variant="small" tone="muted">
                {linePoints.length === 0
                  ? 'Tap the first point of the line.'
                  : `${linePoints.length} ${linePoints.length === 1 ? 'point' : 'points'}; tap the next one.`}
              </AppText>
              <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm }}>
                <Button
                  kind="quiet"
                  label="Remove the last point"
                  disabled={linePoints.length === 0}
                  onPress={() => setLine(linePoints.slice(0, -1))}
                />
                <Button kind="quiet" label="Start the line over" disabled={linePoints.length === 0} onPress={() => setLine([])} />
              </View>
              <FormError message={fieldError('candidates.fromTerrain.accessLine.line')} />
              <TextField
                label="Within this distance of the line"
                unit="m"
                keyboardType="numeric"
                value={withinText}
                onChangeText={setWithinText}
                error={fieldError('candidates.fromTerrain.accessLine.withinM')}
              />
            </View>
          ) : null}
        </View>
      )}
      <AppText variant="heading">Kept posts</AppText>
      <View style={{ gap: space.sm }}>
        {posts
          .filter((p) => !candidatePosts.includes(p.id))
          .map((p) => (
            <CheckRow key={p.id} label={p.name} checked={kept.includes(p.id)} onToggle={() => setKept(toggle(kept, p.id))} />
          ))}
        <FormError message={fieldError('keepPostIds')} />
      </View>
      <TextField
        label="Tower heights to try"
        unit={heightUnit}
        value={heightsText}
        onChangeText={setHeightsText}
        hint="Separated by commas; 0 is a lookout on the ground."
        error={fieldError('heightsM')}
      />
      <TextField
        label="New towers to choose"
        keyboardType="numeric"
        value={countText}
        onChangeText={setCountText}
        error={fieldError('count')}
      />
      <TextField
        label="Cost of each height (optional)"
        value={costsText}
        onChangeText={setCostsText}
        placeholder="0, 40, 90"
        hint="In the order of the heights, in any one unit (e.g. thousands)."
        error={fieldError('costs')}
      />
      <TextField
        label="Budget (optional)"
        keyboardType="numeric"
        value={budgetText}
        onChangeText={setBudgetText}
        hint="The chosen towers together cost at most this; needs the costs."
        error={fieldError('budget')}
      />
      <TextField
        label="Stop when this much of the site is covered (optional)"
        unit="%"
        keyboardType="numeric"
        value={goalText}
        onChangeText={setGoalText}
        hint="Fewer towers are chosen when they reach it."
        error={fieldError('goalPct')}
      />
      <ChipRow label="Target">
        {(targets.data ?? []).map((t) => (
          <Chip key={t.id} label={t.name} on={targetId === t.id} onPress={() => setTargetId(t.id)} />
        ))}
      </ChipRow>
      <FormError message={fieldError('targetId')} />
      <ChipRow label="Condition set">
        {(sets.data ?? []).map((s) => (
          <Chip key={s.id} label={s.name} on={setId === s.id} onPress={() => setSetId(s.id)} />
        ))}
      </ChipRow>
      <FormError message={fieldError('conditionSetId')} />
      <ChipRow label="Count a cell as covered when">
        <Chip label="One post sees it" on={minPosts === 1} onPress={() => setMinPosts(1)} />
        <Chip label="Two posts can fix it (good cross-bearing)" on={minPosts === 2} onPress={() => setMinPosts(2)} />
      </ChipRow>
      <CheckRow
        label="Weigh priority zones"
        detail="A cell in a priority zone counts its zone's weight instead of 1."
        checked={zoneWeights}
        onToggle={() => setZoneWeights(!zoneWeights)}
      />
      {start.error && !(start.error instanceof ApiRequestError && Object.keys(server).length > 0) ? (
        <FormError message={start.error.message} />
      ) : null}
      <Button label="Find the best sites" onPress={submit} busy={start.isPending} />
    </Card>
  );
}

function SitingResult({
  siteId,
  runId,
  posts,
  siteUnits,
}: {
  siteId: string;
  runId: string;
  posts: Post[];
  siteUnits: SiteUnits;
}) {
  const run = useSitingRun(runId);
  const cancel = useCancelSiting(siteId);
  const { data: user } = useSession();
  if (run.isPending) return <LoadingState label="Loading the run…" />;
  if (run.isError) return <ErrorState error={run.error} onRetry={() => void run.refetch()} />;
  const r = run.data;
  const planner = user?.role === 'planner';
  return (
    <Card style={{ gap: space.lg }} accent="moss">
      <AppText variant="heading">
        {r.targetName} · {r.conditionSetName} · {r.objective.minPosts === 1 ? 'seen by one post' : 'fixed by two posts'}
      </AppText>
      {isActiveSiting(r) ? (
        <View style={{ gap: space.sm }}>
          <ProgressBar label={r.stage} fraction={r.progress} detail={`${Math.round(r.progress * 100)} %`} />
          {planner ? (
            <Button kind="secondary" label="Cancel the run" busy={cancel.isPending} onPress={() => cancel.mutate(r.id)} />
          ) : null}
        </View>
      ) : null}
      {r.status === 'failed' ? (
        <Notice tone="danger" title="The run failed">
          <AppText>{r.error}</AppText>
        </Notice>
      ) : null}
      {r.status === 'cancelled' ? <AppText tone="muted">Cancelled: nothing was kept of this run.</AppText> : null}
      {r.status === 'done' ? <DoneRun siteId={siteId} run={r} posts={posts} siteUnits={siteUnits} /> : null}
    </Card>
  );
}

function DoneRun({ siteId, run, posts, siteUnits }: { siteId: string; run: SitingRun; posts: Post[]; siteUnits: SiteUnits }) {
  const { height: heightUnit } = useLengthUnits(siteUnits);
  const router = useRouter();
  const makePlan = useSitingPlan(siteId, run.id);
  const approved = usePlans({ siteId, status: 'approved', sort: '-updatedAt', pageSize: 1 });
  const { data: user } = useSession();
  const approvedId = approved.data?.items[0]?.id;
  const planId = run.planId ?? makePlan.data?.id ?? null;
  const markers: MapMarker[] = [
    ...posts
      .filter((p) => run.keepPostIds.includes(p.id))
      .map((p) => ({ latDeg: p.location.latDeg, lonDeg: p.location.lonDeg, label: p.name, step: 0 })),
    ...run.steps.map((s, i) => ({
      latDeg: s.candidate.latDeg,
      lonDeg: s.candidate.lonDeg,
      label: s.candidate.name,
      step: i + 1,
    })),
  ];
  return (
    <View style={{ gap: space.lg }}>
      <AppText variant="small" tone="muted">
        {run.method === 'exact'
          ? 'Every combination of the candidates was tried: this is the best choice for the figures below.'
          : 'Chosen one tower at a time (each adding the most), then improved by swapping: a near-best choice.'}{' '}
        Kept posts alone: {formatArea(run.keptSeenM2 ?? 0)} ({formatPct(run.keptSeenPct ?? 0)} of the site).
      </AppText>
      {run.steps.length === 0 ? (
        <AppText>No candidate adds anything to what the kept posts see.</AppText>
      ) : (
        <View style={{ gap: space.sm }} testID="siting-steps">
          {run.steps.map((s, i) => (
            <View key={`${s.candidate.index}-${s.heightM}`} style={{ gap: 2 }}>
              <AppText variant="label">
                {i + 1}. {s.candidate.name} — {formatMetres(convertLength(s.heightM, 'm', heightUnit), heightUnit)} tower
                {s.cost !== null ? ` · cost ${s.cost.toLocaleString()}` : ''}
              </AppText>
              <AppText variant="small">
                Adds {formatAreaChange(s.gainM2)} ({s.gainPct >= 0 ? '+' : ''}
                {formatPct(s.gainPct)}) · then {formatArea(s.totalSeenM2)}, {formatPct(s.totalSeenPct)} of the site
              </AppText>
            </View>
          ))}
        </View>
      )}
      <AppText variant="heading">Coverage curve</AppText>
      <CoverageCurveChart points={coverageCurve(run)} siteAreaM2={run.siteAreaM2} />
      {run.addedLayer ? (
        <>
          <AppText variant="heading">What each tower adds</AppText>
          <AddedAreaMap layer={run.addedLayer} markers={markers} />
        </>
      ) : null}
      {user?.role === 'planner' && !planId ? (
        <Button label="Make a draft plan" busy={makePlan.isPending} onPress={() => makePlan.mutate()} />
      ) : null}
      {makePlan.error ? <FormError message={makePlan.error.message} /> : null}
      {planId ? (
        <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.sm }}>
          <AppText style={{ width: '100%' }}>
            The draft plan holds the kept posts and the chosen towers; compute its coverage there, then compare and submit.
          </AppText>
          <Button
            kind="secondary"
            role="link"
            label="Open the draft plan"
            onPress={() => router.navigate({ pathname: '/plans/[planId]', params: { planId } })}
          />
          {approvedId ? (
            <Button
              kind="secondary"
              role="link"
              label="Compare with the approved plan"
              onPress={() => router.navigate({ pathname: '/plans/compare', params: { a: approvedId, b: planId } })}
            />
          ) : null}
        </View>
      ) : null}
    </View>
  );
}
