// Over 300 lines: the site map screen wires layers, profile, posts, incidents and 3D to one camera and selection.
import { useQueries } from '@tanstack/react-query';
import { useRouter } from 'expo-router';
import { useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import { Pressable, ScrollView, StyleSheet, View } from 'react-native';
import type { LatLon } from '@/shared/geo/types';
import type { CaseGap } from '@/shared/schemas/coverage';
import type { IncidentDetail } from '@/shared/schemas/incident';
import type { Post, Site } from '@/shared/schemas/site';
import type { SiteTerrain } from '@/shared/schemas/terrain';
import type { RefractionPresetId } from '@/shared/sightline/refraction-presets';
import type { ScenePost, SceneTarget } from '@/scenes/terrain/terrain-scene';
import { useLengthUnits, useSession } from '@/components/data/session';
import { useSite, useSitePosts } from '@/components/data/sites';
import { terrainProfileQuery, useSiteTerrain } from '@/components/data/terrain';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Chip, ChipRow } from '@/components/ui/chip';
import { Screen } from '@/components/ui/screen';
import { EmptyState, ErrorState, LoadingState, Notice } from '@/components/ui/states';
import { colors, radius, space, TOUCH } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import { useCoordinateFormat } from './coordinate-format';
import { useDecodedRaster, type MapCoverageLayer } from './map-coverage-layer';
import { blindAreaOutline } from './blind-area-outline';
import { IncidentMapPanel, IncidentOverlay, useIncidentShapes, useMapIncidents } from './incident-overlay';
import { LandmarkOverlay, useLandmarkPoints } from './landmark-overlay';
import type { MapTarget } from './map-features';
import { MapLegend } from './map-legend';
import { MapViewport, type MapHandles, type ShownLayer } from './map-viewport';
import { PostMoveDialog, type PendingMove } from './post-move';
import { ProfilePanel } from './profile-panel';
import { createReadoutStore } from './readout-store';
import { ShoreOverlay } from './shore-overlay';
import { siteMapFrame, type SiteMapFrame } from './site-map-frame';
import { Terrain3d } from './terrain-3d';
import { useVisibilityIndexOverlay } from './visibility-index-panel';
import { documentTitle, PageTitle } from '@/components/ui/page-title';

export interface SiteMapScreenProps {
  siteId: string;
  /** A post to centre on and choose at first (from "Show on the map"). */
  focusPostId?: string | null;
  /** A point to centre on and take as the first tapped point (e.g. a blind area from a plan's coverage). */
  focusAt?: LatLon | null;
  /**
   * Coverage layers to draw over the map (a coverage run's posts-per-cell,
   * cross-bearing, per-post or difference layers), each with its palette.
   * The first is drawn until the person picks another (or none); ids that
   * stay the same across cases keep the pick.
   */
  coverageLayers?: readonly MapCoverageLayer[];
  /** Shown above the layer chips (e.g. the run's case picker and its state). */
  coveragePanel?: ReactNode;
  /** Told when the chosen post changes (e.g. to load that post's visibility layer). */
  onChosenPost?: (postId: string | null) => void;
  /** `focusAt` is a point inside a blind area: outline that area (from the posts-per-cell layer). */
  outlineBlindArea?: boolean;
  /** An incident to open on: the map centres on its fix (the site's open incidents are drawn anyway). */
  focusIncidentId?: string | null;
  /** A coverage case's gaps along the shore, drawn on the shoreline (a run's map). */
  shoreGaps?: readonly CaseGap[];
}

/** Taps kept on the map (and as sight lines in 3D). */
const MAX_TARGETS = 6;

