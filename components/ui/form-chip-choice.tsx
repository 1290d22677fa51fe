import { Controller, type Control, type FieldValues, type Path } from 'react-hook-form';
import { View } from 'react-native';
import { Chip, ChipRow } from './chip';
import { space } from './theme';
import { FieldError } from './field-error';

/** One choice among a few named things (a site, a post) as chips, bound to a react-hook-form field; its error under it. */
export function FormChipChoice<T extends FieldValues, TOut = T>({
  control,
  name,
  label,
  options,
}: {
  control: Control<T, unknown, TOut>;
  name: Path<T>;
  label: string;
  options: readonly { id: string; name: string }[];
}) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field, fieldState }) => (
        <View style={{ gap: space.xs }}>
          <ChipRow label={label}>
            {options.map((o) => (
              <Chip key={o.id} label={o.name} on={field.value === o.id} onPress={() => field.onChange(o.id)} />
            ))}
          </ChipRow>
          <FieldError message={fieldState.error?.message} />
        </View>
      )}
    />
  );
}
