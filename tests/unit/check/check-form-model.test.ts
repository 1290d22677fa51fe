import {
  applyLibraryConditionSet,
  applyLibraryTarget,
  buildRequest,
  convertedText,
  DEFAULT_FORM,
  significantDigits,
  switchUnits,
  type CheckFormValues,
} from '@/components/check/check-form-model';

const label = (id: string) => `label:${id}`;

describe('buildRequest', () => {
  it('turns the default form into a request in metres, one condition per toggle', () => {
    const out = buildRequest(DEFAULT_FORM, label);
    if (!('request' in out)) throw new Error(JSON.stringify(out.errors));
    expect(out.request).toMatchObject({
      observerHeightM: 30,
      targetHeightM: 10,
      distanceM: 25000,
      visibilityM: 20000,
      targetSizeM: 3,
    });
    expect(out.request.conditions).toEqual(DEFAULT_FORM.presets.map((preset) => ({ preset })));
    expect(out.labels.map((l) => l.key)).toEqual(DEFAULT_FORM.presets);
  });

  it('converts feet and nautical miles at the edge', () => {
    const out = buildRequest({ ...DEFAULT_FORM, units: 'nautical', observerHeight: '100', distance: '10' }, label);
    if (!('request' in out)) throw new Error('expected a request');
    // Source: 1 ft = 0.3048 m, 1 nmi = 1852 m (international definitions).
    expect(out.request.observerHeightM).toBeCloseTo(30.48, 9);
    expect(out.request.distanceM).toBeCloseTo(18520, 6);
  });

  it('puts each error under its own field', () => {
    const form: CheckFormValues = { ...DEFAULT_FORM, observerHeight: '-1', distance: 'far', customK: 'x' };
    const out = buildRequest(form, label);
    expect('errors' in out && out.errors).toMatchObject({ distance: 'Enter a number.', customK: 'Enter a number.' });
    const neg = buildRequest({ ...DEFAULT_FORM, observerHeight: '-1' }, label);
    expect('errors' in neg && neg.errors.observerHeight).toMatch(/negative/);
    const none = buildRequest({ ...DEFAULT_FORM, presets: [] }, label);
    expect('errors' in none && none.errors.presets).toMatch(/at least one/);
    const k = buildRequest({ ...DEFAULT_FORM, customK: '42' }, label);
    expect('errors' in k && k.errors.customK).toMatch(/at most 10/);
  });

  it('does not mutate the form', () => {
    const form = structuredClone(DEFAULT_FORM);
    buildRequest(form, label);
    expect(form).toEqual(DEFAULT_FORM);
  });
});

describe('buildRequest: night, lights and sea', () => {
  it('sends the light and the background only at night, and the wave height in metres', () => {
    // Source: 1 ft = 0.3048 m exactly (international yard and pound agreement, 1959).
    const night: CheckFormValues = {
      ...DEFAULT_FORM,
      units: 'nautical',
      period: 'night',
      lightIntensity: '15000',
      backgroundLighting: 'some',
      waveHeight: '5',
    };
    const out = buildRequest(night, label);
    if (!('request' in out)) throw new Error(JSON.stringify(out.errors));
    expect(out.request).toMatchObject({ period: 'night', lightIntensityCd: 15000, backgroundLighting: 'some' });
    expect(out.request.significantWaveHeightM).toBeCloseTo(1.524, 9);
    const day = buildRequest({ ...night, period: 'day' }, label);
    if (!('request' in day)) throw new Error(JSON.stringify(day.errors));
    expect(day.request.lightIntensityCd).toBeUndefined();
    expect(day.request.backgroundLighting).toBeUndefined();
  });
  it('puts a bad sea state and a doubled sea under their own fields', () => {
    const bad = buildRequest({ ...DEFAULT_FORM, seaState: '12' }, label);
    expect('errors' in bad && bad.errors.seaState).toBeTruthy();
    const both = buildRequest({ ...DEFAULT_FORM, seaState: '3', waveHeight: '1' }, label);
    expect('errors' in both && both.errors.waveHeight).toMatch(/not both/);
    const text = buildRequest({ ...DEFAULT_FORM, period: 'night', lightIntensity: 'bright' }, label);
    expect('errors' in text && text.errors.lightIntensity).toBe('Enter a number.');
  });
});

