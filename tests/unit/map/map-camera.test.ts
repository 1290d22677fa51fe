import {
  commitLive,
  fitCamera,
  gridRectToScreen,
  gridToScreen,
  IDENTITY_LIVE,
  keepPointInView,
  liveScreenToGrid,
  liveToScreen,
  panCamera,
  screenToDrawn,
  screenToGrid,
  zoomCameraAt,
  zoomLiveAt,
  type MapCamera,
} from '@/components/map/map-camera';

// common practice, no source: a north-up map is x' = cx + (x − x0)·k, y' = cy − (y − y0)·k.
const size = { width: 400, height: 300 };
const camera: MapCamera = { centerX: 520_000, centerY: 5_740_000, pxPerM: 0.02 }; // 50 m a pixel
const limits = { minPxPerM: 0.001, maxPxPerM: 1 };

describe('grid ↔ screen', () => {
  test('the centre of the view is the camera centre; east is right, north is up', () => {
    expect(gridToScreen(camera, size, 520_000, 5_740_000)).toEqual({ x: 200, y: 150 });
    expect(gridToScreen(camera, size, 521_000, 5_740_000)).toEqual({ x: 220, y: 150 }); // 1 km east = 20 px right
    expect(gridToScreen(camera, size, 520_000, 5_741_000)).toEqual({ x: 200, y: 130 }); // 1 km north = 20 px up
  });

  test('screenToGrid undoes gridToScreen', () => {
    for (const [x, y] of [
      [513_123.4, 5_732_987.6],
      [526_000, 5_745_000],
    ] as const) {
      const s = gridToScreen(camera, size, x, y);
      const back = screenToGrid(camera, size, s.x, s.y);
      expect(back.x).toBeCloseTo(x, 6);
      expect(back.y).toBeCloseTo(y, 6);
    }
  });

  test('a grid rectangle becomes a screen rectangle with its north edge on top', () => {
    const r = gridRectToScreen(camera, size, { west: 519_000, south: 5_739_000, east: 521_000, north: 5_742_000 });
    expect(r).toEqual({ left: 180, top: 110, width: 40, height: 60 });
  });

  test('fitCamera shows the whole rectangle with the padding free', () => {
    const rect = { west: 500_000, south: 5_700_000, east: 515_000, north: 5_710_000 }; // 15 km × 10 km
    const fit = fitCamera(rect, size, 20);
    expect(fit.pxPerM).toBeCloseTo(Math.min(360 / 15_000, 260 / 10_000), 12);
    const r = gridRectToScreen(fit, size, rect);
    expect(r.left).toBeCloseTo(20, 9);
    expect(r.left + r.width).toBeCloseTo(380, 9);
    expect(r.top).toBeGreaterThanOrEqual(20 - 1e-9);
  });
});

describe('zoom and pan', () => {
  test('zooming at a point keeps the grid point under it', () => {
    const before = screenToGrid(camera, size, 50, 260);
    const zoomed = zoomCameraAt(camera, size, 2, 50, 260, limits);
    expect(zoomed.pxPerM).toBeCloseTo(0.04, 12);
    const after = screenToGrid(zoomed, size, 50, 260);
    expect(after.x).toBeCloseTo(before.x, 6);
    expect(after.y).toBeCloseTo(before.y, 6);
  });

  test('zoom stops at the limits', () => {
    expect(zoomCameraAt(camera, size, 1000, 200, 150, limits).pxPerM).toBe(1);
    expect(zoomCameraAt(camera, size, 1e-6, 200, 150, limits).pxPerM).toBe(0.001);
  });

  test('panning moves the drawing with the drag: drag right by 20 px → 1 km further west shows in the centre', () => {
    const moved = panCamera(camera, 20, -10);
    expect(moved.centerX).toBeCloseTo(519_000, 6);
    expect(moved.centerY).toBeCloseTo(5_739_500, 6); // drag up by 10 px: the drawing moves up, ground 500 m south comes to the centre
    expect(gridToScreen(moved, size, 520_000, 5_740_000)).toEqual({ x: 220, y: 140 });
  });
});

