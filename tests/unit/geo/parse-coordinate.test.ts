import proj4 from 'proj4';

import type { CoordinateErrorCode, CoordinatePart } from '@/shared/geo/coordinate-error';
import { parseCoordinate } from '@/shared/geo/parse-coordinate';

import { expectCoordinateError, expectWithin } from './expect-close';

// Invented example position (from the brief): 61.2345°N 149.8765°W. Its DDM and DMS forms follow from the
// definition of minutes and seconds: 0.2345° = 14.07′ = 14′04.2″, 0.8765° = 52.59′ = 52′35.4″ (common practice, no source).
const LAT = 61.2345;
const LON = -149.8765;
const ANGLE_TOL = 1e-12; // exact arithmetic apart from floating point

describe('parseCoordinate — latitude and longitude', () => {
  it.each([
    ['61.2345, -149.8765', 'dd'],
    ['61.2345 -149.8765', 'dd'],
    ['61.2345N 149.8765W', 'dd'],
    ['61.2345° N, 149.8765° W', 'dd'],
    ['N61.2345 W149.8765', 'dd'],
    ['149.8765W 61.2345N', 'dd'],
    ['+61.2345; -149.8765', 'dd'],
    ['61.2345 north 149.8765 west', 'dd'],
    ["61°14.07'N 149°52.59'W", 'ddm'],
    ['N61 14.070 W149 52.590', 'ddm'],
    ['61 14.07, -149 52.59', 'ddm'],
    ['61°14.07′N, 149°52.59′W', 'ddm'],
    ['61º14.07’N 149º52.59’W', 'ddm'],
    ['61°14.07 149°52.59 W', 'ddm'],
    [`61°14'04.2"N 149°52'35.4"W`, 'dms'],
    ['61°14′04.2″N 149°52′35.4″W', 'dms'],
    ["61°14'04.2''N 149°52'35.4''W", 'dms'],
    ['61 14 04.2 N 149 52 35.4 W', 'dms'],
    ['61 14 4.2 -149 52 35.4', 'dms'],
    ['N 61 14 04.2, W 149 52 35.4', 'dms'],
    ['  61.2345,\u00a0\u2212149.8765  ', 'dd'],
  ])('reads %j as %s', (text, format) => {
    // Source: invented example, values by definition (see top of file).
    const parsed = parseCoordinate(text);
    expect(parsed.format).toBe(format);
    expectWithin(parsed.latDeg, LAT, ANGLE_TOL);
    expectWithin(parsed.lonDeg, LON, ANGLE_TOL);
  });

  it.each(['33.3 44.4', 'E44.4 N33.3', "33d18'N 44d24'E", '44d24 33d18N'])(
    'reads the published equivalent %j as 33.3°N 44.4°E',
    (text) => {
      // Source: GeographicLib GeoConvert usage text: "the following are all equivalent: 33.3 44.4, E44.4 N33.3,
      // 33d18'N 44d24'E, 44d24 33d18N".
      const parsed = parseCoordinate(text);
      expectWithin(parsed.latDeg, 33.3, ANGLE_TOL);
      expectWithin(parsed.lonDeg, 44.4, ANGLE_TOL);
    },
  );

  it('reads southern and western, zero, pole and antimeridian values', () => {
    // Source: sign conventions, S and W negative (common practice, no source).
    expect(parseCoordinate('33.857S 151.215E')).toEqual({ latDeg: -33.857, lonDeg: 151.215, format: 'dd' });
    expect(parseCoordinate('-0 30, 0 0')).toEqual({ latDeg: -0.5, lonDeg: 0, format: 'ddm' });
    expect(parseCoordinate('90N 0E')).toEqual({ latDeg: 90, lonDeg: 0, format: 'dd' });
    expect(parseCoordinate('-90, 180')).toEqual({ latDeg: -90, lonDeg: 180, format: 'dd' });
    expect(parseCoordinate('0 0 0 S 180 0 0 W')).toEqual({ latDeg: -0, lonDeg: -180, format: 'dms' });
    expect(parseCoordinate('89°59\'59.9"N 179°59\'59.9"E').latDeg).toBeLessThan(90);
  });

  it('accepts a format it was asked for and refuses another', () => {
    // Source: none — parseCoordinate contract.
    expect(parseCoordinate('61.2345, -149.8765', 'dd').format).toBe('dd');
    expect(parseCoordinate("61°14.07'N 149°52.59'W", 'ddm').format).toBe('ddm');
    const error = expectCoordinateError(() => parseCoordinate("61°14.07'N 149°52.59'W", 'dms'), 'format-mismatch', 'text');
    expect(error.message).toBe(
      "Expected degrees, minutes and seconds (DMS), but “61°14.07'N 149°52.59'W” is written in degrees and decimal minutes (DDM).",
    );
    expectCoordinateError(() => parseCoordinate('33N 500000 6800000', 'dd'), 'cannot-split');
    expectCoordinateError(() => parseCoordinate('61.2345, -149.8765', 'utm'), 'not-utm', 'text');
    expectCoordinateError(() => parseCoordinate('61, 0', 'georef' as never), 'unknown-format', 'options');
  });
});