/** The site map: loads the site, its posts and terrain, then the map workspace. */
export function SiteMapScreen({
  siteId,
  focusPostId = null,
  focusAt = null,
  coverageLayers = [],
  coveragePanel = null,
  onChosenPost,
  outlineBlindArea = false,
  focusIncidentId = null,
  shoreGaps = [],
}: SiteMapScreenProps) {
  const site = useSite(siteId);
  const posts = useSitePosts(siteId);
  const terrain = useSiteTerrain(siteId);
  const incidents = useMapIncidents(siteId, focusIncidentId);
  // The tower heat map is offered on the plain site map (a run's map has its own layers).
  const heat = useVisibilityIndexOverlay(siteId, site.data?.defaultUnits);
  const plain = coverageLayers.length === 0 && !coveragePanel;
  if (site.isPending || posts.isPending || terrain.isPending || incidents.focusPending) {
    return <LoadingState label="Loading the map…" />;
  }
  if (site.isError) return <ErrorState error={site.error} onRetry={() => void site.refetch()} />;
  if (posts.isError) return <ErrorState error={posts.error} onRetry={() => void posts.refetch()} />;
  if (terrain.isError) return <ErrorState error={terrain.error} onRetry={() => void terrain.refetch()} />;
  return (
    <MapWorkspace
      site={site.data}
      posts={posts.data}
      terrain={terrain.data}
      focusPostId={focusPostId}
      focusAt={focusAt ?? incidents.focusFix}
      coverageLayers={plain ? (heat.layer ? [heat.layer] : []) : coverageLayers}
      coveragePanel={plain && terrain.data ? heat.panel : coveragePanel}
      onChosenPost={onChosenPost}
      outlineBlindArea={outlineBlindArea}
      incidents={incidents.details}
      shoreGaps={shoreGaps}
    />
  );
}

