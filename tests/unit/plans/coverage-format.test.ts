import {
  caseChoices,
  caseLabel,
  comparableRun,
  compareLines,
  comparePosts,
  formatMetres,
  coverageCardState,
  formatArea,
  formatAreaChange,
  formatPct,
  matchingCase,
  pickCase,
  progressText,
  rulesFailingFirst,
  sharedCaseKeys,
} from '@/components/plans/coverage-format';
import { conditionSpread, describeDetection } from '@/components/plans/coverage-format';
import { IDS, sampleCase, sampleComparison, sampleRun } from '@/tests/support/coverage-samples';

describe('areas and shares for people', () => {
  // Source: SI — 1 km² = 10⁶ m² (common practice, no source).
  test.each([
    [31_200_000, '31.2 km²'],
    [420_000, '0.42 km²'],
    [1_234_567, '1.23 km²'],
    [150_400_000, '150 km²'],
    [4_000, '< 0.01 km²'],
    [0, '0 km²'],
  ])('%d m² reads %s', (m2, text) => {
    expect(formatArea(m2)).toBe(text);
  });

  test('changes carry their sign, with a true minus', () => {
    expect(formatAreaChange(900_000)).toBe('+0.90 km²');
    expect(formatAreaChange(-1_500_000)).toBe('−1.50 km²');
    expect(formatAreaChange(0)).toBe('±0 km²');
    expect(formatAreaChange(-1000)).toBe('−< 0.01 km²');
  });

  test('percent with one decimal', () => {
    expect(formatPct(72.44)).toBe('72.4 %');
    expect(formatPct(100)).toBe('100.0 %');
  });
});

describe('cases', () => {
  test('a case is named by target, condition set and condition', () => {
    expect(caseLabel(sampleCase())).toBe('Test smoke · Spread: standard optical (k 0.13)');
  });

  test('pickCase finds the key or falls back to the first case', () => {
    const run = sampleRun();
    expect(pickCase(run.cases, run.cases[1]!.key)).toBe(run.cases[1]);
    expect(pickCase(run.cases, 'gone')).toBe(run.cases[0]);
    expect(pickCase([], 'x')).toBeNull();
  });

  test('matchingCase: same key, else same target and condition by name, else same target', () => {
    const a = sampleCase({}, 1);
    const other = (key: string, conditionLabel: string) => ({ ...sampleCase(), key, conditionLabel });
    const b = [other('x:y:0', 'standard optical (k 0.13)'), other('x:y:1', 'no refraction (k 0)')];
    expect(matchingCase(a, b)?.key).toBe('x:y:1');
    expect(matchingCase({ ...a, conditionLabel: 'hot haze' }, b)?.key).toBe('x:y:0');
    expect(matchingCase(a, [a, ...b])?.key).toBe(a.key);
    expect(matchingCase(a, [])).toBeNull();
    expect(sharedCaseKeys([a, sampleCase()], b)).toEqual([]);
    expect(sharedCaseKeys([a, sampleCase()], [sampleCase()])).toEqual([sampleCase().key]);
  });

  test('caseChoices: targets, then the chosen target’s conditions by set; another target keeps the condition', () => {
    const t2 = '00000000-0000-4000-8000-0000000000d2';
    const set2 = '00000000-0000-4000-8000-0000000000e2';
    const make = (targetId: string, targetName: string, conditionSetId: string, conditionSetName: string, i: number) => ({
      key: `${targetId}:${conditionSetId}:${i}`,
      targetId,
      targetName,
      conditionSetId,
      conditionSetName,
      conditionIndex: i,
      conditionLabel: `condition ${i}`,
    });
    const cases = [
      make(IDS.target, 'Early smoke', IDS.set, 'Spread', 0),
      make(IDS.target, 'Early smoke', IDS.set, 'Spread', 1),
      make(IDS.target, 'Early smoke', set2, 'Haze', 0),
      make(t2, 'Developed smoke', IDS.set, 'Spread', 0),
      make(t2, 'Developed smoke', IDS.set, 'Spread', 1),
    ];
    const choices = caseChoices(cases, cases[1]!.key);
    expect(choices.targets).toEqual([
      { id: IDS.target, name: 'Early smoke', key: cases[0]!.key, on: true },
      // Developed smoke has "Spread, condition 1" too: picking it keeps that condition.
      { id: t2, name: 'Developed smoke', key: cases[4]!.key, on: false },
    ]);
    expect(choices.sets.map((s) => [s.name, s.conditions.map((c) => `${c.label}${c.on ? ' *' : ''}`)])).toEqual([
      ['Spread', ['condition 0', 'condition 1 *']],
      ['Haze', ['condition 0']],
    ]);
    // From "Haze" (which Developed smoke lacks), its first case.
    expect(caseChoices(cases, cases[2]!.key).targets[1]!.key).toBe(cases[3]!.key);
    expect(caseChoices([], null)).toEqual({ targets: [], sets: [] });
  });

  test('failing rules come first, each group in its own order, without touching the input', () => {
    const rules = [
      { id: '1', passed: true },
      { id: '2', passed: false },
      { id: '3', passed: true },
      { id: '4', passed: false },
    ];
    const copy = structuredClone(rules);
    expect(rulesFailingFirst(rules).map((r) => r.id)).toEqual(['2', '4', '1', '3']);
    expect(rules).toEqual(copy);
  });
});

