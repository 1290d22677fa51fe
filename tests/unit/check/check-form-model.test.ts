import { buildRequest, DEFAULT_FORM, switchUnits, type CheckFormValues } from '@/components/check/check-form-model';

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
    expect(Number(ft.observerHeight)).toBeCloseTo(98.4252, 3);
    expect(Number(ft.distance)).toBeCloseTo(15.5343, 3);
    const back = switchUnits(ft, 'metric');
    expect(Number(back.observerHeight)).toBeCloseTo(30, 3);
    expect(Number(back.distance)).toBeCloseTo(25, 3);
  });
});
