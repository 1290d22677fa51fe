import type { CoverageCase } from '@/shared/schemas/coverage';
import { Chip, ChipRow } from '@/components/ui/chip';
import { caseLabel } from './coverage-format';

/** Choose one target × condition of a run (nothing to choose with a single case). */
export function CoverageCasePicker({
  cases,
  value,
  onChange,
  label = 'Target and condition',
}: {
  cases: readonly Pick<CoverageCase, 'key' | 'targetName' | 'conditionSetName' | 'conditionLabel'>[];
  value: string | null;
  onChange: (key: string) => void;
  label?: string;
}) {
  if (cases.length < 2) return null;
  return (
    <ChipRow label={label}>
      {cases.map((c) => (
        <Chip key={c.key} label={caseLabel(c)} on={c.key === value} onPress={() => onChange(c.key)} />
      ))}
    </ChipRow>
  );
}
