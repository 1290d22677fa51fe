// Over 300 lines: the pan/zoom viewport: gestures, camera and base image share one transform state.
import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import { Image, StyleSheet, View, type LayoutChangeEvent } from 'react-native';
import { Gesture, GestureDetector, GestureHandlerRootView } from 'react-native-gesture-handler';
import Animated, { useAnimatedStyle, useSharedValue } from 'react-native-reanimated';
import type { CoordinateFormat } from '@/shared/geo/types';
import { space } from '@/components/ui/theme';
import { classLabelAt } from './class-raster-pixels';
import { ClassRasterOverlay } from './class-raster-overlay';
import {
  centerCameraOn,
  commitLive,
  fitCamera,
  gridRectToScreen,
  IDENTITY_LIVE,
  keepPointInView,
  liveScreenToGrid,
  zoomCameraAt,
  zoomLiveAt,
  type LiveTransform,
  type MapCamera,
  type MapSize,
} from './map-camera';
import { NorthArrow, ReadoutBar, ScaleBarView, ZoomButtons } from './map-chrome';
import type { MapCoverageLayer } from './map-coverage-layer';
import { MapFeatures, type MapTarget } from './map-features';
import { useMapPointer, type MapPointerHandlers } from './map-pointer';
import type { Readout, ReadoutStore } from './readout-store';
import type { ScaleUnits } from './scale-bar';
import { useUnitSystem } from '@/components/data/session';
import type { SiteMapFrame } from './site-map-frame';

/** A coverage layer ready to draw: the layer and its decoded codes. */
export interface ShownLayer {
  readonly layer: MapCoverageLayer;
  readonly values: Uint8Array;
}

export interface MapViewportProps {
  frame: SiteMapFrame;
  /** The site's default units; the person's own choice (account page) wins. */
  units: ScaleUnits;
  chosenPostId: string | null;
  targets: readonly MapTarget[];
  /** The coverage layer drawn over the base map, if any. */
  shown: ShownLayer | null;
  /** A grid point to centre on at first (e.g. a post the person came from). */
  focus: { x: number; y: number } | null;
  readout: ReadoutStore;
  format: CoordinateFormat;
  onFormat: (format: CoordinateFormat) => void;
  /** A tap (or click) on the map, in grid metres, with the scale it was made at. */
  onTap: (point: { x: number; y: number }, at: { metresPerPx: number }) => void;
  /**
   * Points that can be dragged (an outline's corners while it is drawn): a drag
   * that starts within a finger's reach of one moves it instead of the map.
   */
  handles?: MapHandles;
  /** More drawing over the features, for the committed camera (same margin as the features' SVG). */
  overlay?: (view: { camera: MapCamera; size: MapSize; margin: number }) => ReactNode;
  /** What the map's label says it does (for screen readers). */
  label?: string;
  /** Space kept free at the bottom for a sheet over the map, pixels. */
  bottomInset?: number;
  /** A grid point the view keeps clear of the edges and of `bottomInset` (the point a sheet describes): the map pans to it when it changes. */
  keepInView?: { x: number; y: number } | null;
  /** An area to outline (a blind area): `x1, y1, x2, y2` per edge, grid metres. */
  outline?: Float64Array | null;
}

/** Points a drag moves, grid metres, and where each drag goes. */
export interface MapHandles {
  readonly points: readonly { x: number; y: number }[];
  onDrag(index: number, point: { x: number; y: number }): void;
  onDragEnd?(index: number): void;
}

/** How near a press must start to a handle to grab it, pixels (a fingertip). */
export const HANDLE_REACH_PX = 22;

/** How far from the view's edges (and from a sheet) a kept point stays, pixels: its marker and label fit. */
const KEEP_IN_VIEW_MARGIN_PX = 36;

/** Wheel zooms wait this long for the next notch before the map is redrawn for the new zoom, ms. */
const WHEEL_SETTLE_MS = 180;

