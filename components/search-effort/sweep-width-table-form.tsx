import { useEffect, useRef, useState } from 'react';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';
import type { SweepWidthTableInput } from '@/shared/schemas/sweep-width';
import type { UnitSystem } from '@/shared/units/unit-systems';
import { applyServerErrors } from '@/components/data/server-errors';
import { useCreateSweepWidthTable } from '@/components/data/sweep-width';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormTextField } from '@/components/ui/form-text-field';
import { FormError } from '@/components/ui/states';
import { UnitsField } from '@/components/ui/units-field';
import { retypeTableRows, searchUnits, tableFormResolver, tableRowHeads, type TableFormValues } from './search-effort-form-model';

const FIELDS = ['name', 'edition', 'sourceName', 'rows'] as const;
const empty = (units: UnitSystem): TableFormValues => ({ units, name: '', edition: '', sourceName: '', rows: '' });
/** The example row (a raft: visibility 10 km, height 15 m, W 3.7 km), in the units typed. */
const EXAMPLE_ROW = 'Life raft, 6 persons; 10000; 15; 3700';

/**
 * A planner enters a sweep-width table from the agency's publication, naming
 * its edition and source, the rows typed in the form's units (stored in
 * metres).
 */
export function SweepWidthTableForm({
  units: preferred = 'metric',
  onAdded,
}: {
  units?: UnitSystem;
  onAdded: (id: string) => void;
}) {
  const create = useCreateSweepWidthTable();
  const [formError, setFormError] = useState('');
  const [added, setAdded] = useState('');
  const { control, handleSubmit, setError, reset, watch, getValues, setValue, getFieldState } = useForm<
    TableFormValues,
    unknown,
    SweepWidthTableInput
  >({ defaultValues: empty(preferred), resolver: tableFormResolver() });
  const units = watch('units');
  const typedIn = searchUnits(units);
  // The person's units may arrive after the form: follow them until the person picks units here.
  useEffect(() => {
    if (!getFieldState('units').isDirty) setValue('units', preferred);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [preferred]);

  // The rows are plain text: re-type their lengths when the units change.
  const shownIn = useRef(units);
  useEffect(() => {
    const from = searchUnits(shownIn.current);
    shownIn.current = units;
    const rows = getValues('rows');
    if (rows) setValue('rows', retypeTableRows(rows, from, searchUnits(units)));
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [units]);

  const submit = handleSubmit((input) => {
    setFormError('');
    setAdded('');
    create.mutate(input, {
      onSuccess: ({ table }) => {
        reset(empty(getValues('units')));
        setAdded(`Added ${table.name}.`);
        onAdded(table.id);
      },
      onError: (e) => setFormError(applyServerErrors(e, setError, FIELDS)),
    });
  });

  return (
    <Card aria-label="New sweep-width table">
      <AppText variant="heading">Add a sweep-width table</AppText>
      <AppText variant="small" tone="muted">
        Copy the values from your agency’s publication and name its edition: Kenning never makes up sweep widths.
      </AppText>
      <FormError message={formError} />
      <View aria-live="polite">{added ? <AppText variant="small">{added}</AppText> : null}</View>
      <FormTextField control={control} name="name" label="Table name" />
      <FormTextField control={control} name="edition" label="Edition" hint="E.g. the year or revision of the publication." />
      <FormTextField control={control} name="sourceName" label="Source" hint="The publication the values come from." />
      <UnitsField control={control} name="units" />
      <FormTextField
        control={control}
        name="rows"
        label="Rows"
        multiline
        numberOfLines={5}
        style={{ minHeight: 112, textAlignVertical: 'top' }}
        placeholder={retypeTableRows(EXAMPLE_ROW, searchUnits('metric'), typedIn)}
        hint={`One row a line: ${tableRowHeads(typedIn).replace('height', 'height of eye')}.`}
      />
      <View style={{ alignItems: 'flex-start' }}>
        <Button label="Save table" kind="secondary" onPress={() => void submit()} busy={create.isPending} />
      </View>
    </Card>
  );
}
