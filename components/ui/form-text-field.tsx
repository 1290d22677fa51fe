import { Controller, type Control, type FieldValues, type Path } from 'react-hook-form';
import { TextField, type TextFieldProps } from './text-field';

/** A TextField bound to a react-hook-form field; shows that field's error under it. */
export function FormTextField<T extends FieldValues, TOut = T>({
  control,
  name,
  ...props
}: { control: Control<T, unknown, TOut>; name: Path<T> } & Omit<TextFieldProps, 'value' | 'onChangeText' | 'onBlur' | 'error'>) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field, fieldState }) => (
        <TextField
          {...props}
          value={field.value as string}
          onChangeText={field.onChange}
          onBlur={field.onBlur}
          error={fieldState.error?.message}
        />
      )}
    />
  );
}