describe('parseCoordinate — UTM', () => {
  const UTM_TOL_DEG = 1e-9;

  it.each([
    '38N 444140.54 3684706.36',
    '444140.54 3684706.36 38N',
    '38S 444140.54 3684706.36',
    '38 north 444140.54 3684706.36',
    'UTM 38N 444140.54mE 3684706.36mN',
    '38S 444140.54E 3684706.36N',
    '3684706.36N 444140.54E 38S',
    '38N, 444,140.54, 3,684,706.36',
    'zone 38 n 444140.54 3684706.36',
  ])('reads %j as 33.3°N 44.4°E', (text) => {
    // Source: GeographicLib GeoConvert usage text: "38N 444140.54 3684706.36" and "444140.54 3684706.36 38N" are 33.3 44.4,
    // and its MGRS form 38SMB… puts it in band S. Tolerance: the published centimetres, 0.005 m, is 4.5e-8° of latitude
    // and 5.4e-8° of longitude at 33.3°N.
    const parsed = parseCoordinate(text);
    expect(parsed.format).toBe('utm');
    expectWithin(parsed.latDeg, 33.3, 5e-8);
    expectWithin(parsed.lonDeg, 44.4, 6e-8);
  });

  it('reads hemisphere and band forms of a southern position alike', () => {
    // Source: geodesy (npm) test suite: 33.857°S 151.215°E = "56 S 334873.199 6252266.092" = MGRS "56H LH …" (band H).
    for (const text of ['56S 334873.199 6252266.092', '56H 334873.199 6252266.092', '56 south 334873.199 6252266.092']) {
      const parsed = parseCoordinate(text);
      expectWithin(parsed.latDeg, -33.857, 1e-8);
      expectWithin(parsed.lonDeg, 151.215, 1e-8);
    }
  });

  it('reads the examples of the brief in zone 33 (15°E central meridian)', () => {
    // Source: central meridian 6·33 − 183 = 15°E at easting 500 000 m (Lantmäteriet UTM page); latitude cross-checked
    // with proj4's EPSG:32633 inverse.
    for (const text of ['33N 500000 6800000', '33V 500000E 6800000N']) {
      const parsed = parseCoordinate(text);
      expectWithin(parsed.lonDeg, 15, UTM_TOL_DEG);
      expectWithin(parsed.latDeg, 61.33408338515809, UTM_TOL_DEG);
    }
  });

  it('reads a bare S by the northing: band S when it lands in 32°N–40°N, the southern hemisphere otherwise', () => {
    // Source: band S = 32°N–40°N (band table, DMA TM 8358.1 ch. 3); the tie-break is Kenning's rule.
    expect(parseCoordinate('33S 500000 4000000').latDeg).toBeGreaterThan(32);
    expect(parseCoordinate('33S 500000 6000000').latDeg).toBeLessThan(-35);
    expect(parseCoordinate('33 south 500000 4000000').latDeg).toBeLessThan(-50);
    expect(parseCoordinate('33F 500000 4000000').latDeg).toBeLessThan(-50);
  });

  it('lets bands C and X reach into the 30′ polar overlap', () => {
    // Source: UTM overlaps UPS to 84.5°N and 80.5°S (apsalin.com UTM converter notes; DMA TM 8358.2 from memory);
    // northings from proj4 (EPSG:32633 / EPSG:32733).
    const north = Math.round(proj4('EPSG:4326', 'EPSG:32633', [15, 84.4])[1] as number);
    expectWithin(parseCoordinate(`33X 500000 ${north}`).latDeg, 84.4, 1e-5);
    const south = Math.round(proj4('EPSG:4326', 'EPSG:32733', [15, -80.4])[1] as number);
    expectWithin(parseCoordinate(`33C 500000 ${south}`).latDeg, -80.4, 1e-5);
  });

  it('forgives a position up to one minute of latitude outside its band, not more', () => {
    // Source: Kenning's band margin (1′). 0.5′ and 2′ north of 64°N, read with band V (56°N–64°N); the northings
    // of those latitudes on zone 33's central meridian come from proj4 (EPSG:32633), whole metres.
    const northing = (latDeg: number) => Math.round(proj4('EPSG:4326', 'EPSG:32633', [15, latDeg])[1] as number);
    expect(parseCoordinate(`33V 500000 ${northing(64 + 0.5 / 60)}`).latDeg).toBeGreaterThan(64);
    const error = expectCoordinateError(
      () => parseCoordinate(`33V 500000 ${northing(64 + 2 / 60)}`),
      'band-mismatch',
      'northing',
    );
    expect(error.message).toMatch(/^Band V covers 56°N to 64°N, but northing \d+ m in zone 33 is at 64\.03°N/);
  });
});