describe('the coverage card’s state', () => {
  const done = sampleRun();
  const running = sampleRun({ status: 'running', progress: 0.42, stage: 'Viewsheds: post 2 of 3', cases: [] });
  const queued = sampleRun({ status: 'queued', progress: 0, stage: '', cases: [] });
  const failed = sampleRun({ status: 'failed', error: 'The terrain could not be read.', cases: [] });
  const cancelled = sampleRun({ status: 'cancelled', cases: [] });
  const old = sampleRun({ current: false, inputsHash: 'hash-0' });

  test.each([
    ['nothing yet', { current: null, latest: null }, 'none'],
    ['today’s run is computing', { current: running, latest: running }, 'active'],
    ['today’s run is queued', { current: queued, latest: queued }, 'active'],
    ['today’s run is done', { current: done, latest: done }, 'done'],
    ['inputs changed after a done run', { current: null, latest: old }, 'stale'],
    ['the newest run failed', { current: null, latest: failed }, 'failed'],
    ['the newest run was cancelled', { current: null, latest: cancelled }, 'cancelled'],
    ['today’s run is done, an older one failed later', { current: done, latest: failed }, 'done'],
  ] as const)('%s → %s', (_what, coverage, kind) => {
    expect(coverageCardState(coverage).kind).toBe(kind);
  });

  test('progress in words', () => {
    expect(progressText(running)).toBe('42 % · Viewsheds: post 2 of 3');
    expect(progressText(queued)).toBe('Waiting to start');
    expect(progressText({ ...queued, stage: 'Waiting for a worker' })).toBe('Waiting for a worker');
    expect(progressText({ status: 'running', progress: 1.2, stage: '' })).toBe('100 %');
  });
});

describe('the run a plan is compared by', () => {
  test('a frozen plan uses its revision’s run, or says none was frozen', () => {
    expect(comparableRun(false, undefined, { runId: IDS.runB })).toEqual({ runId: IDS.runB, reason: null });
    expect(comparableRun(false, undefined, null).runId).toBeNull();
    expect(comparableRun(false, undefined, null).reason).toMatch(/No coverage run was frozen/);
  });

  test('an editable plan uses today’s finished run, else says why not', () => {
    const done = sampleRun();
    expect(comparableRun(true, { current: done, latest: done }, null)).toEqual({ runId: IDS.run, reason: null });
    expect(comparableRun(true, { current: null, latest: null }, null).reason).toMatch(/not been computed/);
    expect(comparableRun(true, { current: null, latest: sampleRun({ current: false }) }, null).reason).toMatch(/changed/);
    const running = sampleRun({ status: 'running', cases: [] });
    expect(comparableRun(true, { current: running, latest: running }, null).reason).toMatch(/still being computed/);
  });
});