function MapWorkspace({
  site,
  posts,
  terrain,
  focusPostId,
  focusAt,
  coverageLayers,
  coveragePanel,
  onChosenPost,
  outlineBlindArea,
  incidents,
  shoreGaps,
}: {
  site: Site;
  posts: Post[];
  terrain: SiteTerrain | null;
  focusPostId: string | null;
  focusAt: LatLon | null;
  coverageLayers: readonly MapCoverageLayer[];
  coveragePanel: ReactNode;
  onChosenPost?: (postId: string | null) => void;
  outlineBlindArea: boolean;
  incidents: readonly IncidentDetail[];
  shoreGaps: readonly CaseGap[];
}) {
  const { wide } = useLayout();
  const { distance } = useLengthUnits(site.defaultUnits);
  const router = useRouter();
  const { data: user } = useSession();
  const canMove = user?.role === 'planner';
  // Moving posts by dragging (planners): off by default, so a pan that starts on a pin never moves it.
  const [moving, setMoving] = useState(false);
  const [drag, setDrag] = useState<{ postId: string; x: number; y: number } | null>(null);
  const dragRef = useRef(drag);
  dragRef.current = drag;
  const [pendingMove, setPendingMove] = useState<PendingMove | null>(null);
  const [moveMessage, setMoveMessage] = useState('');
  const savedFrame = useMemo(() => siteMapFrame(site, posts, terrain), [site, posts, terrain]);
  // While a pin is dragged (and until the move is confirmed or cancelled) the post is drawn where it was dropped.
  const frame = useMemo(() => {
    if (!drag || !savedFrame) return savedFrame;
    const to = savedFrame.projection.toLatLon(drag.x, drag.y);
    const shifted = posts.map((p) => (p.id === drag.postId ? { ...p, location: { latDeg: to.latDeg, lonDeg: to.lonDeg } } : p));
    return siteMapFrame(site, shifted, terrain);
  }, [drag, savedFrame, posts, site, terrain]);
  useEffect(() => setDrag(null), [posts]);
  const [mode, setMode] = useState<'2d' | '3d'>('2d');
  const [chosenPostId, setChosenPostId] = useState<string | null>(
    posts.find((p) => p.id === focusPostId)?.id ?? posts.find((p) => p.status === 'existing')?.id ?? posts[0]?.id ?? null,
  );
  useEffect(() => onChosenPost?.(chosenPostId), [onChosenPost, chosenPostId]);
  // A point handed in by address starts as P1 (its profile from the chosen post is one tap away).
  const [targets, setTargets] = useState<MapTarget[]>(() => {
    const at = focusAt && frame ? frame.projection.toGrid(focusAt) : null;
    return at && Number.isFinite(at.x) && Number.isFinite(at.y) ? [{ id: 1, ...at }] : [];
  });
  const [conditions, setConditions] = useState<RefractionPresetId[]>(['standard-optical', 'no-refraction']);
  const [targetHeightM, setTargetHeightM] = useState(0);
  // undefined: nothing picked yet, so the first layer shows (layers may arrive after the map).
  const [layerId, setLayerId] = useState<string | null | undefined>(undefined);
  const [sheetOpen, setSheetOpen] = useState(false);
  const [legendOpen, setLegendOpen] = useState(false);
  const [format, setFormat] = useCoordinateFormat();
  const [readout] = useState(createReadoutStore);

  const layer = (layerId === undefined ? coverageLayers[0] : coverageLayers.find((l) => l.id === layerId)) ?? null;
  const decoded = useDecodedRaster(layer?.raster ?? null);
  const shown: ShownLayer | null = layer && decoded.values ? { layer, values: decoded.values } : null;
  // The blind area the address points into, outlined whatever layer is shown.
  const postsLayer = outlineBlindArea && focusAt ? (coverageLayers.find((l) => l.id === 'posts-per-cell') ?? null) : null;
  const postsValues = useDecodedRaster(postsLayer?.raster ?? null).values;
  const outline = useMemo(() => {
    const at = focusAt && frame ? frame.projection.toGrid(focusAt) : null;
    if (!postsLayer || !postsValues || !frame || !at) return null;
    const r = postsLayer.raster;
    return blindAreaOutline(
      postsValues,
      { width: r.width, height: r.height, cellSize: r.cellSize, xll: r.xll, yll: r.yll },
      frame.boundary?.points ?? null,
      at,
    );
  }, [postsLayer, postsValues, frame, focusAt]);
  const incidentShapes = useIncidentShapes(frame, incidents);
  const landmarkPoints = useLandmarkPoints(frame, site.id);
  const chosen = posts.find((p) => p.id === chosenPostId) ?? null;
  const last = targets.at(-1) ?? null;
  const lastLatLon = last && frame ? { ...frame.projection.toLatLon(last.x, last.y), label: `P${last.id}` } : null;
  const focusPost = frame?.posts.find((p) => p.post.id === focusPostId) ?? null;
  const focus = focusPost ? { x: focusPost.x, y: focusPost.y } : focusAt ? (targets[0] ?? null) : null;

  const back = () => router.navigate({ pathname: '/sites/[siteId]', params: { siteId: site.id } });

  if (!frame) {
    return (
      <Screen title={`${site.name}: map`}>
        <EmptyState
          title="Nothing to map yet"
          body="This site has no boundary, priority zones, posts or terrain. Edit the site to draw its boundary (or type its corners), or add a post on the site page."
          action={<Button kind="secondary" label="Back to the site" onPress={back} />}
        />
      </Screen>
    );
  }

  const handles: MapHandles | undefined =
    canMove && moving && savedFrame
      ? {
          points: savedFrame.posts.map((p) => ({ x: p.x, y: p.y })),
          onDrag: (index, point) => {
            const held = savedFrame.posts[index];
            if (held) setDrag({ postId: held.post.id, ...point });
          },
          onDragEnd: (index) => {
            const held = savedFrame.posts[index];
            const at = dragRef.current;
            if (!held || !at || at.postId !== held.post.id) return;
            setMoveMessage('');
            setPendingMove({ post: held.post, to: savedFrame.projection.toLatLon(at.x, at.y) });
          },
        }
      : undefined;
  const cancelMove = () => {
    setPendingMove(null);
    setDrag(null);
  };
  // A saved move keeps the pin where it was dropped until the posts come back from the server.
  const savedMove = (message: string) => {
    setPendingMove(null);
    setMoveMessage(message);
  };

  const onTap = (point: { x: number; y: number }) => {
    setTargets((old) => [...old, { id: (old.at(-1)?.id ?? 0) + 1, ...point }].slice(-MAX_TARGETS));
    setSheetOpen(true);
  };

  const profile = (
    <ProfilePanel
      siteId={site.id}
      hasTerrain={!!frame.base}
      post={chosen}
      target={lastLatLon}
      conditions={conditions}
      onConditions={setConditions}
      targetHeightM={targetHeightM}
      onTargetHeight={setTargetHeightM}
    />
  );
  const layers = (
    <ChipRow label="Coverage layer">
      <Chip label="None" on={layer === null} onPress={() => setLayerId(null)} />
      {coverageLayers.map((l) => (
        <Chip key={l.id} label={l.title} on={l.id === layer?.id} onPress={() => setLayerId(l.id)} />
      ))}
    </ChipRow>
  );
  const legend = (
    <View style={{ gap: space.md }}>
      {coveragePanel}
      {layers}
      {coverageLayers.length === 0 && !coveragePanel ? (
        <AppText variant="small" tone="muted">
          No coverage layers here yet: they come with a plan’s coverage run.
        </AppText>
      ) : null}
      {decoded.error ? (
        <Notice tone="danger" title="The layer cannot be drawn">
          <AppText variant="small">{decoded.error}</AppText>
        </Notice>
      ) : null}
      {frame.baseProblem ? (
        <Notice tone="caution">
          <AppText variant="small">{frame.baseProblem}</AppText>
        </Notice>
      ) : null}
      <MapLegend
        hasTerrain={!!frame.base}
        showSectors={posts.some((p) => p.sector)}
        palette={shown?.layer.palette ?? null}
        shore={site.shoreline && site.shoreline.length >= 2 ? { gaps: shoreGaps.length > 0 } : null}
      />
      <IncidentMapPanel details={incidents} format={format} />
    </View>
  );

  const postChips = (
    <ScrollView horizontal showsHorizontalScrollIndicator={false} contentContainerStyle={styles.chips} style={{ flexGrow: 0 }}>
      {canMove && posts.length > 0 && mode === '2d' ? (
        <Pressable
          role="switch"
          aria-checked={moving}
          aria-label="Move posts by dragging"
          onPress={() => {
            setMoving((m) => !m);
            setMoveMessage('');
          }}
          style={[styles.postChip, moving && { backgroundColor: colors.ember, borderColor: colors.ember }]}
        >
          <AppText variant="label" style={{ color: moving ? colors.surface : colors.ink }}>
            {moving ? 'Moving posts: on' : 'Move posts'}
          </AppText>
        </Pressable>
      ) : null}
      <View
        role="radiogroup"
        aria-label="Profile from post"
        style={{ flexDirection: 'row', gap: space.sm, alignItems: 'center' }}
      >
        <AppText variant="label" tone="muted">
          From
        </AppText>
        {posts.map((p) => (
          <PostChip key={p.id} post={p} on={p.id === chosenPostId} onPress={() => setChosenPostId(p.id)} />
        ))}
        {posts.length === 0 ? (
          <AppText variant="small" tone="muted">
            no posts yet
          </AppText>
        ) : null}
      </View>
    </ScrollView>
  );

  const view =
    mode === '2d' ? (
      <MapViewport
        frame={frame}
        units={site.defaultUnits}
        chosenPostId={chosenPostId}
        targets={targets}
        shown={shown}
        focus={focus}
        readout={readout}
        format={format}
        onFormat={setFormat}
        onTap={onTap}
        outline={outline?.segments ?? null}
        bottomInset={!wide && sheetOpen ? SHEET_PEEK : 0}
        handles={handles}
        label={handles ? 'Map: drag a post’s pin to move it, drag elsewhere to pan, tap a point for its profile' : undefined}
        keepInView={!wide && sheetOpen ? last : null}
        overlay={(view) => (
          <>
            <ShoreOverlay frame={frame} shoreline={site.shoreline} gaps={shoreGaps} unit={distance} {...view} />
            <LandmarkOverlay points={landmarkPoints} {...view} />
            <IncidentOverlay shapes={incidentShapes} {...view} />
          </>
        )}
      />
    ) : (
      <Map3d
        siteId={site.id}
        frame={frame}
        chosenPostId={chosenPostId}
        targets={targets}
        conditions={conditions}
        targetHeightM={targetHeightM}
        drape={shown}
      />
    );

  const moveBanner =
    mode === '2d' && ((canMove && moving) || moveMessage) ? (
      <View style={styles.moveBanner} pointerEvents="box-none">
        <Notice tone="info">
          <AppText variant="small" aria-live="polite">
            {moveMessage ||
              'Drag a post’s pin to its new place. The ground is read from the terrain there, and you confirm before anything is saved.'}
          </AppText>
        </Notice>
      </View>
    ) : null;
  const moveDialog = (
    <PostMoveDialog siteId={site.id} hasTerrain={!!terrain} pending={pendingMove} onDone={savedMove} onCancel={cancelMove} />
  );

  const toolbar = (
    <View style={styles.toolbar}>
      <PageTitle title={documentTitle(`${site.name}: map`)} />
      <Pressable role="link" aria-label={`Back to ${site.name}`} onPress={back} style={styles.back}>
        <AppText variant="heading" tone="ember">
          ‹{wide ? ' Site' : ''}
        </AppText>
      </Pressable>
      <View style={{ flex: 1, minWidth: 0 }}>
        <AppText variant="heading" numberOfLines={1} role="heading">
          {site.name}
        </AppText>
        <AppText variant="small" tone="muted" numberOfLines={1}>
          {frame.base ? frame.projection.label : `No terrain · ${frame.projection.label}`}
        </AppText>
      </View>
      {!wide ? (
        <Pressable
          role="button"
          aria-expanded={legendOpen}
          aria-label="Legend and layers"
          onPress={() => setLegendOpen((o) => !o)}
          style={[styles.toolButton, legendOpen && { backgroundColor: colors.ink }]}
        >
          <AppText variant="label" style={{ color: legendOpen ? colors.surface : colors.ink }}>
            Legend
          </AppText>
        </Pressable>
      ) : null}
      <View role="radiogroup" aria-label="View" style={styles.segment}>
        {(['2d', '3d'] as const).map((m) => (
          <Pressable
            key={m}
            role="radio"
            aria-checked={mode === m}
            aria-label={m === '2d' ? '2D map' : '3D view'}
            onPress={() => {
              setMode(m);
              // The 3D view takes the whole map area on a phone; the profile waits in 2D.
              if (m === '3d') setSheetOpen(false);
            }}
            style={[styles.segmentItem, mode === m && { backgroundColor: colors.ink }]}
          >
            <AppText variant="label" style={{ color: mode === m ? colors.surface : colors.ink }}>
              {m.toUpperCase()}
            </AppText>
          </Pressable>
        ))}
      </View>
    </View>
  );

  if (wide) {
    return (
      <View style={styles.wide}>
        <View style={{ flex: 1 }}>
          {toolbar}
          {postChips}
          <View style={{ flex: 1 }}>
            {view}
            {moveBanner}
          </View>
          {moveDialog}
        </View>
        <ScrollView style={styles.side} contentContainerStyle={{ padding: space.lg, gap: space.xl }} aria-label="Map panel">
          <View style={{ gap: space.sm }}>
            <AppText variant="heading">Profile</AppText>
            {profile}
          </View>
          <View style={{ gap: space.sm }}>
            <AppText variant="heading">Layers and legend</AppText>
            {legend}
          </View>
        </ScrollView>
      </View>
    );
  }

  return (
    <View style={styles.phone}>
      {toolbar}
      {postChips}
      {moveDialog}
      <View style={{ flex: 1 }}>
        {view}
        {moveBanner}
        {legendOpen ? (
          <View style={styles.legendSheet} aria-label="Legend and layers">
            <ScrollView contentContainerStyle={{ padding: space.md, gap: space.md }}>
              <View style={{ flexDirection: 'row', justifyContent: 'space-between', alignItems: 'center' }}>
                <AppText variant="heading">Layers and legend</AppText>
                <Button kind="quiet" label="Close" onPress={() => setLegendOpen(false)} />
              </View>
              {legend}
            </ScrollView>
          </View>
        ) : null}
        {mode === '3d' ? null : sheetOpen ? (
          <View style={styles.sheet} aria-label="Profile sheet" role="dialog">
            <View style={styles.sheetHead}>
              <View style={styles.grip} />
              <AppText variant="heading" style={{ flex: 1 }}>
                Profile{lastLatLon ? ` to ${lastLatLon.label}` : ''}
              </AppText>
              <Button kind="quiet" label="Close" onPress={() => setSheetOpen(false)} />
            </View>
            <ScrollView contentContainerStyle={{ paddingHorizontal: space.md, paddingBottom: space.xl, gap: space.md }}>
              {profile}
            </ScrollView>
          </View>
        ) : last ? (
          <View style={styles.reopen} pointerEvents="box-none">
            <Button kind="secondary" label={`Profile to P${last.id}`} onPress={() => setSheetOpen(true)} />
          </View>
        ) : null}
      </View>
    </View>
  );
}

