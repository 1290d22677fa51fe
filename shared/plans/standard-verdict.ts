import type { CoverageCase } from '@/shared/schemas/coverage';

/** One failing rule of the standard in one target × condition case. */
export interface FailingRule {
  caseKey: string;
  targetName: string;
  conditionSetName: string;
  conditionLabel: string;
  /** Rule id (`COVERAGE_STANDARD_RULES`), or `case` when the case fails for a reason outside its rules. */
  ruleId: string;
  /** The rule as people read it, e.g. "At least 70 % of the site is seen by at least one post." */
  text: string;
  /** Share reached, percent; null when the case fails for a reason outside its rules. */
  actualPct: number | null;
  /** Share the rule asks for, percent; null as above. */
  minPct: number | null;
}

/**
 * A plan's terrain coverage against its standard: `checked` is false when no
 * coverage was computed (a site without terrain, older revisions), and then
 * nothing can fail. A plan fails when any case fails.
 */
export interface StandardVerdict {
  checked: boolean;
  passed: boolean;
  /** Cases looked at. */
  caseCount: number;
  /** Cases that fail. */
  failingCaseCount: number;
  /** Every failing rule, case by case in the run's order. */
  failing: FailingRule[];
}

type CaseForVerdict = Pick<CoverageCase, 'key' | 'targetName' | 'conditionSetName' | 'conditionLabel' | 'check'>;

/**
 * The verdict of a plan's coverage cases against its standard, as frozen in
 * a revision and shown before submitting or approving.
 *
 * @example
 * standardVerdict(null) // { checked: false, passed: true, caseCount: 0, failingCaseCount: 0, failing: [] }
 */
export function standardVerdict(cases: readonly CaseForVerdict[] | null | undefined): StandardVerdict {
  if (!cases || cases.length === 0) return { checked: false, passed: true, caseCount: 0, failingCaseCount: 0, failing: [] };
  const failingCases = cases.filter((c) => !c.check.passed);
  const failing = failingCases.flatMap((c): FailingRule[] => {
    const where = {
      caseKey: c.key,
      targetName: c.targetName,
      conditionSetName: c.conditionSetName,
      conditionLabel: c.conditionLabel,
    };
    const rules = c.check.rules.filter((r) => !r.passed);
    if (rules.length === 0) {
      const reason = c.check.reasons.join(' ') || 'The case does not meet the standard.';
      return [{ ...where, ruleId: 'case', text: reason, actualPct: null, minPct: null }];
    }
    return rules.map((r) => ({ ...where, ruleId: r.id, text: r.text, actualPct: r.actualPct, minPct: r.minPct }));
  });
  return {
    checked: true,
    passed: failingCases.length === 0,
    caseCount: cases.length,
    failingCaseCount: failingCases.length,
    failing,
  };
}

/** "Early smoke column, standard optical (k 0.13): 56.2 % of at least 70 %" — one line per failing rule. */
export function failingRuleLine(rule: FailingRule): string {
  const share =
    rule.actualPct === null || rule.minPct === null
      ? rule.text
      : `${rule.text} Reached ${formatPct(rule.actualPct)} % of ${formatPct(rule.minPct)} %.`;
  return `${rule.targetName}, ${rule.conditionSetName} — ${rule.conditionLabel}: ${share}`;
}

const formatPct = (pct: number) => (Math.round(pct * 10) / 10).toLocaleString('en-GB');
