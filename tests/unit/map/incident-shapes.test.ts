import { Geodesic } from 'geographiclib-geodesic';
import { incidentShapes, LONE_BEARING_M } from '@/components/map/incident-shapes';
import type { IncidentDetail } from '@/shared/schemas/incident';

const WGS84 = Geodesic.WGS84;
const toGrid = (p: { latDeg: number; lonDeg: number }) => ({ x: p.lonDeg, y: p.latDeg });
const post = { latDeg: 51.8, lonDeg: 15.2 };

function detail(fix: IncidentDetail['incident']['fix'], trueBearingDeg: number): IncidentDetail {
  const report = {
    id: '2',
    seq: 2,
    postId: '00000000-0000-4000-8000-000000000001',
    postName: 'Test Tower',
    observedAt: '2026-01-01T00:00:00Z',
    bearingDeg: trueBearingDeg,
    bearingReference: 'true' as const,
    declinationDeg: 0,
    declinationSource: 'none' as const,
    trueBearingDeg,
    bearingSigmaDeg: 1,
    verticalAngleDeg: null,
    kind: 'smoke' as const,
    note: '',
    idempotencyKey: 'key-00000001',
    reportedBy: { id: '00000000-0000-4000-8000-000000000002', name: 'Someone' },
    recordedAt: '2026-01-01T00:00:00Z',
  };
  return {
    incident: {
      id: '00000000-0000-4000-8000-000000000003',
      siteId: '00000000-0000-4000-8000-000000000004',
      siteName: 'Test site',
      title: 'Test smoke',
      status: 'open',
      openedBy: report.reportedBy,
      openedAt: report.recordedAt,
      closedAt: null,
      entryCount: 2,
      reportCount: 1,
      fix,
      version: 2,
      updatedAt: report.recordedAt,
    },
    reports: [report],
    entries: [],
    chain: { intact: true, entries: 2, firstBrokenSeq: null, headHash: null, message: '' },
    fixProblem: null,
  };
}

describe('incidentShapes (what the site map draws of an incident)', () => {
  it('draws a lone bearing as the geodesic from the post on the reported true bearing', () => {
    // Source: Karney (2013), the direct geodesic problem through geographiclib-geodesic.
    const [shape] = incidentShapes(toGrid, [detail(null, 90)], new Map([['00000000-0000-4000-8000-000000000001', post]]));
    const line = shape!.bearings[0]!.points;
    expect(line[0]).toEqual({ x: post.lonDeg, y: post.latDeg });
    const end = line.at(-1)!;
    const r = WGS84.Inverse(post.latDeg, post.lonDeg, end.y, end.x);
    expect(r.s12!).toBeCloseTo(LONE_BEARING_M, 3);
    expect(r.azi1!).toBeCloseTo(90, 9);
    expect(shape!.fix).toBeNull();
    expect(shape!.errorRing).toBeNull();
  });

  it('runs a bearing past the fix, marks the flagged one and maps the error ring', () => {
    // Common practice, no source: a drawn bearing reaches beyond the fix so the crossing shows.
    const d = WGS84.Direct(post.latDeg, post.lonDeg, 45, 8000);
    const fixAt = { latDeg: d.lat2!, lonDeg: d.lon2! };
    const ring: [number, number][] = [
      [fixAt.lonDeg - 0.01, fixAt.latDeg - 0.01],
      [fixAt.lonDeg + 0.01, fixAt.latDeg - 0.01],
      [fixAt.lonDeg + 0.01, fixAt.latDeg + 0.01],
      [fixAt.lonDeg - 0.01, fixAt.latDeg - 0.01],
    ];
    const fix = {
      ...fixAt,
      errorArea: { type: 'Polygon' as const, coordinates: [ring] },
      errorAreaM2: 1e6,
      errorAreaMethod: 'test',
      method: 'least-squares' as const,
      warnings: [],
      fromReports: [2],
      lines: [
        {
          seq: 2,
          postId: '00000000-0000-4000-8000-000000000001',
          postName: 'Test Tower',
          distanceM: 8000,
          residualDeg: 3,
          flagged: true,
        },
      ],
      computedAt: '2026-01-01T00:00:00Z',
    };
    const [shape] = incidentShapes(toGrid, [detail(fix, 45)], new Map([['00000000-0000-4000-8000-000000000001', post]]));
    const end = shape!.bearings[0]!.points.at(-1)!;
    expect(WGS84.Inverse(post.latDeg, post.lonDeg, end.y, end.x).s12!).toBeCloseTo(8000 * 1.25, 3);
    expect(shape!.bearings[0]!.flagged).toBe(true);
    expect(shape!.fix).toEqual({ x: fixAt.lonDeg, y: fixAt.latDeg });
    expect(shape!.errorRing).toEqual(ring.map(([x, y]) => ({ x, y })));
  });

  it('leaves out bearings from posts that are gone', () => {
    // Common practice, no source: a removed post has no place to draw from.
    const [shape] = incidentShapes(toGrid, [detail(null, 90)], new Map());
    expect(shape!.bearings).toEqual([]);
  });
});
