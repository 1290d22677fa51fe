import { render } from '@testing-library/react';
import { frameShore, gapLabelPlaces, pointAtChainage, shoreTicks, ShoreOverlay, stretchOf } from '@/components/map/shore-overlay';
import { siteMapFrame } from '@/components/map/site-map-frame';
import { testSite } from '@/tests/support/plan-fixtures';

// An invented shore along the equator, 0° to 0.1° east, inside a small boundary.
const site = testSite({
  boundary: [
    [-0.01, -0.05],
    [0.11, -0.05],
    [0.11, 0.05],
    [-0.01, 0.05],
    [-0.01, -0.05],
  ],
  shoreline: [
    [0, 0],
    [0.05, 0],
    [0.1, 0],
  ],
});
const frame = siteMapFrame(site, [], null)!;
// Source: WGS 84 semi-major axis a = 6 378 137 m (NIMA TR8350.2); along the equator the geodesic is the arc a·Δλ,
// 0.1° → 11 131.949 m.
const EQUATOR_0_1_DEG = (6_378_137 * 0.1 * Math.PI) / 180;

describe('the shoreline on the map', () => {
  it('measures chainage as the geodesic along the corners', () => {
    const shore = frameShore(frame, site.shoreline)!;
    expect(shore.lengthM).toBeCloseTo(EQUATOR_0_1_DEG, 3);
    expect(shore.chainage[1]).toBeCloseTo(EQUATOR_0_1_DEG / 2, 3);
  });

  it('puts ticks at a round step of the unit, at most 8 after the start', () => {
    const shore = frameShore(frame, site.shoreline)!;
    // 11.13 km: 1 km would give 11 ticks, so 2 km (0, 2, … 10).
    expect(shoreTicks(shore, 'km').map((t) => t.label)).toEqual(['0 km', '2 km', '4 km', '6 km', '8 km', '10 km']);
    // Source: 1 nmi = 1852 m (International Hydrographic Conference, 1929): 11.13 km = 6.01 nmi, ticks every nautical mile.
    expect(shoreTicks(shore, 'nmi').map((t) => t.label)).toEqual(['0 nmi', '1 nmi', '2 nmi', '3 nmi', '4 nmi', '5 nmi', '6 nmi']);
    // A tick stands square to an east-running shore: its normal points north or south.
    const tick = shoreTicks(shore, 'km')[1]!;
    expect(Math.abs(tick.nx)).toBeLessThan(0.05);
    expect(Math.abs(tick.ny)).toBeGreaterThan(0.99);
  });

  it('places a gap between its chainages, through the corners inside it', () => {
    const shore = frameShore(frame, site.shoreline)!;
    const start = shore.points[0]!;
    const end = shore.points[2]!;
    const quarter = pointAtChainage(shore, EQUATOR_0_1_DEG / 4);
    expect(quarter.x).toBeCloseTo(start.x + (shore.points[1]!.x - start.x) / 2, 0);
    const gap = stretchOf(shore, 1000, 9000);
    expect(gap).toHaveLength(3); // from, the middle corner, to
    expect(Math.hypot(gap[2]!.x - gap[0]!.x, gap[2]!.y - gap[0]!.y)).toBeGreaterThan(7900);
    expect(pointAtChainage(shore, 1e9)).toEqual(end);
  });

  it('draws nothing for a site without a shoreline, and the line, ticks and gap labels for one with', () => {
    const { west, east, south, north } = frame.initial;
    const camera = { centerX: (west + east) / 2, centerY: (south + north) / 2, pxPerM: 0.05 };
    const view = { camera, size: { width: 600, height: 400 }, margin: 0 };
    const none = render(<ShoreOverlay frame={frame} shoreline={null} unit="km" {...view} />);
    expect(none.container.querySelector('svg')).toBeNull();
    none.unmount();
    const drawn = render(
      <ShoreOverlay
        frame={frame}
        shoreline={site.shoreline}
        unit="km"
        gaps={[
          {
            band: 'Inshore',
            fromM: 1000,
            toM: 3000,
            lengthM: 2000,
            kind: 'unwatched',
            at: { latDeg: 0, lonDeg: 0.018 },
            closer: null,
          },
        ]}
        {...view}
      />,
    );
    const texts = [...drawn.container.querySelectorAll('text')].map((t) => t.textContent);
    expect(texts).toContain('Inshore: gap');
    expect(texts).toContain('10 km');
  });

  it('stacks the labels of two gaps at one place, and runs a label leftwards at the right edge', () => {
    const places = gapLabelPlaces(
      [
        { x: 100, y: 200 },
        { x: 102, y: 200 },
        { x: 580, y: 200 },
      ],
      600,
    );
    expect(places[0]).toEqual({ x: 108, y: 220, anchor: 'start' });
    expect(places[1]).toEqual({ x: 110, y: 235, anchor: 'start' });
    expect(places[2]).toEqual({ x: 572, y: 220, anchor: 'end' });
  });
});