/** Height the phone's profile sheet takes over the map, pixels (the read-out moves above it). */
const SHEET_PEEK = 360;

function PostChip({ post, on, onPress }: { post: Post; on: boolean; onPress: () => void }) {
  const proposed = post.status === 'proposed';
  return (
    <Pressable
      role="radio"
      aria-checked={on}
      aria-label={`${post.name}${proposed ? ' (proposed)' : ''}`}
      onPress={onPress}
      style={[styles.postChip, on && { backgroundColor: colors.ink, borderColor: colors.ink }]}
    >
      <AppText variant="label" style={{ color: on ? colors.surface : colors.ink }} numberOfLines={1}>
        {proposed ? '◇ ' : '▲ '}
        {post.name}
        {proposed ? ' · proposed' : ''}
      </AppText>
    </Pressable>
  );
}

/** The 3D view with the sight lines' verdicts (first condition) for the chosen post, from the profile cache or the API. */
function Map3d({
  siteId,
  frame,
  chosenPostId,
  targets,
  conditions,
  targetHeightM,
  drape,
}: {
  siteId: string;
  frame: SiteMapFrame;
  chosenPostId: string | null;
  targets: readonly MapTarget[];
  conditions: readonly RefractionPresetId[];
  targetHeightM: number;
  /** The coverage layer shown on the 2D map, draped over the terrain too. */
  drape: ShownLayer | null;
}) {
  const verdicts = useQueries({
    queries: targets.map((t) => ({
      ...terrainProfileQuery(siteId, {
        postId: chosenPostId ?? undefined,
        target: frame.projection.toLatLon(t.x, t.y),
        targetHeightM,
        conditions: conditions.map((preset) => ({ preset })),
      }),
      enabled: !!frame.base && chosenPostId !== null,
    })),
  });
  const posts: ScenePost[] = frame.posts.map((p) => ({
    id: p.post.id,
    x: p.x,
    y: p.y,
    groundElevationM: p.post.groundElevationM,
    eyeHeightM: p.post.structureHeightM + p.post.eyeHeightM,
    proposed: p.post.status === 'proposed',
  }));
  const sceneTargets: SceneTarget[] = targets.map((t, i) => {
    const r = verdicts[i]?.data?.results[0];
    return { id: t.id, x: t.x, y: t.y, seen: r ? (targetHeightM > 0 ? r.targetTopSeen : r.groundSeen) : null };
  });
  return (
    <Terrain3d siteId={siteId} frame={frame} posts={posts} chosenPostId={chosenPostId} targets={sceneTargets} drape={drape} />
  );
}

