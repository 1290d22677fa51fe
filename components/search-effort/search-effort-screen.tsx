import { useEffect, useRef, useState } from 'react';
import { Controller, useForm, type UseFormGetValues, type UseFormSetValue } from 'react-hook-form';
import { View } from 'react-native';
import { SWEEP_MODEL_LABELS, SWEEP_MODELS, type SweepWidthRequest } from '@/shared/schemas/sweep-width';
import { restateLengths, retypeLength } from '@/shared/units/typed-lengths';
import { LENGTH_UNIT_WORDS, type UnitSystem } from '@/shared/units/unit-systems';
import { Segmented } from '@/components/check/unit-switch';
import { applyServerErrors } from '@/components/data/server-errors';
import { useSession, useUnitSystem } from '@/components/data/session';
import { useEvaluateSweep, useRetireSweepWidthTable, useSweepWidthTables } from '@/components/data/sweep-width';
import { FormSegmented } from '@/components/ui/form-segmented';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormTextField } from '@/components/ui/form-text-field';
import { EmptyState, ErrorState, FormError, LoadingState } from '@/components/ui/states';
import { Screen } from '@/components/ui/screen';
import { space } from '@/components/ui/theme';
import { UnitNumberField } from '@/components/ui/unit-number-field';
import { UnitsField } from '@/components/ui/units-field';
import { useLayout } from '@/components/ui/use-layout';
import {
  formFieldOf,
  retypeCurve,
  SEARCH_EFFORT_DEFAULTS,
  searchEffortResolver,
  searchUnits,
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
  const preferred = useUnitSystem();
  const [formError, setFormError] = useState('');
  const { control, handleSubmit, setError, clearErrors, watch, setValue, getValues, getFieldState, formState } = useForm<
    SearchEffortValues,
    unknown,
    SweepWidthRequest
  >({
    defaultValues: { ...SEARCH_EFFORT_DEFAULTS, units: preferred },
    resolver: searchEffortResolver(),
    context: tables.data ?? [],
  });
  const source = watch('source');
  const tableId = watch('tableId');
  const rowIndex = watch('rowIndex');
  const units = watch('units');
  const { distance } = searchUnits(units);
  useRetypedOnUnitChange(units, getValues, setValue);
  // The person's units may arrive after the form: follow them until the person picks units here.
  useEffect(() => {
    if (!getFieldState('units').isDirty) setValue('units', preferred);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [preferred]);

  const submit = handleSubmit((request) => {
    setFormError('');
    clearErrors();
    const typedIn = getValues(['source', 'units']);
    const curveUnit = searchUnits(typedIn[1]).distance;
    evaluate.mutate(request, {
      onError: (e) =>
        setFormError(
          applyServerErrors<SearchEffortValues>(
            e,
            (field, error, options) =>
              // The curve is plain text: its figures are restated here (the length fields restate their own).
              setError(
                field,
                field === 'curve' ? { ...error, message: restateLengths(error.message ?? '', curveUnit) } : error,
                options,
              ),
            (path) => formFieldOf(path, typedIn[0]) ?? undefined,
          ),
        ),
    });
  });

  const form = (
    <Card accent="moss" aria-label="Search effort">
      <AppText variant="heading">Sweep width and track spacing</AppText>
      <FormError message={formError} />
      <UnitsField control={control} name="units" />
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
            units={units}
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
        <UnitNumberField
          control={control}
          name="sweepWidth"
          label="Sweep width W"
          unit={distance}
          onSubmitEditing={() => void submit()}
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
          placeholder={retypeCurve('0, 0.9\n500, 0.7\n1500, 0.2\n2500, 0', 'm', distance)}
          hint={`One point a line: lateral range in ${LENGTH_UNIT_WORDS[distance]}, POD on one pass (0–1 or %), nearest first.`}
        />
      ) : null}
      {source !== 'curve' ? (
        <FormSegmented
          control={control}
          name="model"
          label="Detection law"
          options={SWEEP_MODELS.map((m) => ({ value: m, label: SWEEP_MODEL_LABELS[m] }))}
        />
      ) : null}
      <UnitNumberField
        control={control}
        name="trackSpacing"
        label="Track spacing S"
        unit={distance}
        onSubmitEditing={() => void submit()}
        hint="Distance between adjacent search tracks."
      />
      <View style={{ alignItems: 'flex-start' }}>
        <Button label="Compute POD" onPress={() => void submit()} busy={evaluate.isPending} />
      </View>
    </Card>
  );

  const result = (
    <View style={{ gap: space.lg }}>
      {evaluate.data ? <SweepResult result={evaluate.data} units={units} /> : null}
      <SweepCautions caution={evaluate.data?.caution} />
      {planner ? (
        <SweepWidthTableForm
          units={preferred}
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

/**
 * Re-types the lengths no mounted `UnitNumberField` looks after when the
 * form's units change: the curve (plain text, one range a line) always, and
 * the typed sweep width while the curve or a table is chosen (its field is
 * not shown then), so nothing typed changes its length with the unit.
 */
function useRetypedOnUnitChange(
  units: UnitSystem,
  getValues: UseFormGetValues<SearchEffortValues>,
  setValue: UseFormSetValue<SearchEffortValues>,
) {
  const shownIn = useRef(units);
  useEffect(() => {
    const from = searchUnits(shownIn.current).distance;
    const to = searchUnits(units).distance;
    shownIn.current = units;
    if (from === to) return;
    const [curve, sweepWidth, source] = getValues(['curve', 'sweepWidth', 'source']);
    if (curve) setValue('curve', retypeCurve(curve, from, to));
    if (sweepWidth && source !== 'width') setValue('sweepWidth', retypeLength(sweepWidth, from, to));
    // Only a change of unit re-types.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [units]);
}
