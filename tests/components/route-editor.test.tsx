import { fireEvent, render, screen, within } from '@testing-library/react';
import { useForm } from 'react-hook-form';
import { PatrolFields, readRouteText, routeText } from '@/components/sites/patrol-fields';
import { RouteDrawMap } from '@/components/sites/route-draw-map';
import type { RingDrawContext } from '@/components/sites/ring-draw-map';

jest.mock('expo-router', () => ({ useRouter: () => ({ navigate: jest.fn(), replace: jest.fn() }) }));

/** Where the next taps on the (stand-in) map land, WGS84. */
const mockTaps: { latDeg: number; lonDeg: number }[] = [];
// jsdom has no matchMedia for reanimated's gestures: the map is a button that taps at the next place in `mockTaps`,
// through the drawing frame's own projection (what a real tap on the map hands on).
jest.mock('@/components/map/map-viewport', () => {
  const { createElement } = jest.requireActual<typeof import('react')>('react');
  return {
    MapViewport: (props: {
      label: string;
      frame: { projection: { toGrid: (p: { latDeg: number; lonDeg: number }) => { x: number; y: number } } };
      onTap: (p: { x: number; y: number }) => void;
    }) =>
      createElement('button', {
        'aria-label': props.label,
        onClick: () => props.onTap(props.frame.projection.toGrid(mockTaps.shift()!)),
      }),
  };
});

const NO_SITE: RingDrawContext = { site: null, posts: [], terrain: null, boundary: null, zones: [] };

/** The post form's patrol part alone: its three text fields in a form of their own. */
function Harness({ onRoute }: { onRoute?: (text: string) => void }) {
  const { control, watch, setValue } = useForm({ defaultValues: { route: '', speedMps: '', cycleMinutes: '' } });
  return (
    <PatrolFields
      control={control}
      units="nautical"
      routeValue={watch('route')}
      speedValue={watch('speedMps')}
      cycleValue={watch('cycleMinutes')}
      onRoute={(text) => {
        onRoute?.(text);
        setValue('route', text);
      }}
      drawContext={NO_SITE}
      near={{ latDeg: 0, lonDeg: 0 }}
    />
  );
}

const input = (label: string) => screen.getByLabelText(label) as HTMLInputElement;

// Source: WGS 84 semi-major axis a = 6 378 137 m (NIMA TR8350.2): along the equator the geodesic is the arc a·Δλ, so
// 0.1° of longitude = 11 131.949 m = 6.011 nmi (1 nmi = 1852 m, International Hydrographic Conference, 1929).
// Out and back at 12 kn (6.1733 m/s): 22 263.9 m take 3606 s ≈ 60 min.
describe('waypoints typed on the post form', () => {
  it('lists each leg in nautical miles and the time one run takes at the speed in knots', () => {
    render(<Harness />);
    fireEvent.change(input('Waypoints, one a line'), { target: { value: '0, 0\n0, 0.1\n\n0, 0' } });
    fireEvent.change(input('Speed'), { target: { value: '12' } });
    fireEvent.change(input('Cycle (time on station)'), { target: { value: '120' } });
    const legs = screen.getByLabelText('Legs of the route');
    expect(within(legs).getByText('Leg 1: waypoint 1 → 2, 6.01 nmi')).toBeTruthy();
    expect(within(legs).getByText('Leg 2: waypoint 2 → 3, 6.01 nmi')).toBeTruthy();
    expect(
      within(legs).getByText('Route 12.02 nmi · one run takes 60 min at this speed · held 60 min at the last waypoint'),
    ).toBeTruthy();
    expect(screen.getByText('12 kn = 6.17 m/s (stored)')).toBeTruthy();
  });

  it('says when one run takes longer than the cycle', () => {
    render(<Harness />);
    fireEvent.change(input('Waypoints, one a line'), { target: { value: '0, 0\n0, 0.1\n0, 0' } });
    fireEvent.change(input('Speed'), { target: { value: '12' } });
    fireEvent.change(input('Cycle (time on station)'), { target: { value: '45' } });
    expect(screen.getByText(/one run takes 60 min at this speed · longer than the cycle$/)).toBeTruthy();
  });

  it('names the line that is not a position, and reads UTM and degrees-minutes too', () => {
    render(<Harness />);
    fireEvent.change(input('Waypoints, one a line'), { target: { value: '0, 0\nsomewhere offshore' } });
    expect(screen.getByRole('alert').textContent).toMatch(/^Line 2: /);
    expect(screen.queryByLabelText('Legs of the route')).toBeNull();
    // Source: UTM zone 31N's central meridian is 3° E with false easting 500 000 m (common practice, no source):
    // 31N 500000 0 is 0° N, 3° E.
    const read = readRouteText('0°30.000′N 3°00.000′E\n31N 500000 0');
    expect(Array.isArray(read)).toBe(true);
    const [a, b] = read as { latDeg: number; lonDeg: number }[];
    expect(a!.latDeg).toBeCloseTo(0.5, 9);
    expect(a!.lonDeg).toBeCloseTo(3, 9);
    expect(b!.latDeg).toBeCloseTo(0, 6);
    expect(b!.lonDeg).toBeCloseTo(3, 6);
    expect(readRouteText(' \n ')).toBeNull();
    expect(routeText([{ latDeg: 0.5, lonDeg: 3 }])).toMatch(/^0\.5\d*, 3\.0*$/);
  });
});