describe('switchUnits', () => {
  it('keeps the question the same when the units change', () => {
    const ft = switchUnits(DEFAULT_FORM, 'imperial');
    // Source: 30 m = 98.4252 ft; 25 km = 15.5343 statute miles (international definitions).
    // Shown to three significant digits: 98.4 ft, 15.5 mi.
    expect(Number(ft.observerHeight)).toBeCloseTo(98.4252, 1);
    expect(Number(ft.distance)).toBeCloseTo(15.5343, 1);
    const back = switchUnits(ft, 'metric');
    // Switching back gives the typed text back exactly.
    expect(back.observerHeight).toBe('30');
    expect(back.distance).toBe('25');
  });

  it('rounds converted values to the precision typed, at least three significant digits (no "984.252 ft")', () => {
    // Source: 1 ft = 0.3048 m exactly, 1 nmi = 1852 m exactly (international definitions).
    const ft = switchUnits({ ...DEFAULT_FORM, observerHeight: '300', targetHeight: '1.75', distance: '1234.5' }, 'nautical');
    expect(ft.observerHeight).toBe('984'); // 984.252 ft
    expect(ft.targetHeight).toBe('5.74'); // 5.7415 ft
    expect(ft.distance).toBe('666.58'); // 1234.5 km = 666.577 nmi, five digits as typed
  });

  it('converts again from an edited field instead of restoring the old text', () => {
    const ft = switchUnits(DEFAULT_FORM, 'imperial');
    const back = switchUnits({ ...ft, observerHeight: '100' }, 'metric');
    expect(back.observerHeight).toBe('30.5'); // 100 ft = 30.48 m
    expect(back.targetHeight).toBe('10');
  });

  it('counts significant digits as typed', () => {
    expect(significantDigits('300')).toBe(1);
    expect(significantDigits('300.0')).toBe(4);
    expect(significantDigits('0.050')).toBe(2);
    expect(significantDigits('-12.5')).toBe(3);
    expect(convertedText(984.2519685, '300')).toBe('984');
  });
});

describe('library picks', () => {
  it('fills the target from a library entry in the form’s units, rounded sensibly', () => {
    // Source: 1 ft = 0.3048 m exactly; 30 m = 98.4 ft, 8 m = 26.2 ft (three significant digits).
    const ft = applyLibraryTarget(switchUnits(DEFAULT_FORM, 'nautical'), { heightM: 30, widthM: 8, requiredVisibleM: 0 });
    expect([ft.targetHeight, ft.targetSize, ft.requiredVisible]).toEqual(['98.4', '26.2', '0']);
    const m = applyLibraryTarget(DEFAULT_FORM, { heightM: 1.2, widthM: 0.5, requiredVisibleM: 0.3 });
    expect([m.targetHeight, m.targetSize, m.requiredVisible]).toEqual(['1.2', '0.5', '0.3']);
    expect(buildRequest(m, label)).toHaveProperty('request');
  });

  it('takes a condition set’s presets, first k, first lapse rate and visibility, and counts what it leaves out', () => {
    const { form, left } = applyLibraryConditionSet(DEFAULT_FORM, {
      conditions: [
        { preset: 'standard-optical' },
        { k: 0.25 },
        { k: -0.5 },
        { pressureHpa: 1013, temperatureC: 20, lapseRateKPerM: 0.01 },
        { airTemperatureC: 20, surfaceTemperatureC: 12, airHeightM: 10, surfaceHeightM: 0 },
      ],
      visibilityM: 18_520,
      visibilityKind: 'meteorological-range-2pct',
    });
    expect(form.presets).toEqual(['standard-optical']);
    expect(form.customK).toBe('0.25');
    expect(form.weather).toEqual({ enabled: true, pressureHpa: '1013', temperatureC: '20', lapseRateKPerM: '0.01' });
    expect(form.visibility).toBe('18.52'); // km, as precise as the stored 18 520 m
    expect(form.visibilityKind).toBe('meteorological-range-2pct');
    expect(left).toBe(2);
    const none = applyLibraryConditionSet(DEFAULT_FORM, {
      conditions: [{ preset: 'no-refraction' }],
      visibilityM: null,
      visibilityKind: 'mor-5pct',
    });
    expect(none.form.visibility).toBe('');
    expect(none.form.weather.enabled).toBe(false);
  });
});
