import { StyleSheet } from 'react-native';
import type { PlanStatus } from '@/shared/schemas/plan';
import { AppText } from '@/components/ui/app-text';
import { colors, radius, space } from '@/components/ui/theme';

export const PLAN_STATUS: Record<PlanStatus, { label: string; bg: string; fg: string }> = {
  draft: { label: 'Draft', bg: colors.paper, fg: colors.ink },
  submitted: { label: 'Awaiting review', bg: colors.cautionSoft, fg: colors.ink },
  returned: { label: 'Returned', bg: colors.dangerSoft, fg: colors.danger },
  approved: { label: 'Approved', bg: colors.mossSoft, fg: colors.moss },
  superseded: { label: 'Superseded', bg: colors.paper, fg: colors.muted },
};

/** The plan's status as a small filled label. */
export function PlanStatusBadge({ status }: { status: PlanStatus }) {
  const s = PLAN_STATUS[status];
  return (
    <AppText variant="small" style={[styles.badge, { backgroundColor: s.bg, color: s.fg, borderColor: s.fg }]}>
      {s.label}
    </AppText>
  );
}

const styles = StyleSheet.create({
  badge: {
    paddingHorizontal: space.sm,
    paddingVertical: 2,
    borderRadius: radius.pill,
    overflow: 'hidden',
    borderWidth: StyleSheet.hairlineWidth,
    alignSelf: 'flex-start',
  },
});
