import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { View } from 'react-native';
import { SWEEP_MODEL_LABELS, SWEEP_MODELS } from '@/shared/schemas/sweep-width';
import { Segmented } from '@/components/check/unit-switch';
import { applyServerErrors } from '@/components/data/server-errors';
import { useSession } from '@/components/data/session';
import { useEvaluateSweep, useRetireSweepWidthTable, useSweepWidthTables } from '@/components/data/sweep-width';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormTextField } from '@/components/ui/form-text-field';
import { EmptyState, ErrorState, FormError, LoadingState } from '@/components/ui/states';
import { Screen } from '@/components/ui/screen';
import { space } from '@/components/ui/theme';
import { useLayout } from '@/components/ui/use-layout';
import {
  formFieldOf,
  SEARCH_EFFORT_DEFAULTS,
  toSweepRequest,
  type SearchEffortValues,
  type SweepSource,
} from './search-effort-form-model';
import { SweepCautions } from './sweep-cautions';
import { SweepResult } from './sweep-result';
import { SweepWidthTableForm } from './sweep-width-table-form';
import { TableRowPicker } from './table-row-picker';

const SOURCES: { value: SweepSource; label: string }[] = [
  { value: 'table', label: 'From a table' },
  { value: 'width', label: 'Sweep width' },
  { value: 'curve', label: 'Lateral-range curve' },
];

/**
 * Search effort: a planner picks a row of a sweep-width table, types a sweep
 * width or a lateral-range curve, and a track spacing, and reads W, the
 * coverage factor and the POD — with the cautions always in view.
 */
export function SearchEffortScreen() {
  const { wide } = useLayout();
  const tables = useSweepWidthTables();
  const evaluate = useEvaluateSweep();
  const retire = useRetireSweepWidthTable();
  const { data: user } = useSession();
  const planner = user?.role === 'planner';
  const [formError, setFormError] = useState('');
  const { control, handleSubmit, setError, clearErrors, watch, setValue, formState } = useForm<SearchEffortValues>({
    defaultValues: SEARCH_EFFORT_DEFAULTS,
  });
  const source = watch('source');
  const tableId = watch('tableId');
  const rowIndex = watch('rowIndex');

  const submit = handleSubmit((values) => {
    setFormError('');
    clearErrors();
    const built = toSweepRequest(values, tables.data ?? []);
    if ('errors' in built) {
      for (const [field, message] of Object.entries(built.errors)) {
        setError(field as keyof SearchEffortValues, { type: 'validate', message });
      }
      return;
    }
    evaluate.mutate(built.request, {
      onError: (e) => setFormError(applyServerErrors(e, setError, (path) => formFieldOf(path, values.source) ?? undefined)),
    });
  });

  const form = (
    <Card accent="moss" aria-label="Search effort">
      <AppText variant="heading">Sweep width and track spacing</AppText>
      <FormError message={formError} />
      <Controller
        control={control}
        name="source"
        render={({ field }) => (
          <Segmented label="Sweep width from" value={field.value} onChange={field.onChange} options={SOURCES} />
        )}
      />
      {source === 'table' ? (
        tables.isPending ? (
          <LoadingState label="Loading the sweep-width tables…" />
        ) : tables.isError ? (
          <ErrorState error={tables.error} onRetry={() => void tables.refetch()} />
        ) : tables.data.length === 0 ? (
          <EmptyState
            title="No sweep-width tables yet"
            body="Your organisation has no sweep-width tables. Type a sweep width instead, or ask a planner to add your agency’s tables."
          />
        ) : (
          <TableRowPicker
            tables={tables.data}
            tableId={tableId}
            rowIndex={rowIndex}
            onTable={(id) => {
              setValue('tableId', id);
              setValue('rowIndex', '');
            }}
            onRow={(i) => setValue('rowIndex', i)}
            tableError={formState.errors.tableId?.message}
            rowError={formState.errors.rowIndex?.message}
            retiring={retire.isPending}
            onRetire={
              planner
                ? (table) =>
                    retire.mutate(
                      { id: table.id, version: table.version },
                      {
                        onSuccess: () => setValue('tableId', ''),
                        onError: (e) => setFormError(e.message),
                      },
                    )
                : undefined
            }
          />
        )
      ) : null}
      {source === 'width' ? (
        <FormTextField
          control={control}
          name="sweepWidth"
          label="Sweep width W"
          unit="m"
          inputMode="decimal"
          hint="From your agency’s tables for this search object, visibility and searcher."
        />
      ) : null}
      {source === 'curve' ? (
        <FormTextField
          control={control}
          name="curve"
          label="Lateral-range curve"
          multiline
          numberOfLines={6}
          style={{ minHeight: 132, textAlignVertical: 'top' }}
          placeholder={'0, 0.9\n500, 0.7\n1500, 0.2\n2500, 0'}
          hint="One point a line: lateral range in metres, POD on one pass (0–1 or %), nearest first."
        />
      ) : null}
      {source !== 'curve' ? (
        <Controller
          control={control}
          name="model"
          render={({ field }) => (
            <Segmented
              label="Detection law"
              value={field.value}
              onChange={field.onChange}
              options={SWEEP_MODELS.map((m) => ({ value: m, label: SWEEP_MODEL_LABELS[m] }))}
            />
          )}
        />
      ) : null}
      <FormTextField
        control={control}
        name="trackSpacing"
        label="Track spacing S"
        unit="m"
        inputMode="decimal"
        hint="Distance between adjacent search tracks."
      />
      <View style={{ alignItems: 'flex-start' }}>
        <Button label="Compute POD" onPress={submit} busy={evaluate.isPending} />
      </View>
    </Card>
  );

  const result = (
    <View style={{ gap: space.lg }}>
      {evaluate.data ? <SweepResult result={evaluate.data} /> : null}
      <SweepCautions caution={evaluate.data?.caution} />
      {planner ? (
        <SweepWidthTableForm
          onAdded={(id) => {
            setValue('source', 'table');
            setValue('tableId', id);
            setValue('rowIndex', '');
          }}
        />
      ) : null}
    </View>
  );

  return (
    <Screen
      title="Search effort"
      subtitle="Probability of detection of a parallel-track search from the sweep width and the track spacing."
    >
      {wide ? (
        <View style={{ flexDirection: 'row', gap: space.xl, alignItems: 'flex-start' }}>
          <View style={{ flex: 1 }}>{form}</View>
          <View style={{ flex: 1 }}>{result}</View>
        </View>
      ) : (
        <>
          {form}
          {result}
        </>
      )}
    </Screen>
  );
}
