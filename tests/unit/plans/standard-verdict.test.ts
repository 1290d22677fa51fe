import { failingRuleLine, standardVerdict } from '@/shared/plans/standard-verdict';

const rule = (id: string, actualPct: number, minPct: number) => ({
  id,
  zoneName: null,
  minPosts: 1,
  minPct,
  text: `At least ${minPct} % of the site is seen by at least one post.`,
  actualPct,
  passed: actualPct >= minPct,
  shortfallPct: Math.max(0, minPct - actualPct),
  shortfallArea: 0,
  reasons: [],
});
const aCase = (key: string, rules: ReturnType<typeof rule>[], reasons: string[] = []) => ({
  key,
  targetName: 'Early smoke column',
  conditionSetName: 'Refraction spread',
  conditionLabel: 'standard optical (k 0.13)',
  check: { interpretation: 'v2', passed: rules.every((r) => r.passed) && reasons.length === 0, rules, reasons },
});

describe('standardVerdict', () => {
  it('checks nothing without coverage cases, so nothing fails', () => {
    expect(standardVerdict(null)).toEqual({ checked: false, passed: true, caseCount: 0, failingCaseCount: 0, failing: [] });
    expect(standardVerdict([]).checked).toBe(false);
  });

  it('fails when any case fails and lists only the failing rules of the failing cases', () => {
    // Demo-like figures: 56 % seen against a 70 % standard (invented, common practice, no source).
    const v = standardVerdict([
      aCase('a', [rule('site-seen', 80, 70)]),
      aCase('b', [rule('site-seen', 56, 70), rule('priority-zone-seen', 90, 70)]),
    ]);
    expect(v).toMatchObject({ checked: true, passed: false, caseCount: 2, failingCaseCount: 1 });
    expect(v.failing).toEqual([expect.objectContaining({ caseKey: 'b', ruleId: 'site-seen', actualPct: 56, minPct: 70 })]);
    expect(failingRuleLine(v.failing[0]!)).toBe(
      'Early smoke column, Refraction spread — standard optical (k 0.13): At least 70 % of the site is seen by at least one post. Reached 56 % of 70 %.',
    );
  });

  it('passes when every case passes', () => {
    const v = standardVerdict([aCase('a', [rule('site-seen', 70, 70)])]);
    expect(v).toMatchObject({ checked: true, passed: true, failingCaseCount: 0, failing: [] });
  });

  it('names a case that fails for a reason outside its rules', () => {
    const v = standardVerdict([aCase('a', [rule('site-seen', 90, 70)], ['The site has no cells on the terrain grid.'])]);
    expect(v.passed).toBe(false);
    expect(v.failing[0]).toMatchObject({ ruleId: 'case', text: 'The site has no cells on the terrain grid.', actualPct: null });
  });

  it('does not change its input', () => {
    const cases = [aCase('b', [rule('site-seen', 56, 70)])];
    const copy = structuredClone(cases);
    standardVerdict(cases);
    expect(cases).toEqual(copy);
  });
});