describe('comparison figures', () => {
  test('gained, lost and net per line, with the sign of the net change', () => {
    const lines = compareLines(sampleComparison().statistics);
    expect(lines).toEqual([
      { label: 'Seen by 1 post or more', gained: '+1.20 km²', lost: '−0.30 km²', net: '+0.90 km²', sign: 1 },
      { label: 'Seen by 2 posts or more', gained: '+0.50 km²', lost: '−0.60 km²', net: '−0.10 km²', sign: -1 },
    ]);
  });

  test('nothing gained or lost reads 0 km², not a signed zero', () => {
    const s = sampleComparison().statistics;
    const none = { cells: 0, area: 0 };
    const [line] = compareLines({ ...s, lostSeenBy1: none, gainedSeenBy1: none, netSeenBy1Area: 0 });
    expect(line).toEqual({ label: 'Seen by 1 post or more', gained: '0 km²', lost: '0 km²', net: '±0 km²', sign: 0 });
  });

  test('posts: height above the ground in each plan and what changed', () => {
    const post = (id: string, name: string, structureHeightM: number) => ({ id, name, structureHeightM, eyeHeightM: 1.7 });
    const rows = comparePosts(
      [post('1', 'Tower A', 12), post('2', 'Tower B', 18)],
      [post('2', 'Tower B', 28), post('3', 'Mast C', 30), post('1', 'Tower A', 12)],
    );
    expect(rows).toEqual([
      { id: '1', name: 'Tower A', a: 13.7, b: 13.7, change: '' },
      { id: '2', name: 'Tower B', a: 19.7, b: 29.7, change: '+10 m' },
      { id: '3', name: 'Mast C', a: null, b: 31.7, change: 'new in B' },
    ]);
    expect(comparePosts([post('1', 'Tower A', 12)], [])[0]!.change).toBe('only in A');
    expect(comparePosts([post('1', 'Tower A', 12)], [post('1', 'Tower A', 9.5)])[0]!.change).toBe('−2.5 m');
  });
});

describe('describeDetection', () => {
  const base = {
    targetName: 'Person in the water',
    detection: {
      rangeLimitM: 687.5,
      rangeLimitedBy: 'angular-size' as const,
      waveScreenM: 0.625,
      reason: null,
      decidedBy: 'angular-size' as const,
      areaM2: { detected: 2_000_000, noData: 0, view: 500_000, range: 7_500_000 },
      seaOnly: true,
    },
  };
  test('says how far, which limit, what decided the rest, and the areas with their shares', () => {
    // common practice, no source: a share is the area over the area judged.
    const lines = describeDetection(base)!;
    expect(lines.range).toBe('Person in the water is detected out to 688 m from a post at most (angular size).');
    expect(lines.decided).toMatch(/decided by the target’s size/);
    expect(lines.areas).toEqual([
      { label: 'Detected', area: '2.00 km² (20.0 %)' },
      { label: 'Hidden from posts in range', area: '0.50 km² (5.0 %)' },
      { label: 'Beyond every post’s range', area: '7.50 km² (75.0 %)' },
    ]);
    expect(lines.sea).toMatch(/sea only/);
    expect(lines.waves).toBe('Waves hide the lowest 0.6 m of the target.');
  });
  test('an unlit target at night and a run made before the model are said so', () => {
    const unlit = describeDetection({
      ...base,
      detection: { ...base.detection, rangeLimitM: 0, reason: 'unlit-at-night', rangeLimitedBy: 'luminous-range' },
    })!;
    expect(unlit.range).toMatch(/no light: at night it is not detected anywhere/);
    expect(describeDetection({ targetName: 'x', detection: null })).toBeNull();
    const free = describeDetection({
      ...base,
      detection: { ...base.detection, rangeLimitM: null, rangeLimitedBy: null, decidedBy: null, waveScreenM: 0, seaOnly: false },
    })!;
    expect(free.range).toMatch(/only the view limits/);
    expect(free.decided).toBeNull();
    expect(free.waves).toBeNull();
    expect(free.sea).toBeNull();
  });
});

