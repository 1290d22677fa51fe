import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';
import { SweepWidthTableInputSchema } from '@/shared/schemas/sweep-width';
import { applyServerErrors } from '@/components/data/server-errors';
import { useCreateSweepWidthTable } from '@/components/data/sweep-width';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormTextField } from '@/components/ui/form-text-field';
import { FormError } from '@/components/ui/states';
import { parseTableRowsText } from './search-effort-form-model';

interface TableFormValues {
  name: string;
  edition: string;
  sourceName: string;
  rows: string;
}

const EMPTY: TableFormValues = { name: '', edition: '', sourceName: '', rows: '' };
const FIELDS = ['name', 'edition', 'sourceName', 'rows'] as const;

/** A planner enters a sweep-width table from the agency's publication, naming its edition and source. */
export function SweepWidthTableForm({ onAdded }: { onAdded: (id: string) => void }) {
  const create = useCreateSweepWidthTable();
  const [formError, setFormError] = useState('');
  const [added, setAdded] = useState('');
  const { control, handleSubmit, setError, reset } = useForm<TableFormValues>({ defaultValues: EMPTY });

  const submit = handleSubmit((values) => {
    setFormError('');
    setAdded('');
    const rows = parseTableRowsText(values.rows);
    if ('error' in rows) {
      setError('rows', { type: 'validate', message: rows.error });
      return;
    }
    const parsed = SweepWidthTableInputSchema.safeParse({ ...values, rows: rows.rows });
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const [field, index, key] = issue.path;
        if (field === 'rows') {
          const where = typeof index === 'number' ? `Line ${index + 1}${key ? ` (${String(key)})` : ''}: ` : '';
          setError('rows', { type: 'validate', message: `${where}${issue.message}` });
        } else if ((FIELDS as readonly unknown[]).includes(field)) {
          setError(field as keyof TableFormValues, { type: 'validate', message: issue.message });
        }
      }
      return;
    }
    create.mutate(parsed.data, {
      onSuccess: ({ table }) => {
        reset(EMPTY);
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
      {added ? <AppText variant="small">{added}</AppText> : null}
      <FormTextField control={control} name="name" label="Table name" />
      <FormTextField control={control} name="edition" label="Edition" hint="E.g. the year or revision of the publication." />
      <FormTextField control={control} name="sourceName" label="Source" hint="The publication the values come from." />
      <FormTextField
        control={control}
        name="rows"
        label="Rows"
        multiline
        numberOfLines={5}
        style={{ minHeight: 112, textAlignVertical: 'top' }}
        placeholder={'Life raft, 6 persons; 10000; 15; 3700'}
        hint="One row a line: search object; visibility m; height of eye m; sweep width m."
      />
      <View style={{ alignItems: 'flex-start' }}>
        <Button label="Save table" kind="secondary" onPress={submit} busy={create.isPending} />
      </View>
    </Card>
  );
}
