/**
 * The map's view transform, pure. The map works in grid metres (the terrain's
 * projected CRS, x east, y north); the screen in CSS pixels (x right, y down),
 * north up. A committed `MapCamera` says which grid point sits at the view's
 * centre and how many pixels a metre takes; while a finger or the mouse
 * moves, a `LiveTransform` (translate + scale about the view's centre) is laid
 * over what was drawn for the committed camera, and folded into a new camera
 * when the gesture ends (`commitLive`). Nothing here touches React.
 */

/** Grid point at the view's centre (metres) and zoom (pixels per metre). */
export interface MapCamera {
  readonly centerX: number;
  readonly centerY: number;
  readonly pxPerM: number;
}

/** Size of the map's view, CSS pixels. */
export interface MapSize {
  readonly width: number;
  readonly height: number;
}

/** A rectangle in grid metres. */
export interface GridRect {
  readonly west: number;
  readonly south: number;
  readonly east: number;
  readonly north: number;
}

/** Zoom limits, pixels per metre. */
export interface ZoomLimits {
  readonly minPxPerM: number;
  readonly maxPxPerM: number;
}

/**
 * Transform laid over the committed drawing during a gesture: a drawn point q
 * shows at c + s·(q − c) + (tx, ty), c the view's centre (CSS transforms'
 * default origin).
 */
export interface LiveTransform {
  readonly tx: number;
  readonly ty: number;
  readonly s: number;
}

export const IDENTITY_LIVE: LiveTransform = { tx: 0, ty: 0, s: 1 };

/** Grid metres → screen pixels under a committed camera. */
export function gridToScreen(camera: MapCamera, size: MapSize, x: number, y: number): { x: number; y: number } {
  return {
    x: size.width / 2 + (x - camera.centerX) * camera.pxPerM,
    y: size.height / 2 - (y - camera.centerY) * camera.pxPerM,
  };
}

/** Screen pixels → grid metres under a committed camera (the inverse of {@link gridToScreen}). */
export function screenToGrid(camera: MapCamera, size: MapSize, sx: number, sy: number): { x: number; y: number } {
  return {
    x: camera.centerX + (sx - size.width / 2) / camera.pxPerM,
    y: camera.centerY - (sy - size.height / 2) / camera.pxPerM,
  };
}

/** A grid rectangle as a screen rectangle (left, top, width, height) under a committed camera. */
export function gridRectToScreen(
  camera: MapCamera,
  size: MapSize,
  rect: GridRect,
): { left: number; top: number; width: number; height: number } {
  const nw = gridToScreen(camera, size, rect.west, rect.north);
  return {
    left: nw.x,
    top: nw.y,
    width: (rect.east - rect.west) * camera.pxPerM,
    height: (rect.north - rect.south) * camera.pxPerM,
  };
}

/** The camera that shows the whole rectangle, centred, with `paddingPx` free on every side. */
export function fitCamera(rect: GridRect, size: MapSize, paddingPx = 16): MapCamera {
  const w = Math.max(rect.east - rect.west, 1);
  const h = Math.max(rect.north - rect.south, 1);
  const pxPerM = Math.max(Math.min((size.width - 2 * paddingPx) / w, (size.height - 2 * paddingPx) / h), 1e-6);
  return { centerX: (rect.west + rect.east) / 2, centerY: (rect.south + rect.north) / 2, pxPerM };
}

/** `pxPerM` held within the limits. */
export function clampZoom(pxPerM: number, limits: ZoomLimits): number {
  return Math.min(Math.max(pxPerM, limits.minPxPerM), limits.maxPxPerM);
}

/** Zooms by `factor` keeping the grid point under the screen point (sx, sy) where it is (the +/− buttons use the centre). */
export function zoomCameraAt(
  camera: MapCamera,
  size: MapSize,
  factor: number,
  sx: number,
  sy: number,
  limits: ZoomLimits,
): MapCamera {
  const anchor = screenToGrid(camera, size, sx, sy);
  const pxPerM = clampZoom(camera.pxPerM * factor, limits);
  return {
    centerX: anchor.x - (sx - size.width / 2) / pxPerM,
    centerY: anchor.y + (sy - size.height / 2) / pxPerM,
    pxPerM,
  };
}