const styles = StyleSheet.create({
  wide: { flex: 1, flexDirection: 'row', backgroundColor: colors.paper },
  side: { width: 400, flexGrow: 0, borderLeftWidth: 1, borderLeftColor: colors.line, backgroundColor: colors.surface },
  phone: { flex: 1, backgroundColor: colors.paper },
  toolbar: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.sm,
    paddingHorizontal: space.sm,
    paddingVertical: space.xs,
    backgroundColor: colors.surface,
    borderBottomWidth: 1,
    borderBottomColor: colors.line,
  },
  back: { minWidth: TOUCH, minHeight: TOUCH, alignItems: 'center', justifyContent: 'center' },
  toolButton: {
    minHeight: 36,
    paddingHorizontal: space.md,
    justifyContent: 'center',
    borderRadius: radius.md,
    borderWidth: 1.5,
    borderColor: colors.lineStrong,
  },
  segment: {
    flexDirection: 'row',
    borderRadius: radius.md,
    borderWidth: 1.5,
    borderColor: colors.lineStrong,
    overflow: 'hidden',
  },
  segmentItem: { minWidth: 44, minHeight: 36, alignItems: 'center', justifyContent: 'center', paddingHorizontal: space.sm },
  chips: { paddingHorizontal: space.sm, paddingVertical: space.xs, gap: space.sm },
  postChip: {
    minHeight: 36,
    justifyContent: 'center',
    paddingHorizontal: space.md,
    borderRadius: radius.pill,
    borderWidth: 1.5,
    borderColor: colors.lineStrong,
    backgroundColor: colors.surface,
  },
  legendSheet: {
    position: 'absolute',
    top: space.sm,
    left: space.sm,
    right: 60,
    maxHeight: '85%',
    backgroundColor: colors.surface,
    borderRadius: radius.lg,
    borderWidth: 1,
    borderColor: colors.line,
    shadowColor: '#000',
    shadowOpacity: 0.15,
    shadowRadius: 8,
  },
  sheet: {
    position: 'absolute',
    left: 0,
    right: 0,
    bottom: 0,
    height: SHEET_PEEK,
    backgroundColor: colors.surface,
    borderTopLeftRadius: radius.lg,
    borderTopRightRadius: radius.lg,
    borderTopWidth: 1,
    borderColor: colors.line,
    shadowColor: '#000',
    shadowOpacity: 0.18,
    shadowRadius: 10,
  },
  sheetHead: { flexDirection: 'row', alignItems: 'center', paddingHorizontal: space.md, paddingTop: space.sm, gap: space.sm },
  grip: {
    position: 'absolute',
    top: 4,
    left: '50%',
    marginLeft: -20,
    width: 40,
    height: 4,
    borderRadius: 2,
    backgroundColor: colors.lineStrong,
  },
  reopen: { position: 'absolute', right: space.sm, bottom: 120 },
  moveBanner: { position: 'absolute', top: space.sm, left: space.sm, right: 60 },
});
