import { View } from 'react-native';
import type { PickedFile } from '@/components/data/file-part';
import { AppText } from './app-text';
import { Button } from './button';
import { pickFile } from './pick-file';
import { space } from './theme';

/**
 * A labelled button that opens the system's file chooser for the given
 * types (MIME types or name endings such as ".asc"), with the chosen file's
 * name and size, and the field's error or hint under it.
 */
export function FilePickerField({
  label,
  buttonLabel,
  types,
  file,
  error,
  hint,
  onPick,
}: {
  label: string;
  buttonLabel: string;
  types: readonly string[];
  file: PickedFile | null;
  error?: string;
  hint?: string;
  onPick: (file: PickedFile) => void;
}) {
  return (
    <View style={{ gap: space.xs }} role="group" aria-label={label}>
      <AppText variant="label">{label}</AppText>
      <View style={{ flexDirection: 'row', alignItems: 'center', gap: space.md, flexWrap: 'wrap' }}>
        <Button
          kind="secondary"
          label={buttonLabel}
          onPress={async () => {
            const picked = await pickFile(types);
            if (picked) onPick(picked);
          }}
        />
        <AppText variant="small" tone={file ? 'ink' : 'muted'} style={{ flexShrink: 1 }}>
          {file
            ? `${file.name}${file.size !== undefined ? ` · ${(file.size / 1_000_000).toFixed(1)} MB` : ''}`
            : 'No file chosen'}
        </AppText>
      </View>
      {error ? (
        <AppText variant="small" tone="danger" role="alert">
          {error}
        </AppText>
      ) : hint ? (
        <AppText variant="small" tone="muted">
          {hint}
        </AppText>
      ) : null}
    </View>
  );
}