describe('heights and ranges in the person’s units', () => {
  const detection = {
    rangeLimitM: 9260,
    rangeLimitedBy: 'visibility' as const,
    waveScreenM: 0.9144,
    reason: null,
    decidedBy: 'visibility' as const,
    areaM2: { detected: 1_000_000, noData: 0, view: 0, range: 0 },
    seaOnly: true,
  };
  test('ranges in nautical or statute miles, wave heights in feet; areas stay in km²', () => {
    const nautical = describeDetection({ targetName: 'Raft', detection }, { height: 'ft', distance: 'nmi' })!;
    // Source: NIST SP 811 Appendix B.8: 1 nmi = 1852 m, so 9260 m = 5 nmi; 1 ft = 0.3048 m, so 0.9144 m = 3 ft.
    expect(nautical.range).toBe('Raft is detected out to 5 nmi from a post at most (visibility).');
    expect(nautical.waves).toBe('Waves hide the lowest 3 ft of the target.');
    expect(nautical.areas[0]!.area).toBe('1.00 km² (100.0 %)');
    const imperial = describeDetection({ targetName: 'Raft', detection }, { height: 'ft', distance: 'mi' })!;
    // Source: NIST SP 811 B.8: 1 mi = 1609.344 m; 9260 m = 5.754 mi.
    expect(imperial.range).toBe('Raft is detected out to 5.75 mi from a post at most (visibility).');
    // Metric unchanged, given or not: 9260 m reads 9.3 km.
    expect(describeDetection({ targetName: 'Raft', detection }, { height: 'm', distance: 'km' })!.range).toBe(
      describeDetection({ targetName: 'Raft', detection })!.range,
    );
    expect(describeDetection({ targetName: 'Raft', detection })!.range).toMatch(/out to 9\.3 km/);
  });
  test('a post’s change of height in feet', () => {
    const post = (structureHeightM: number) => ({ id: '1', name: 'Tower A', structureHeightM, eyeHeightM: 1.7 });
    // Source: NIST SP 811 B.8: 10 m / 0.3048 = 32.8 ft; 3.048 m = 10 ft exactly.
    expect(comparePosts([post(12)], [post(22)], 'ft')[0]!.change).toBe('+32.8 ft');
    expect(comparePosts([post(12)], [post(12 - 3.048)], 'ft')[0]!.change).toBe('−10 ft');
    expect(formatMetres(1.7, 'ft')).toBe('5.58 ft');
    expect(formatMetres(1.7)).toBe('1.7 m');
  });
});

describe('conditionSpread', () => {
  const at = (key: string, targetId: string, k: number, pct: number, passed: boolean) => ({
    key,
    targetId,
    conditionSetName: 'Spread',
    conditionLabel: `k ${k}`,
    refractionCoefficient: k,
    site: { ...sampleCase().site, seenBy1: { ...sampleCase().site.seenBy1, pct } },
    check: { ...sampleCase().check, passed },
  });
  test('orders one target’s cases by k, gives the least and greatest share and how many pass', () => {
    // common practice, no source: a verdict that flips within the conditions is sensitive to them.
    const spread = conditionSpread(
      [at('a', 'T', 0.25, 74, true), at('b', 'T', 0, 61, false), at('c', 'T', 0.13, 70.5, true), at('d', 'U', 0, 10, false)],
      'T',
    )!;
    expect(spread.rows.map((r) => r.k)).toEqual([0, 0.13, 0.25]);
    expect([spread.minPct, spread.maxPct, spread.passes]).toEqual([61, 74, 2]);
    expect(spread.verdict).toMatch(/under 2 of 3 conditions only/);
    expect(conditionSpread([at('d', 'U', 0, 10, false)], 'U')).toBeNull();
    expect(conditionSpread([at('a', 'T', 0, 1, true), at('b', 'T', 0.1, 2, true)], 'T')!.verdict).toMatch(/under all 2/);
  });
});
