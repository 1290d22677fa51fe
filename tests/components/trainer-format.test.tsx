import type { Qualification } from '@/shared/schemas/course';
import { drillScoring } from '@/shared/trainer/score-drill-answer';
import { CALIBRATION_DEFAULTS, toCalibrationInput } from '@/components/trainer/calibration-form-model';
import { qualificationSummary, scoreBand, showAnswer, sideViewGeometry, sideViewRows } from '@/components/trainer/trainer-format';

const person = { id: '00000000-0000-4000-8000-000000000001', name: 'Sami Rookwood' };
const qual = (name: string, qualified: boolean, qualifiedUntil: string | null): Qualification => ({
  user: person,
  course: { id: `00000000-0000-4000-8000-00000000000${name.length}`, name, validityDays: 90 },
  due: !qualified,
  qualified,
  qualifiedUntil,
  lastPassedAt: null,
});

describe('qualificationSummary (the roster line)', () => {
  // common practice, no source: one course not passed makes the person not qualified; otherwise the earliest expiry counts.
  test('one course due names it', () => {
    const s = qualificationSummary([qual('A', true, '2027-03-01T00:00:00Z'), qual('Bb', false, null)], person.id);
    expect(s).toEqual({ text: 'not qualified: Bb', ok: false });
  });
  test('all passed: the earliest expiry', () => {
    const s = qualificationSummary(
      [qual('A', true, '2027-03-01T00:00:00Z'), qual('Bb', true, '2027-01-15T00:00:00Z')],
      person.id,
    );
    expect(s).toEqual({ text: 'qualified until 2027-01-15', ok: true });
  });
  test('nobody assigned: nothing', () => {
    expect(qualificationSummary([], person.id)).toBeNull();
  });
});

describe('scoreBand', () => {
  const scoring = drillScoring('km');
  // The bands as the API states them (README: full within ±5 %, half within ±15 %); common practice, no source.
  test.each([
    [1, 'full'],
    [0.5, 'partial'],
    [0, 'none'],
  ] as const)('score %s is %s credit', (score, band) => {
    expect(scoreBand(score, scoring).band).toBe(band);
  });
  test('the text names the stated band', () => {
    expect(scoreBand(0.5, scoring).text).toContain(`±${scoring.partialCreditWithinPct} %`);
  });
});

describe('sideViewRows', () => {
  test('lengths in the person’s units: heights in ft, distances in nmi (1 nmi = 1852 m exactly, by definition)', () => {
    const rows = sideViewRows(
      { eyeHeightM: 30.48, horizonDistanceM: 18_520, k: 0.13, visible: true },
      { height: 'ft', distance: 'nmi' },
    );
    expect(rows.map((r) => r.text)).toEqual(['100 ft', '10.0 nmi', '0.130', 'yes']);
  });
});

describe('sideViewGeometry', () => {
  test('the surface drops away from the eye and the horizon lies between the eye and the target', () => {
    const g = sideViewGeometry({
      eyeHeightM: 30,
      effectiveRadiusM: 7_323_000,
      horizonDistanceM: 20_900,
      distanceM: 30_000,
      targetHeightM: 40,
      hiddenHeightM: 8.7,
    })!;
    const ys = g.surface.split(' ').map((p) => Number(p.split(',')[1]));
    expect(ys[ys.length - 1]!).toBeGreaterThan(ys[0]!); // lower on screen further out
    expect(g.horizonX!).toBeGreaterThan(g.eye.x);
    expect(g.horizonX!).toBeLessThan(g.target!.x);
    // the hidden part is drawn from the base up, below the top
    expect(g.target!.hiddenTopY).toBeLessThan(g.target!.baseY);
    expect(g.target!.hiddenTopY).toBeGreaterThan(g.target!.topY);
  });
  test('nothing to draw without an eye height', () => {
    expect(sideViewGeometry({ k: 0.13 })).toBeNull();
  });
});

describe('toCalibrationInput', () => {
  test('a dip in feet is sent in metres (1 ft = 0.3048 m exactly, by definition)', () => {
    const out = toCalibrationInput(
      { ...CALIBRATION_DEFAULTS, eyeHeight: '100', observedDipArcmin: '9.5' },
      { height: 'ft', distance: 'nmi' },
      false,
    );
    expect('input' in out && out.input).toMatchObject({
      method: 'dip',
      eyeHeightM: 30.48,
      observedDipArcmin: 9.5,
      accuracyArcmin: 0.5,
    });
  });
  test('a missing or wrong number names its field and sends nothing', () => {
    const out = toCalibrationInput(
      { ...CALIBRATION_DEFAULTS, method: 'reciprocal', distance: 'abc' },
      { height: 'm', distance: 'km' },
      false,
    );
    expect(out).toEqual({ errors: { distance: 'Type a number.', zenithAngle1Deg: 'Required.', zenithAngle2Deg: 'Required.' } });
  });
  test('weather is all three readings or none; the lapse rate is typed per km and sent per m', () => {
    const partial = toCalibrationInput(
      { ...CALIBRATION_DEFAULTS, eyeHeight: '20', observedDipArcmin: '8', pressureHpa: '1013' },
      { height: 'm', distance: 'km' },
      false,
    );
    expect('errors' in partial && Object.keys(partial.errors).sort()).toEqual(['lapseRateKPerKm', 'temperatureC']);
    const full = toCalibrationInput(
      {
        ...CALIBRATION_DEFAULTS,
        eyeHeight: '20',
        observedDipArcmin: '8',
        pressureHpa: '1013',
        temperatureC: '15',
        lapseRateKPerKm: '6.5',
      },
      { height: 'm', distance: 'km' },
      false,
    );
    expect('input' in full && full.input.weather).toEqual({ pressureHpa: 1013, temperatureC: 15, lapseRateKPerM: 0.0065 });
  });
});

describe('showAnswer', () => {
  test('a correct value is rounded for reading, a choice is yes or no', () => {
    expect(showAnswer(17.78630829643269, 'km')).toBe('17.8 km');
    expect(showAnswer(4.2345, 'm')).toBe('4.23 m');
    expect(showAnswer(false, 'yes-no')).toBe('no');
  });
});