describe('a point kept clear of a sheet over the map', () => {
  // common practice, no source: a bottom sheet must not hide the point it describes; the view pans, the zoom stays.
  const inset = 180; // a sheet over the bottom 180 px of the 300 px view leaves 120 px
  const margin = 20;

  test('a point already in the free part leaves the camera as it was', () => {
    const p = screenToGrid(camera, size, 100, 60);
    expect(keepPointInView(camera, size, p.x, p.y, inset, margin)).toBe(camera);
  });

  test('a point under the sheet comes up to just above it, and nothing else moves', () => {
    const p = screenToGrid(camera, size, 300, 250); // 250 px down: under the sheet (which starts at 120 px)
    const kept = keepPointInView(camera, size, p.x, p.y, inset, margin);
    expect(kept.pxPerM).toBe(camera.pxPerM);
    const at = gridToScreen(kept, size, p.x, p.y);
    expect(at.x).toBeCloseTo(300, 9);
    expect(at.y).toBeCloseTo(300 - inset - margin, 9); // 100 px: the lowest place the sheet and margin leave
  });

  test('a point near an edge comes in by the margin', () => {
    const p = screenToGrid(camera, size, 5, 10);
    const at = gridToScreen(keepPointInView(camera, size, p.x, p.y, 0, margin), size, p.x, p.y);
    expect(at.x).toBeCloseTo(margin, 9);
    expect(at.y).toBeCloseTo(margin, 9);
  });

  test('when the free part is smaller than the margins, the point goes to its middle', () => {
    const p = screenToGrid(camera, size, 200, 280);
    const at = gridToScreen(keepPointInView(camera, size, p.x, p.y, 270, margin), size, p.x, p.y);
    expect(at.y).toBeCloseTo((margin + (300 - 270 - margin)) / 2, 9);
  });
});

describe('live transform during a gesture', () => {
  test('identity shows the drawing as drawn', () => {
    expect(liveToScreen(IDENTITY_LIVE, size, 12, 34)).toEqual({ x: 12, y: 34 });
    expect(commitLive(camera, size, IDENTITY_LIVE)).toEqual(camera);
  });

  test('screenToDrawn undoes liveToScreen', () => {
    const live = { tx: 13, ty: -7, s: 2.5 };
    const shown = liveToScreen(live, size, 80, 90);
    const back = screenToDrawn(live, size, shown.x, shown.y);
    expect(back.x).toBeCloseTo(80, 9);
    expect(back.y).toBeCloseTo(90, 9);
  });

  test('zooming the live transform about a point keeps that point fixed, and folds into the same camera as zooming the camera', () => {
    const live = zoomLiveAt(IDENTITY_LIVE, size, 3, 60, 40, camera.pxPerM, limits);
    const fixed = liveToScreen(live, size, 60, 40);
    expect(fixed.x).toBeCloseTo(60, 9);
    expect(fixed.y).toBeCloseTo(40, 9);
    const committed = commitLive(camera, size, live);
    const direct = zoomCameraAt(camera, size, 3, 60, 40, limits);
    expect(committed.pxPerM).toBeCloseTo(direct.pxPerM, 12);
    expect(committed.centerX).toBeCloseTo(direct.centerX, 6);
    expect(committed.centerY).toBeCloseTo(direct.centerY, 6);
  });

  test('a drag then a zoom, committed, shows every grid point where the live view showed it', () => {
    let live = { ...IDENTITY_LIVE, tx: 35, ty: -20 };
    live = zoomLiveAt(live, size, 1.7, 300, 100, camera.pxPerM, limits);
    const committed = commitLive(camera, size, live);
    for (const [sx, sy] of [
      [0, 0],
      [400, 300],
      [123, 45],
    ] as const) {
      const seen = liveScreenToGrid(camera, size, live, sx, sy);
      const after = gridToScreen(committed, size, seen.x, seen.y);
      expect(after.x).toBeCloseTo(sx, 6);
      expect(after.y).toBeCloseTo(sy, 6);
    }
  });

  test('the live zoom is held within the limits of the total zoom', () => {
    const live = zoomLiveAt(IDENTITY_LIVE, size, 1e4, 200, 150, camera.pxPerM, limits);
    expect(camera.pxPerM * live.s).toBeCloseTo(limits.maxPxPerM, 12);
  });
});
