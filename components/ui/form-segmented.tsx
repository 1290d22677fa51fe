import { Controller, type Control, type FieldValues, type Path, type PathValue } from 'react-hook-form';
import { Segmented } from '@/components/check/unit-switch';

/** A segmented choice bound to a react-hook-form field. */
export function FormSegmented<T extends FieldValues, N extends Path<T>, TOut = T>({
  control,
  name,
  label,
  options,
}: {
  control: Control<T, unknown, TOut>;
  name: N;
  label: string;
  options: { value: PathValue<T, N> & string; label: string }[];
}) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field }) => (
        <Segmented<PathValue<T, N> & string> label={label} value={field.value} onChange={field.onChange} options={options} />
      )}
    />
  );
}
