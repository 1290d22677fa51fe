import { View } from 'react-native';
import { failingRuleLine, type StandardVerdict } from '@/shared/plans/standard-verdict';
import { AppText } from '@/components/ui/app-text';
import { Notice } from '@/components/ui/states';
import { space } from '@/components/ui/theme';

/** How many failing rules a dialog lists before summing up the rest. */
const SHOWN = 6;

/**
 * A plan's terrain coverage against its standard: met, not met with the
 * failing rules one per line, or not checked (no terrain coverage).
 */
export function VerdictSummary({ verdict }: { verdict: StandardVerdict | null }) {
  if (!verdict || !verdict.checked) {
    return (
      <Notice tone="caution" title="Standard not checked">
        <AppText variant="small">
          No coverage run was computed for these inputs, so the coverage standard was not checked.
        </AppText>
      </Notice>
    );
  }
  if (verdict.passed) {
    return (
      <Notice tone="info" title="Meets its coverage standard">
        <AppText variant="small">
          All {verdict.caseCount} target × condition case{verdict.caseCount === 1 ? '' : 's'} meet the plan’s standard.
        </AppText>
      </Notice>
    );
  }
  const shown = verdict.failing.slice(0, SHOWN);
  const more = verdict.failing.length - shown.length;
  return (
    <Notice tone="danger" title="Does not meet its coverage standard">
      <AppText variant="small">
        {verdict.failingCaseCount} of {verdict.caseCount} target × condition case{verdict.caseCount === 1 ? '' : 's'} fail.
        Failing rules:
      </AppText>
      <View style={{ gap: space.xs }} role="list" aria-label="Failing rules">
        {shown.map((r, i) => (
          <AppText key={`${r.caseKey}:${r.ruleId}:${i}`} variant="small" role="listitem">
            • {failingRuleLine(r)}
          </AppText>
        ))}
        {more > 0 ? (
          <AppText variant="small" tone="muted">
            and {more} more (see the coverage figures).
          </AppText>
        ) : null}
      </View>
    </Notice>
  );
}
