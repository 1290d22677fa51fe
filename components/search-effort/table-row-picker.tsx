import { View } from 'react-native';
import type { SweepWidthTable } from '@/shared/schemas/sweep-width';
import type { UnitSystem } from '@/shared/units/unit-systems';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Chip, ChipRow } from '@/components/ui/chip';
import { Notice } from '@/components/ui/states';
import { space } from '@/components/ui/theme';
import { FieldError } from '@/components/ui/field-error';
import { describeRow } from './search-effort-form-model';

/** Chooses a table of the library and one of its rows. */
export function TableRowPicker({
  tables,
  units = 'metric',
  tableId,
  rowIndex,
  onTable,
  onRow,
  tableError,
  rowError,
  onRetire,
  retiring,
}: {
  tables: readonly SweepWidthTable[];
  /** The units rows are described in. */
  units?: UnitSystem;
  tableId: string;
  rowIndex: string;
  onTable: (id: string) => void;
  onRow: (index: string) => void;
  tableError?: string;
  rowError?: string;
  /** Planners may retire the chosen table. */
  onRetire?: (table: SweepWidthTable) => void;
  retiring?: boolean;
}) {
  const table = tables.find((t) => t.id === tableId);
  return (
    <View style={{ gap: space.md }}>
      <ChipRow label="Sweep-width table">
        {tables.map((t) => (
          <Chip key={t.id} label={t.name} on={t.id === tableId} onPress={() => onTable(t.id)} />
        ))}
      </ChipRow>
      <FieldError message={tableError} />
      {table ? (
        <View style={{ gap: space.sm }}>
          <AppText variant="small" tone="muted">
            {table.sourceName} · {table.edition}
          </AppText>
          {table.isExample ? (
            <Notice tone="danger" title="Example values">
              <AppText variant="small">
                This table is an invented example, not published values. Do not plan a search with it: use your agency’s tables.
              </AppText>
            </Notice>
          ) : null}
          <ChipRow label="Row">
            {table.rows.map((row, i) => (
              <Chip key={i} label={describeRow(row, units)} on={rowIndex === String(i)} onPress={() => onRow(String(i))} />
            ))}
          </ChipRow>
          <FieldError message={rowError} />
          {onRetire ? (
            <View style={{ alignItems: 'flex-start' }}>
              <Button kind="quiet" label="Retire this table" onPress={() => onRetire(table)} busy={retiring} />
            </View>
          ) : null}
        </View>
      ) : null}
    </View>
  );
}