describe('the route drawn on the map', () => {
  it('closes a typed route back to its start, undoes it, and hands the waypoints back', () => {
    const done = jest.fn();
    const route = [
      { latDeg: 0, lonDeg: 0 },
      { latDeg: 0, lonDeg: 0.1 },
      { latDeg: 0.05, lonDeg: 0.05 },
    ];
    // The post form opens the map at the route's first waypoint.
    render(<RouteDrawMap route={route} context={NO_SITE} near={route[0]!} onDone={done} onCancel={jest.fn()} />);
    expect(screen.getByText(/^3 waypoints, 2 legs\. /)).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'Back to the start' }));
    expect(screen.getByText(/^4 waypoints, 3 legs, back at the start\. /)).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'Undo' }));
    expect(screen.getByText(/^3 waypoints, 2 legs\. /)).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'Back to the start' }));
    fireEvent.click(screen.getByRole('button', { name: 'Use this route' }));
    const drawn = done.mock.calls[0]![0] as { latDeg: number; lonDeg: number }[];
    expect(drawn).toHaveLength(4);
    // Through the map's grid and back (UTM), each waypoint within 1e-6° of where it was.
    [...route, route[0]!].forEach((p, i) => {
      expect(Math.abs(drawn[i]!.latDeg - p.latDeg)).toBeLessThan(1e-6);
      expect(Math.abs(drawn[i]!.lonDeg - p.lonDeg)).toBeLessThan(1e-6);
    });
  });

  it('adds a waypoint where the map is tapped', () => {
    const done = jest.fn();
    render(<RouteDrawMap route={null} context={NO_SITE} near={{ latDeg: 0, lonDeg: 0 }} onDone={done} onCancel={jest.fn()} />);
    expect(screen.getByText(/^Tap the map where the patrol starts\./)).toBeTruthy();
    mockTaps.push({ latDeg: 0, lonDeg: 0.01 }, { latDeg: 0.01, lonDeg: 0.01 });
    const map = screen.getByRole('button', { name: /^Route map: tap to add a waypoint/ });
    fireEvent.click(map);
    expect(screen.getByText('Tap the next waypoint.')).toBeTruthy();
    fireEvent.click(map);
    expect(screen.getByText(/^2 waypoints, 1 leg\. /)).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'Use this route' }));
    const drawn = done.mock.calls[0]![0] as { latDeg: number; lonDeg: number }[];
    expect(drawn[1]!.latDeg).toBeCloseTo(0.01, 6);
    expect(drawn[1]!.lonDeg).toBeCloseTo(0.01, 6);
  });

  it('starts over with nothing to use', () => {
    render(
      <RouteDrawMap
        route={[
          { latDeg: 0, lonDeg: 0 },
          { latDeg: 0, lonDeg: 0.1 },
        ]}
        context={NO_SITE}
        near={{ latDeg: 0, lonDeg: 0 }}
        onDone={jest.fn()}
        onCancel={jest.fn()}
      />,
    );
    fireEvent.click(screen.getByRole('button', { name: 'Start over' }));
    expect(screen.getByText(/^Tap the map where the patrol starts\./)).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Use this route' }).getAttribute('aria-disabled')).toBe('true');
  });
});
