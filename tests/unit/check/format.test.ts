import { convertLength } from '@/shared/units/length';
import { distanceIn, formatLength, metricDistance } from '@/components/check/format';

describe('distanceIn', () => {
  it('writes metric distances as the screens always have', () => {
    // Source: common practice, no source (metres below a kilometre, kilometres above, two decimals at most).
    expect(distanceIn(850, 'km')).toBe('850 m');
    expect(distanceIn(2400, 'km')).toBe('2.4 km');
    expect(distanceIn(2400, 'm')).toBe(metricDistance(2400));
    expect(distanceIn(690, 'km', (m) => `${m / 1000} km`)).toBe('0.69 km');
  });

  it('writes nautical and statute miles from their exact definitions', () => {
    // Source: NIST SP 811 Appendix B.8: 1 nautical mile = 1852 m exactly.
    expect(distanceIn(2778, 'nmi')).toBe('1.5 nmi');
    expect(distanceIn(18_520, 'nmi')).toBe('10 nmi');
    expect(distanceIn(1852 * 0.46, 'nmi')).toBe('0.46 nmi');
    // Source: NIST SP 811 Appendix B.8: 1 mile (international) = 1609.344 m exactly.
    expect(distanceIn(1609.344 * 12.34, 'mi')).toBe('12.3 mi');
    expect(distanceIn(1609.344 * 250, 'mi')).toBe('250 mi');
  });

  it('writes short distances in feet, never "0 nmi"', () => {
    // Source: NIST SP 811 Appendix B.8: 1 ft = 0.3048 m exactly; 76.2 m = 250 ft, 0.047 mi.
    expect(distanceIn(76.2, 'mi')).toBe('250 ft');
    // 50 m = 0.027 nmi = 164.04 ft.
    expect(distanceIn(50, 'nmi')).toBe('164 ft');
    // The thresholds: 0.05 nmi and 0.1 mi are written in their mile.
    expect(distanceIn(1852 * 0.05, 'nmi')).toBe('0.05 nmi');
    expect(distanceIn(1609.344 * 0.1, 'mi')).toBe('0.1 mi');
  });

  it('reads back within its rounding (round trip through the written figure)', () => {
    for (const metres of [120, 926, 1852, 5000, 37_040, 160_934.4]) {
      for (const unit of ['nmi', 'mi'] as const) {
        const [figure, shown] = distanceIn(metres, unit).split(' ') as [string, 'nmi' | 'mi' | 'ft'];
        const back = convertLength(Number(figure.replace(/,/g, '')), shown, 'm');
        // Tolerance: half a unit of the last digit written (two decimals below 10, one below 100, else whole units).
        const value = convertLength(metres, 'm', shown);
        const half = (Math.abs(value) >= 100 ? 0.5 : Math.abs(value) >= 10 ? 0.05 : 0.005) * convertLength(1, shown, 'm');
        expect(Math.abs(back - metres)).toBeLessThanOrEqual(half + 1e-9);
      }
    }
  });

  it('agrees with formatLength above the feet threshold', () => {
    expect(distanceIn(9260, 'nmi')).toBe(formatLength(9260, 'nmi'));
  });
});