describe('parseCoordinate — messages a person understands', () => {
  it.each<[string, string, CoordinateErrorCode, CoordinatePart, RegExp]>([
    // Source: none — Kenning's error contract; each message names the part that is wrong and why.
    ['empty', '   ', 'empty', 'text', /^Enter a coordinate/],
    ['too long', '1'.repeat(200), 'too-long', 'text', /too long/],
    [
      'latitude beyond 90°',
      '91.5, 10',
      'latitude-out-of-range',
      'latitude',
      /^Latitude “91\.5” is 91\.5°, beyond 90°: latitudes run from 90°S to 90°N\./,
    ],
    ['longitude first', '-149.8765, 61.2345', 'latitude-out-of-range', 'latitude', /Did you put the longitude first\?/],
    ['latitude beyond 90° in DMS', '90 00 01 N 10 0 0 E', 'latitude-out-of-range', 'latitude', /beyond 90°/],
    [
      'longitude beyond 180°',
      '10N 180.5E',
      'longitude-out-of-range',
      'longitude',
      /^Longitude “180\.5E” is 180\.5°, beyond 180°/,
    ],
    [
      'minutes 60',
      "61°60.0'N 149°52.59'W",
      'minutes-out-of-range',
      'text',
      /the minutes are 60\.0: minutes run from 0 to under 60/,
    ],
    [
      'seconds 75',
      '61 14 75 N 149 52 35 W',
      'seconds-out-of-range',
      'text',
      /In “61 14 75 N” the seconds are 75: seconds run from 0 to under 60/,
    ],
    [
      'decimal degrees with minutes',
      '61.5 30 N 149 10 W',
      'fraction-not-last',
      'text',
      /degrees \(61\.5\) have a decimal part but are followed by minutes/,
    ],
    ['sign and letter', '-61.5S 10E', 'sign-and-hemisphere', 'text', /both a minus sign and the letter S/],
    ['sign on minutes', '61 -14 N 149 52 W', 'misplaced-sign', 'text', /only the degrees may carry a sign/],
    ['two latitudes', '61.5N 49.8S', 'hemisphere-conflict', 'text', /are marked as latitudes \(N\/S\)/],
    ['three commas', '61,5, -149,8', 'too-many-separators', 'text', /a point for decimals/],
    ['odd count', '61 14.07 149.8765', 'cannot-split', 'text', /Can't tell where the latitude ends/],
    [
      'mixed formats',
      '61 14.07 N 149.8765 W',
      'mixed-formats',
      'text',
      /latitude “61 14\.07 N” is in degrees and decimal minutes \(DDM\) but the longitude “149\.8765 W” is in decimal degrees/,
    ],
    ['letters on both sides', 'N 61 149 W', 'hemisphere-placement', 'text', /either all before the numbers/],
    ['four parts', '61 14 04 2 N 149 52 35 4 W', 'too-many-parts', 'text', /at most three/],
    ['seconds mark first', '61" 14 N 149 W', 'mark-order', 'text', /begins with seconds/],
    ['unknown word', '61.5 N 149.8 O', 'unexpected-character', 'text', /“O” is not part of a latitude and longitude/],
    ['stray character', '61.5# 149.8', 'unexpected-character', 'text', /“#” \(character 5\)/],
    ['bad number', '61..5, 10', 'bad-number', 'text', /“61\.\.5” is not a number/],
    ['one number', '61.5', 'missing-number', 'text', /needs both a latitude and a longitude/],
    ['zone 61', '61N 500000 6800000', 'unknown-zone', 'zone', /^UTM zones run from 1 to 60; “61” is not one\./],
    ['zone 0', '0V 500000 6800000', 'unknown-zone', 'zone', /“0” is not one/],
    [
      'no zone letter',
      '33 500000 6800000',
      'missing-zone-letter',
      'zone',
      /has no hemisphere: write the zone with N or S \(33N\)/,
    ],
    ['band I', '33I 500000 6800000', 'unknown-zone-letter', 'zone', /no latitude band I/],
    ['polar zone', '33Z 500000 6800000', 'polar-zone', 'zone', /polar \(UPS\)/],
    ['unused 34X', '34X 500000 8500000', 'unused-zone', 'zone', /Grid zone 34X is not used/],
    [
      'band Q at 61°N',
      '33Q 500000 6800000',
      'band-mismatch',
      'northing',
      /Band Q covers 16°N to 24°N, but northing 6800000 m in zone 33 is at 61\.33°N/,
    ],
    ['southern band with a northern northing', '33C 500000 5000000', 'band-mismatch', 'northing', /Band C covers 80°S to 72°S/],
    ['easting 7 digits', '33N 5000000 6800000', 'easting-out-of-range', 'easting', /Easting 5000000 m is not a UTM easting/],
    ['northing past 10 000 km', '33N 500000 12000000', 'northing-out-of-range', 'northing', /not a UTM northing/],
    ['north of 84°N', '33X 500000 9400000', 'outside-utm-area', 'latitude', /outside UTM, which covers 80°S to 84°N/],
    ['both numbers eastings', '33N 500000E 6800000E', 'not-utm', 'text', /Both numbers .* are marked as eastings/],
  ])('%s: %j', (_what, text, code, part, message) => {
    const error = expectCoordinateError(() => parseCoordinate(text), code, part);
    expect(error.message).toMatch(message);
  });

  it('refuses text that is not a string', () => {
    // Source: none — contract for untyped callers.
    expectCoordinateError(() => parseCoordinate(42 as never), 'empty', 'text');
  });

  it('leaves its input alone', () => {
    // Source: none — strings are immutable; checks the returned object is fresh each time.
    const text = '61.2345, -149.8765';
    const first = parseCoordinate(text);
    const second = parseCoordinate(text);
    expect(text).toBe('61.2345, -149.8765');
    expect(first).not.toBe(second);
    expect(first).toEqual(second);
  });
});