/**
 * The interactive map: pan by dragging, zoom by pinching, with the mouse
 * wheel or the buttons, tap for a point. Drawing follows a committed camera;
 * while a gesture runs, a transform (shared values, applied by Reanimated
 * without React renders) is laid over the drawing, and when it ends the
 * camera is committed once and the layer redrawn crisp (`commitLive`).
 */
export function MapViewport(props: MapViewportProps) {
  const { frame, units, chosenPostId, targets, shown, focus, readout, format, onFormat, onTap, handles, overlay, label } = props;
  const shownUnits = useUnitSystem(units);
  const bottomInset = props.bottomInset ?? 0;
  const [size, setSize] = useState<MapSize | null>(null);
  const [camera, setCamera] = useState<MapCamera | null>(null);
  const container = useRef<View>(null);

  const tx = useSharedValue(0);
  const ty = useSharedValue(0);
  const s = useSharedValue(1);
  const layerStyle = useAnimatedStyle(() => ({
    transform: [{ translateX: tx.value }, { translateY: ty.value }, { scale: s.value }],
  }));

  // Latest values for the gesture callbacks, which are built once.
  const latest = useRef({ camera, size, frame, shown, onTap, handles });
  latest.current = { camera, size, frame, shown, onTap, handles };

  const onLayout = (e: LayoutChangeEvent) => {
    const { width, height } = e.nativeEvent.layout;
    if (width < 10 || height < 10) return;
    setSize((old) => (old && old.width === width && old.height === height ? old : { width, height }));
    setCamera((old) => {
      if (old) return old;
      const fitted = fitCamera(frame.initial, { width, height }, 24);
      if (!focus) return fitted;
      // Centred on the focus, a little closer than the whole site.
      return centerCameraOn({ ...fitted, pxPerM: Math.min(fitted.pxPerM * 2, frame.zoom.maxPxPerM) }, focus.x, focus.y);
    });
  };

  // A committed camera means the drawing now matches what the transform showed: drop the transform.
  // In a layout effect, so the new drawing and the reset reach the screen in the same frame.
  useLayoutEffect(() => {
    tx.value = 0;
    ty.value = 0;
    s.value = 1;
  }, [camera, tx, ty, s]);

  // The point a sheet describes stays in sight above the sheet (the map pans, the zoom stays).
  const keepX = props.keepInView?.x;
  const keepY = props.keepInView?.y;
  useEffect(() => {
    if (keepX === undefined || keepY === undefined || !size) return;
    setCamera((old) => {
      if (!old) return old;
      const l = { tx: tx.value, ty: ty.value, s: s.value };
      const shown = l.tx === 0 && l.ty === 0 && l.s === 1 ? old : commitLive(old, size, l);
      const kept = keepPointInView(shown, size, keepX, keepY, bottomInset, KEEP_IN_VIEW_MARGIN_PX);
      return kept === shown ? old : kept;
    });
  }, [keepX, keepY, bottomInset, size, tx, ty, s]);

  const live = (): LiveTransform => ({ tx: tx.value, ty: ty.value, s: s.value });
  const setLive = (l: LiveTransform) => {
    tx.value = l.tx;
    ty.value = l.ty;
    s.value = l.s;
  };

  const gestureState = useRef({
    panning: false,
    pinching: false,
    start: IDENTITY_LIVE,
    panX: 0,
    panY: 0,
    panOffX: 0,
    panOffY: 0,
    beginX: 0,
    beginY: 0,
    k: 1,
    kOff: 1,
    fx: 0,
    fy: 0,
    /** The handle a drag holds, or -1 while the drag pans the map. */
    dragIndex: -1,
  });
  const wheelTimer = useRef<ReturnType<typeof setTimeout> | null>(null);

  const commit = useCallback(() => {
    const { camera: cam, size: sz } = latest.current;
    const g = gestureState.current;
    if (!cam || !sz || g.panning || g.pinching) return;
    const l = { tx: tx.value, ty: ty.value, s: s.value };
    if (l.tx === 0 && l.ty === 0 && l.s === 1) return;
    setCamera(commitLive(cam, sz, l));
  }, [tx, ty, s]);

  const gesture = useMemo(() => {
    const g = gestureState.current;
    const rebase = () => {
      g.start = { tx: tx.value, ty: ty.value, s: s.value };
      g.kOff = g.k;
      g.panOffX = g.panX;
      g.panOffY = g.panY;
    };
    const apply = () => {
      const { camera: cam, size: sz, frame: fr } = latest.current;
      if (!cam || !sz) return;
      const zoomed = zoomLiveAt(g.start, sz, g.k / g.kOff, g.fx, g.fy, cam.pxPerM, fr.zoom);
      tx.value = zoomed.tx + (g.panX - g.panOffX);
      ty.value = zoomed.ty + (g.panY - g.panOffY);
      s.value = zoomed.s;
    };
    // Translation is measured from where the finger (or button) went down, not from where the pan
    // activated, so the first few pixels before activation are not lost.
    const gridAt = (x: number, y: number) => {
      const { camera: cam, size: sz } = latest.current;
      return cam && sz ? liveScreenToGrid(cam, sz, { tx: tx.value, ty: ty.value, s: s.value }, x, y) : null;
    };
    /** The nearest handle within reach of a screen point, or -1. */
    const handleAt = (x: number, y: number) => {
      const { camera: cam, handles: hs } = latest.current;
      const at = gridAt(x, y);
      if (!hs || !cam || !at) return -1;
      const reachM = HANDLE_REACH_PX / (cam.pxPerM * s.value);
      let best = -1;
      let bestD = reachM;
      hs.points.forEach((p, i) => {
        const d = Math.hypot(p.x - at.x, p.y - at.y);
        if (d <= bestD) {
          best = i;
          bestD = d;
        }
      });
      return best;
    };
    const drag = (x: number, y: number) => {
      const at = gridAt(x, y);
      if (at && g.dragIndex >= 0) latest.current.handles?.onDrag(g.dragIndex, at);
    };
    const pan = Gesture.Pan()
      .runOnJS(true)
      .minDistance(6)
      .averageTouches(true)
      .onBegin((e) => {
        g.beginX = e.absoluteX;
        g.beginY = e.absoluteY;
        g.dragIndex = handleAt(e.x, e.y);
      })
      .onStart((e) => {
        if (g.dragIndex >= 0) {
          drag(e.x, e.y);
          return;
        }
        g.panning = true;
        rebase();
        g.panX = e.absoluteX - g.beginX;
        g.panY = e.absoluteY - g.beginY;
        g.panOffX = 0;
        g.panOffY = 0;
        apply();
      })
      .onUpdate((e) => {
        if (g.dragIndex >= 0) {
          drag(e.x, e.y);
          return;
        }
        g.panX = e.absoluteX - g.beginX;
        g.panY = e.absoluteY - g.beginY;
        apply();
      })
      .onFinalize(() => {
        if (g.dragIndex >= 0) {
          const index = g.dragIndex;
          g.dragIndex = -1;
          latest.current.handles?.onDragEnd?.(index);
          return;
        }
        if (!g.panning) return;
        g.panning = false;
        commit();
      });
    const pinch = Gesture.Pinch()
      .runOnJS(true)
      .onStart((e) => {
        g.k = 1;
        g.fx = e.focalX;
        g.fy = e.focalY;
        g.pinching = true;
        rebase();
      })
      .onUpdate((e) => {
        g.k = e.scale;
        apply();
      })
      .onFinalize(() => {
        if (!g.pinching) return;
        g.pinching = false;
        g.k = 1;
        g.kOff = 1;
        commit();
      });
    const tap = Gesture.Tap()
      .runOnJS(true)
      .maxDistance(10)
      .onEnd((e, success) => {
        const { camera: cam, size: sz, frame: fr, shown: sh, onTap: tapped } = latest.current;
        if (!success || !cam || !sz) return;
        const point = liveScreenToGrid(cam, sz, { tx: tx.value, ty: ty.value, s: s.value }, e.x, e.y);
        readout.set(describe(fr, point, sh, 'tap'));
        tapped(point, { metresPerPx: 1 / (cam.pxPerM * s.value) });
      });
    return Gesture.Race(Gesture.Simultaneous(pan, pinch), tap);
  }, [tx, ty, s, commit, readout]);

  const pointer = useRef<MapPointerHandlers>({ onWheel: () => {}, onHover: () => {}, onLeave: () => {} });
  pointer.current = {
    onWheel: (factor, x, y) => {
      const { camera: cam, size: sz } = latest.current;
      if (!cam || !sz) return;
      setLive(zoomLiveAt(live(), sz, factor, x, y, cam.pxPerM, frame.zoom));
      if (wheelTimer.current) clearTimeout(wheelTimer.current);
      wheelTimer.current = setTimeout(commit, WHEEL_SETTLE_MS);
    },
    onHover: (x, y) => {
      const { camera: cam, size: sz } = latest.current;
      if (!cam || !sz) return;
      const point = liveScreenToGrid(cam, sz, live(), x, y);
      readout.set(describe(frame, point, shown, 'pointer'));
    },
    onLeave: () => {},
  };
  useMapPointer(container, pointer);

  const zoomBy = (factor: number) => {
    if (!camera || !size) return;
    setCamera(zoomCameraAt(camera, size, factor, size.width / 2, size.height / 2, frame.zoom));
  };
  const fit = () => size && setCamera(fitCamera(frame.initial, size, 24));

  const margin = size ? Math.round(Math.max(size.width, size.height) / 2) : 0;
  const base = frame.base && camera && size ? gridRectToScreen(camera, size, frame.base.rect) : null;

  return (
    <GestureHandlerRootView style={styles.fill}>
      <View ref={container} style={[styles.fill, { backgroundColor: frame.base ? '#DCDCD6' : '#E4E9E6' }]} onLayout={onLayout}>
        {camera && size ? (
          <GestureDetector gesture={gesture}>
            <View
              style={styles.fill}
              role="application"
              aria-label={label ?? 'Map: drag to pan, pinch or scroll to zoom, tap a point for its profile'}
            >
              <Animated.View style={[styles.fill, layerStyle]}>
                {frame.base && base ? (
                  <Image
                    source={{ uri: frame.base.url }}
                    style={{ position: 'absolute', left: base.left, top: base.top, width: base.width, height: base.height }}
                    resizeMode="stretch"
                    aria-label="Hillshade"
                  />
                ) : null}
                {shown ? (
                  <ClassRasterOverlay
                    raster={shown.layer.raster}
                    values={shown.values}
                    palette={shown.layer.palette}
                    camera={camera}
                    size={size}
                  />
                ) : null}
                <MapFeatures
                  frame={frame}
                  camera={camera}
                  size={size}
                  margin={margin}
                  chosenPostId={chosenPostId}
                  targets={targets}
                  outline={props.outline ?? null}
                />
                {overlay ? overlay({ camera, size, margin }) : null}
              </Animated.View>
            </View>
          </GestureDetector>
        ) : null}
        <NorthArrow convergence={frame.convergence} />
        <ZoomButtons onZoom={zoomBy} onFit={fit} />
        <View style={[styles.bottom, { bottom: space.sm + bottomInset }]} pointerEvents="box-none">
          {camera ? <ScaleBarView metresPerPx={1 / camera.pxPerM} units={shownUnits} /> : null}
          <ReadoutBar store={readout} format={format} onFormat={onFormat} />
        </View>
      </View>
    </GestureHandlerRootView>
  );
}

/** The read-out for a grid point: its position in the chosen format and the shown layer's class there. */
function describe(
  frame: SiteMapFrame,
  point: { x: number; y: number },
  shown: ShownLayer | null,
  kind: 'pointer' | 'tap',
): Readout {
  const latLon = frame.projection.toLatLon(point.x, point.y);
  const layerClass = shown ? classLabelAt(shown.layer.raster, shown.values, shown.layer.palette, point.x, point.y) : null;
  return { kind, point: latLon, layerClass };
}

const styles = StyleSheet.create({
  fill: { position: 'absolute', left: 0, top: 0, right: 0, bottom: 0, overflow: 'hidden' },
  bottom: { position: 'absolute', left: space.sm, right: space.sm, gap: space.xs },
});
