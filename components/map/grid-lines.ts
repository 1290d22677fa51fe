import { screenToGrid, type MapCamera, type MapSize } from './map-camera';

/** Grid spacings offered, metres (1–2–5 steps). */
const SPACINGS_M = [50, 100, 200, 500, 1000, 2000, 5000, 10_000, 20_000, 50_000, 100_000];

/**
 * The grid lines (eastings and northings, metres) of a plain map background
 * over a view and `marginPx` around it: the finest round spacing whose lines
 * are at least `minGapPx` apart on screen.
 *
 * @returns `{ spacingM, eastings, northings }`, ascending
 *
 * @example
 * gridLines({ centerX: 0, centerY: 0, pxPerM: 0.1 }, { width: 400, height: 400 }, 0); // spacingM 1000, eastings −2000…2000
 */
export function gridLines(camera: MapCamera, size: MapSize, marginPx: number, minGapPx = 60) {
  const spacingM = SPACINGS_M.find((s) => s * camera.pxPerM >= minGapPx) ?? SPACINGS_M[SPACINGS_M.length - 1]!;
  const sw = screenToGrid(camera, size, -marginPx, size.height + marginPx);
  const ne = screenToGrid(camera, size, size.width + marginPx, -marginPx);
  const steps = (from: number, to: number) => {
    const out: number[] = [];
    for (let v = Math.ceil(from / spacingM) * spacingM; v <= to; v += spacingM) out.push(v);
    return out;
  };
  return { spacingM, eastings: steps(sw.x, ne.x), northings: steps(sw.y, ne.y) };
}
