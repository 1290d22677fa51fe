import type { CoverageCase } from '@/shared/schemas/coverage';
import { Chip, ChipRow } from '@/components/ui/chip';
import { View } from 'react-native';
import { space } from '@/components/ui/theme';
import { caseChoices } from './coverage-format';

/**
 * Choose one target × condition of a run: the target (when there are
 * several), then the condition, grouped by condition set. Nothing to choose
 * with a single case.
 */
export function CoverageCasePicker({
  cases,
  value,
  onChange,
  label,
}: {
  cases: readonly Pick<
    CoverageCase,
    'key' | 'targetId' | 'targetName' | 'conditionSetId' | 'conditionSetName' | 'conditionIndex' | 'conditionLabel'
  >[];
  value: string | null;
  onChange: (key: string) => void;
  /** Prefix of the groups' names, e.g. "Plan B". */
  label?: string;
}) {
  if (cases.length < 2) return null;
  const { targets, sets } = caseChoices(cases, value);
  const named = (what: string) => (label ? `${label}: ${what}` : what);
  return (
    <View style={{ gap: space.sm }} role="group" aria-label={named('Case')}>
      {targets.length > 1 ? (
        <ChipRow label={named('Target')}>
          {targets.map((t) => (
            <Chip key={t.id} label={t.name} on={t.on} onPress={() => onChange(t.key)} />
          ))}
        </ChipRow>
      ) : null}
      {sets.map((s) => (
        <ChipRow key={s.id} label={named(`Condition · ${s.name}`)}>
          {s.conditions.map((c) => (
            <Chip key={c.key} label={c.label} on={c.on} onPress={() => onChange(c.key)} />
          ))}
        </ChipRow>
      ))}
    </View>
  );
}
