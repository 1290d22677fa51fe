import { Geodesic } from 'geographiclib-geodesic';
import type { IncidentDetail } from '@/shared/schemas/incident';

const WGS84 = Geodesic.WGS84;

/** How far a bearing line is drawn when there is no fix to measure it by, metres. */
const LINE_WITHOUT_FIX_M = 20_000;
/** Spacing of the points along a drawn bearing line, metres (GeoJSON joins positions with straight lon/lat segments). */
const LINE_STEP_M = 500;

/** One CSV field, quoted when it holds a comma, a quote or a line break (RFC 4180 §2). */
function csvField(value: string | number | null): string {
  if (value === null) return '';
  const text = String(value);
  return /[",\r\n]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
}

const CSV_HEADER = [
  'seq',
  'recorded_at_utc',
  'entry',
  'by',
  'post',
  'observed_at_utc',
  'bearing_deg',
  'bearing_reference',
  'declination_deg_east',
  'declination_source',
  'true_bearing_deg',
  'bearing_sigma_deg',
  'vertical_angle_deg',
  'seen',
  'note',
  'fix_lat_deg',
  'fix_lon_deg',
  'error_area_m2',
  'cut_angle_deg',
  'fix_problem',
  'prev_hash',
  'hash',
];

/**
 * The incident's log as CSV (RFC 4180: CRLF line ends, a header row, fields
 * quoted as needed), one row per entry, units in the header names.
 */
export function incidentLogCsv(detail: IncidentDetail): string {
  const rows = detail.entries.map((e) => {
    const b = e.body as Record<string, unknown>;
    const fix = (e.kind === 'fix' ? b.fix : null) as Record<string, unknown> | null;
    const text = (v: unknown) => (typeof v === 'string' ? v : null);
    const num = (v: unknown) => (typeof v === 'number' ? v : null);
    return [
      e.seq,
      e.recordedAt,
      e.kind,
      e.actor.name,
      text(b.postName),
      text(b.observedAt),
      num(b.bearingDeg),
      text(b.bearingReference),
      num(b.declinationDeg),
      text(b.declinationSource),
      num(b.trueBearingDeg),
      num(b.bearingSigmaDeg),
      num(b.verticalAngleDeg),
      text(b.kind),
      text(b.note) ?? text(b.title),
      num(fix?.latDeg),
      num(fix?.lonDeg),
      num(fix?.errorAreaM2),
      num(fix?.cutAngleDeg),
      text(b.problem),
      e.prevHash,
      e.hash,
    ]
      .map(csvField)
      .join(',');
  });
  return [CSV_HEADER.join(','), ...rows].join('\r\n') + '\r\n';
}

const round6 = (x: number) => Math.round(x * 1e6) / 1e6;

/** Points along the geodesic from a post on a true bearing, [lon, lat] (RFC 7946 §3.1.1 order). */
function bearingLine(latDeg: number, lonDeg: number, azimuthDeg: number, lengthM: number): [number, number][] {
  const steps = Math.max(1, Math.ceil(lengthM / LINE_STEP_M));
  return Array.from({ length: steps + 1 }, (_, i) => {
    const p = WGS84.Direct(latDeg, lonDeg, azimuthDeg, (lengthM * i) / steps);
    return [round6(p.lon2!), round6(p.lat2!)];
  });
}

/**
 * The incident as an RFC 7946 FeatureCollection (WGS 84 lon/lat): each
 * report's bearing as a line from its post (to a little past the fix, or
 * 20 km), the fix as a point and its error area as a polygon.
 *
 * @param posts where each reporting post stands
 */
export function incidentGeoJson(detail: IncidentDetail, posts: Map<string, { latDeg: number; lonDeg: number }>) {
  const fix = detail.incident.fix;
  const features: object[] = [];
  for (const r of detail.reports) {
    const at = posts.get(r.postId);
    if (!at) continue;
    const toFix = fix?.lines.find((l) => l.seq === r.seq)?.distanceM;
    features.push({
      type: 'Feature',
      properties: {
        entry: 'bearing',
        seq: r.seq,
        post: r.postName,
        observedAt: r.observedAt,
        trueBearingDeg: r.trueBearingDeg,
        bearingSigmaDeg: r.bearingSigmaDeg,
        seen: r.kind,
        usedInFix: fix?.fromReports.includes(r.seq) ?? false,
      },
      geometry: {
        type: 'LineString',
        coordinates: bearingLine(at.latDeg, at.lonDeg, r.trueBearingDeg, toFix ? toFix * 1.25 : LINE_WITHOUT_FIX_M),
      },
    });
  }
  if (fix) {
    features.push({
      type: 'Feature',
      properties: { entry: 'fix', method: fix.method, computedAt: fix.computedAt, warnings: fix.warnings },
      geometry: { type: 'Point', coordinates: [round6(fix.lonDeg), round6(fix.latDeg)] },
    });
    features.push({
      type: 'Feature',
      properties: { entry: 'error-area', areaM2: fix.errorAreaM2, method: fix.errorAreaMethod },
      geometry: {
        type: 'Polygon',
        coordinates: fix.errorArea.coordinates.map((ring) => ring.map(([lon, lat]) => [round6(lon), round6(lat)])),
      },
    });
  }
  return {
    type: 'FeatureCollection',
    name: detail.incident.title,
    features,
  };
}
