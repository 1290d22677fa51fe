/**
 * Benchmark of the bearing-fix core: a two-bearing fix (intersection +
 * error quadrilateral, five geodesic solves) and a four-bearing least-squares
 * fix (with the leave-one-out search for a disagreeing bearing). Measurement
 * only; speed is never a test.
 */
import { Geodesic } from 'geographiclib-geodesic';
import { evaluateFix, type ResolvedFixBearing } from '@/shared/fixes';

export interface BenchResult {
  name: string;
  opsPerSec: number;
}

const MIN_DURATION_MS = 400;

function measure(work: () => number): number {
  let sink = 0;
  for (let i = 0; i < 20; i += 1) sink += work();
  let n = 0;
  const start = performance.now();
  while (performance.now() - start < MIN_DURATION_MS) {
    sink += work();
    n += 1;
  }
  if (Number.isNaN(sink)) throw new Error('benchmark produced NaN');
  return (n / (performance.now() - start)) * 1000;
}

const SMOKE = { latDeg: 51.73, lonDeg: 15.31 };
const bearingFrom = (azimuthFromSmokeDeg: number, distanceM: number, offsetDeg = 0): ResolvedFixBearing => {
  const p = Geodesic.WGS84.Direct(SMOKE.latDeg, SMOKE.lonDeg, azimuthFromSmokeDeg, distanceM);
  const back = Geodesic.WGS84.Inverse(p.lat2!, p.lon2!, SMOKE.latDeg, SMOKE.lonDeg).azi1!;
  return {
    from: { latDeg: p.lat2!, lonDeg: p.lon2! },
    bearingDeg: (back + offsetDeg + 360) % 360,
    bearingReference: 'true',
    bearingSigmaDeg: 0.5,
    postName: null,
    eyeHeightM: null,
  };
};

export async function benchFixes(): Promise<BenchResult[]> {
  const two = [bearingFrom(200, 30_000), bearingFrom(280, 24_000)];
  const four = [bearingFrom(15, 20_000), bearingFrom(100, 25_000), bearingFrom(215, 30_000, 4), bearingFrom(290, 35_000)];
  return [
    {
      name: 'evaluateFix, two bearings (intersection + quadrilateral)',
      opsPerSec: measure(() => evaluateFix('t', two).fix.latDeg),
    },
    {
      name: 'evaluateFix, four bearings, one 4° off (least squares)',
      opsPerSec: measure(() => evaluateFix('t', four).fix.latDeg),
    },
  ];
}
