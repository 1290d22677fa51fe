import { useEffect, useRef } from 'react';
import { Controller, type Control, type FieldValues, type Path } from 'react-hook-form';
import type { LengthUnit } from '@/shared/units/length';
import { restateLengths, retypeLength } from '@/shared/units/typed-lengths';
import { TextField, type TextFieldProps } from './text-field';

type Props<T extends FieldValues, TOut> = {
  control: Control<T, unknown, TOut>;
  name: Path<T>;
  unit: LengthUnit;
  /** Called with the new text after the field takes it (e.g. to clear a field it excludes). */
  onChangeTextAlso?: (text: string) => void;
} & Omit<TextFieldProps, 'value' | 'onChangeText' | 'onBlur' | 'error' | 'unit' | 'inputMode'>;

/**
 * A length typed in the person's unit, bound to a react-hook-form field that
 * holds the text. The unit is written in the field; when `unit` changes the
 * text is re-typed in the new unit (the same length, rounded to the precision
 * typed — never "984.252 ft"); errors, the form's or the server's (which
 * speak metres), are restated in the field's unit and announced as alerts.
 * The form turns the text into metres when it saves (`typedToMetres`).
 */
export function UnitNumberField<T extends FieldValues, TOut = T>({
  control,
  name,
  unit,
  onChangeTextAlso,
  ...props
}: Props<T, TOut>) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field, fieldState }) => (
        <RetypedOnUnitChange unit={unit} text={String(field.value ?? '')} onRetype={field.onChange}>
          <TextField
            {...props}
            ref={field.ref}
            unit={unit}
            inputMode="decimal"
            value={String(field.value ?? '')}
            onChangeText={(text) => {
              field.onChange(text);
              onChangeTextAlso?.(text);
            }}
            onBlur={field.onBlur}
            error={fieldState.error?.message ? restateLengths(fieldState.error.message, unit) : undefined}
          />
        </RetypedOnUnitChange>
      )}
    />
  );
}

function RetypedOnUnitChange({
  unit,
  text,
  onRetype,
  children,
}: {
  unit: LengthUnit;
  text: string;
  onRetype: (text: string) => void;
  children: React.ReactNode;
}) {
  const shownIn = useRef(unit);
  // What was typed before the last switch and what the switch showed: switching back gives the
  // typed text back where it was not edited (no 50 ft → 15.2 m → 49.9 ft drift).
  const before = useRef<{ unit: LengthUnit; typed: string; shown: string } | null>(null);
  useEffect(() => {
    const from = shownIn.current;
    if (from === unit) return;
    shownIn.current = unit;
    const back = before.current?.unit === unit && before.current.shown === text ? before.current.typed : null;
    const retyped = back ?? retypeLength(text, from, unit);
    before.current = { unit: from, typed: text, shown: retyped };
    if (retyped !== text) onRetype(retyped);
    // Only a change of unit re-types; typing does not.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [unit]);
  return <>{children}</>;
}
