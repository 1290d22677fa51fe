import { TextField } from '@/components/ui/text-field';

/** A photo's bearing as typed: which way the camera looks, degrees from true north. */
export function CameraBearingField({
  value,
  onChangeText,
  error,
  hint,
  editable,
}: {
  value: string;
  onChangeText: (text: string) => void;
  error: string | undefined;
  hint: string;
  editable?: boolean;
}) {
  return (
    <TextField
      label="Bearing"
      unit="°"
      inputMode="decimal"
      value={value}
      onChangeText={onChangeText}
      error={error}
      hint={hint}
      editable={editable}
    />
  );
}
