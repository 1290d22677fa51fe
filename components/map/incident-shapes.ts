import { offsetPoint } from '@/shared/fixes/offset-point';
import { geodesicInverse } from '@/shared/geo/geodesic-inverse';
import type { LatLon } from '@/shared/geo/types';
import type { IncidentDetail } from '@/shared/schemas/incident';

type GridPoint = { x: number; y: number };

/** One post's bearing line in grid metres. */
export interface BearingShape {
  readonly seq: number;
  readonly postName: string;
  /** True when this bearing disagrees with the others (three or more bearings). */
  readonly flagged: boolean;
  /** From the post along the geodesic of the reported true bearing. */
  readonly points: readonly GridPoint[];
}

/** An incident as the map draws it. */
export interface IncidentShape {
  readonly incidentId: string;
  readonly title: string;
  readonly bearings: readonly BearingShape[];
  readonly fix: GridPoint | null;
  /** The fix's error area (quadrilateral or ellipse), grid metres; null without a fix. */
  readonly errorRing: readonly GridPoint[] | null;
}

/** How long a bearing line is drawn without a fix to end near, metres. */
export const LONE_BEARING_M = 15_000;
/** A bearing line runs this much past the fix so both sides of the crossing show. */
const PAST_FIX = 1.25;
/** Points along each drawn geodesic (a geodesic is not straight in a grid, slightly). */
const STEPS = 8;

const toRad = Math.PI / 180;

/**
 * The incidents' bearings, fixes and error areas in the map's grid: each
 * reporting post's latest bearing (the one the fix uses) as a geodesic from
 * the post, past the fix by a quarter of its distance (or {@link LONE_BEARING_M}
 * without a fix); the fix point; its error ring.
 *
 * @param toGrid the map's projection (WGS84 degrees → grid metres)
 * @param details the incidents with their reports
 * @param postAt where each post stands (posts removed since are left out)
 */
export function incidentShapes(
  toGrid: (p: LatLon) => GridPoint,
  details: readonly IncidentDetail[],
  postAt: ReadonlyMap<string, LatLon>,
): IncidentShape[] {
  return details.map(({ incident, reports }) => {
    const fix = incident.fix;
    const latest = new Map<string, IncidentDetail['reports'][number]>();
    for (const r of reports) latest.set(r.postId, r);
    const flagged = new Set(fix?.lines.filter((l) => l.flagged).map((l) => l.seq) ?? []);
    const bearings: BearingShape[] = [];
    for (const r of latest.values()) {
      const from = postAt.get(r.postId);
      if (!from) continue;
      let lengthM = fix ? Math.max(1000, geodesicInverse(from, fix).distanceM * PAST_FIX) : LONE_BEARING_M;
      // A one-post fix from a vertical angle: the line reaches past the far end of its range interval.
      if (fix?.range) lengthM = Math.max(lengthM, (fix.range.maxM ?? fix.range.distanceM * 1.5) * 1.05);
      const az = r.trueBearingDeg * toRad;
      const points: GridPoint[] = [];
      for (let i = 0; i <= STEPS; i++) {
        const s = (lengthM * i) / STEPS;
        points.push(toGrid(offsetPoint(from, s * Math.sin(az), s * Math.cos(az))));
      }
      bearings.push({ seq: r.seq, postName: r.postName, flagged: flagged.has(r.seq), points });
    }
    return {
      incidentId: incident.id,
      title: incident.title,
      bearings,
      fix: fix ? toGrid(fix) : null,
      errorRing: fix ? (fix.errorArea.coordinates[0] ?? []).map(([lonDeg, latDeg]) => toGrid({ latDeg, lonDeg })) : null,
    };
  });
}
