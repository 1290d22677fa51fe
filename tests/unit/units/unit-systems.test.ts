import {
  convertLength,
  convertedText,
  lengthText,
  METRES_PER_LENGTH_UNIT,
  restateLengths,
  retypeLength,
  typedToMetres,
  UNIT_SYSTEM_IDS,
  UNIT_SYSTEMS,
  unitSystemFor,
  unitSystemOr,
  type LengthUnit,
} from '@/shared/units';

// Source: NIST Special Publication 811 (2008), Appendix B.8 "Factors for units listed alphabetically":
// foot (international) = 3.048 E−01 m exactly; mile (international) = 1.609 344 E+03 m exactly;
// nautical mile = 1.852 E+03 m exactly. BIPM SI Brochure (9th ed., 2019), Table 8: nautical mile = 1852 m.
describe('the length factors Kenning converts with', () => {
  it.each([
    ['ft', 0.3048],
    ['mi', 1609.344],
    ['nmi', 1852],
    ['km', 1000],
  ] as const)('1 %s is %p m exactly', (unit, metres) => {
    // Source: NIST SP 811 Appendix B.8 and the SI Brochure Table 8 (above); the factors are exact, compared exactly.
    expect(METRES_PER_LENGTH_UNIT[unit]).toBe(metres);
  });

  it('round-trips m ↔ ft for the heights people type', () => {
    for (const m of [0, 0.3048, 1.6, 1.75, 12.5, 300, 8848.86]) {
      // Source: NIST SP 811 B.8, 1 ft = 0.3048 m exactly; a round trip returns the value (relative 1e-12).
      const back = convertLength(convertLength(m, 'm', 'ft'), 'ft', 'm');
      expect(Math.abs(back - m)).toBeLessThanOrEqual(Math.max(1e-15, m * 1e-12));
    }
    // Source: NIST SP 811 B.8: 1000 ft = 304.8 m exactly (tolerance 1e-9 m).
    expect(Math.abs(convertLength(1000, 'ft') - 304.8)).toBeLessThan(1e-9);
  });

  it('round-trips km ↔ nmi ↔ mi (and back to km) for the distances people type', () => {
    const chain: LengthUnit[] = ['km', 'nmi', 'mi', 'km'];
    for (const km of [0.01, 1, 18.52, 25, 1000]) {
      let value = km;
      for (let i = 1; i < chain.length; i++) value = convertLength(value, chain[i - 1]!, chain[i]!);
      // Source: NIST SP 811 B.8 / SI Brochure Table 8 exact factors; the chain returns the value (relative 1e-12).
      expect(Math.abs(value - km)).toBeLessThanOrEqual(km * 1e-12);
    }
    // Source: SI Brochure Table 8: 1 nautical mile = 1852 m, so 10 nmi = 18.52 km (tolerance 1e-12 km).
    expect(Math.abs(convertLength(10, 'nmi', 'km') - 18.52)).toBeLessThan(1e-12);
    // Source: NIST SP 811 B.8: 1 mi = 1.609344 km, 1 nmi = 1.852 km → 1 nmi = 1.150779… mi (tolerance 1e-12).
    expect(Math.abs(convertLength(1, 'nmi', 'mi') - 1852 / 1609.344)).toBeLessThan(1e-12);
  });
});

describe('unit systems: the one list', () => {
  it('has a height and a distance unit for every system id', () => {
    // Source: issue 11 — heights in m or ft; distances in km, nmi or statute mi (product contract).
    expect(UNIT_SYSTEM_IDS.map((u) => [UNIT_SYSTEMS[u].height, UNIT_SYSTEMS[u].distance])).toEqual([
      ['m', 'km'],
      ['ft', 'nmi'],
      ['ft', 'mi'],
    ]);
  });

  it('takes the person’s choice first, then the site’s default, then metric', () => {
    // Source: issue 11 — the site's defaultUnits applies when the user has not chosen (product contract).
    expect(unitSystemFor('imperial', 'nautical')).toBe('imperial');
    expect(unitSystemFor(null, 'nautical')).toBe('nautical');
    expect(unitSystemFor(undefined, undefined)).toBe('metric');
    expect(unitSystemOr('cubits')).toBe('metric');
    expect(unitSystemOr('nautical')).toBe('nautical');
  });
});

describe('typed lengths', () => {
  it('rounds a converted value to the precision typed, never below three significant digits', () => {
    // Source: 300 m / 0.3048 = 984.2519… ft (NIST SP 811 B.8); shown as "984", not "984.252" (common practice, no source).
    expect(retypeLength('300', 'm', 'ft')).toBe('984');
    // Source: 1.75 m / 0.3048 = 5.7414… ft.
    expect(retypeLength('1.75', 'm', 'ft')).toBe('5.74');
    // Source: 25 km / 1.852 = 13.498… nmi.
    expect(retypeLength('25', 'km', 'nmi')).toBe('13.5');
    expect(retypeLength('not a number', 'm', 'ft')).toBe('not a number');
    expect(convertedText(convertLength(1234.5, 'm', 'ft'), '1234.5')).toBe('4050.2');
  });

  it('stores metres: typed feet become metres, empty is null, text stays for the schema', () => {
    // Source: NIST SP 811 B.8, 5 ft = 1.524 m exactly (tolerance 1e-12 m).
    expect(Math.abs((typedToMetres('5', 'ft') as number) - 1.524)).toBeLessThan(1e-12);
    expect(typedToMetres(' ', 'ft')).toBeNull();
    expect(typedToMetres('5x', 'ft')).toBe('5x');
    // Source: 1.6 m / 0.3048 = 5.249… ft; metres are shown exactly as stored.
    expect(lengthText(1.6, 'ft')).toBe('5.25');
    expect(lengthText(1.6, 'm')).toBe('1.6');
    expect(lengthText(null, 'm')).toBe('');
  });

  it('restates a schema message in metres in the unit the person typed in', () => {
    // Source: 10 m / 0.3048 = 32.8 ft; 9000 m = 29 527.6 ft → "29500" at three significant digits.
    expect(restateLengths('Eye height must be at most 10 m.', 'ft')).toBe('Eye height must be at most 32.8 ft.');
    expect(restateLengths('At most 9 000 m.', 'ft')).toBe('At most 29500 ft.');
    expect(restateLengths('Eye height must be a number of metres.', 'ft')).toBe('Eye height must be a number of feet.');
    // Source: 1000 km / 1.852 = 539.96 nmi.
    expect(restateLengths('At most 1 000 km.', 'nmi')).toBe('At most 540 nmi.');
    expect(restateLengths('At most 10 m.', 'm')).toBe('At most 10 m.');
  });
});