/** Moves the view so that the drawing follows a drag of (dx, dy) pixels. */
export function panCamera(camera: MapCamera, dx: number, dy: number): MapCamera {
  return { ...camera, centerX: camera.centerX - dx / camera.pxPerM, centerY: camera.centerY + dy / camera.pxPerM };
}

/** The same camera centred on a grid point. */
export function centerCameraOn(camera: MapCamera, x: number, y: number): MapCamera {
  return { ...camera, centerX: x, centerY: y };
}

/** Where a point drawn at (qx, qy) shows under a live transform. */
export function liveToScreen(live: LiveTransform, size: MapSize, qx: number, qy: number): { x: number; y: number } {
  'worklet';
  const cx = size.width / 2;
  const cy = size.height / 2;
  return { x: cx + live.s * (qx - cx) + live.tx, y: cy + live.s * (qy - cy) + live.ty };
}

/** The drawn point (committed screen pixels) that shows at screen point (sx, sy) under a live transform. */
export function screenToDrawn(live: LiveTransform, size: MapSize, sx: number, sy: number): { x: number; y: number } {
  'worklet';
  const cx = size.width / 2;
  const cy = size.height / 2;
  return { x: cx + (sx - cx - live.tx) / live.s, y: cy + (sy - cy - live.ty) / live.s };
}

/**
 * Scales a live transform by `factor` about the screen point (fx, fy), which
 * stays put; the total zoom (camera × live) is held within the limits.
 */
export function zoomLiveAt(
  live: LiveTransform,
  size: MapSize,
  factor: number,
  fx: number,
  fy: number,
  cameraPxPerM: number,
  limits: ZoomLimits,
): LiveTransform {
  'worklet';
  const total = Math.min(Math.max(cameraPxPerM * live.s * factor, limits.minPxPerM), limits.maxPxPerM);
  const s = total / cameraPxPerM;
  const k = s / live.s;
  const cx = size.width / 2;
  const cy = size.height / 2;
  return { s, tx: fx - cx - k * (fx - cx - live.tx), ty: fy - cy - k * (fy - cy - live.ty) };
}

/** Folds a live transform into the camera it was laid over: the camera that draws what the screen showed. */
export function commitLive(camera: MapCamera, size: MapSize, live: LiveTransform): MapCamera {
  const drawnCentre = screenToDrawn(live, size, size.width / 2, size.height / 2);
  const centre = screenToGrid(camera, size, drawnCentre.x, drawnCentre.y);
  return { centerX: centre.x, centerY: centre.y, pxPerM: camera.pxPerM * live.s };
}

/** Screen pixels → grid metres through a live transform over a committed camera. */
export function liveScreenToGrid(
  camera: MapCamera,
  size: MapSize,
  live: LiveTransform,
  sx: number,
  sy: number,
): { x: number; y: number } {
  const drawn = screenToDrawn(live, size, sx, sy);
  return screenToGrid(camera, size, drawn.x, drawn.y);
}

/**
 * The camera moved as little as needed for the grid point (x, y) to show in
 * the part of the view a sheet leaves free: `marginPx` from every edge and
 * above the bottom `bottomInsetPx`. The same camera when the point already
 * shows there; when the free part is too small for the margins, the point
 * goes to its middle. The zoom never changes.
 *
 * @example keepPointInView(camera, { width: 390, height: 600 }, p.x, p.y, 360, 32) // a tapped point above the profile sheet
 */
export function keepPointInView(
  camera: MapCamera,
  size: MapSize,
  x: number,
  y: number,
  bottomInsetPx: number,
  marginPx: number,
): MapCamera {
  const at = gridToScreen(camera, size, x, y);
  const shiftInto = (v: number, low: number, high: number) =>
    high < low ? (low + high) / 2 - v : v < low ? low - v : v > high ? high - v : 0;
  const dx = shiftInto(at.x, marginPx, size.width - marginPx);
  const dy = shiftInto(at.y, marginPx, size.height - Math.max(bottomInsetPx, 0) - marginPx);
  return dx === 0 && dy === 0 ? camera : panCamera(camera, dx, dy);
}
