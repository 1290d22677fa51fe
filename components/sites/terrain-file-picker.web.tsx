import { useRef } from 'react';
import { View } from 'react-native';
import type { PickedFile } from '@/components/data/terrain';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { space } from '@/components/ui/theme';

/** Whether files can be picked on this platform. */
export const CAN_PICK_FILES = true;

/**
 * A labelled button that opens the browser's file chooser (a hidden
 * `<input type="file">`), with the chosen file's name and the field's error
 * under it.
 */
export function FilePickerField({
  label,
  buttonLabel,
  accept,
  file,
  error,
  hint,
  onPick,
}: {
  label: string;
  buttonLabel: string;
  /** File name endings, e.g. ".tif,.tiff,.asc". */
  accept: string;
  file: PickedFile | null;
  error?: string;
  hint?: string;
  onPick: (file: PickedFile | null) => void;
}) {
  const input = useRef<HTMLInputElement>(null);
  return (
    <View style={{ gap: space.xs }}>
      <AppText variant="label">{label}</AppText>
      <View style={{ flexDirection: 'row', alignItems: 'center', gap: space.md, flexWrap: 'wrap' }}>
        <Button kind="secondary" label={buttonLabel} onPress={() => input.current?.click()} />
        <AppText variant="small" tone={file ? 'ink' : 'muted'} style={{ flexShrink: 1 }}>
          {file ? `${file.name} · ${(file.size / 1_000_000).toFixed(1)} MB` : 'No file chosen'}
        </AppText>
      </View>
      <input
        ref={input}
        type="file"
        accept={accept}
        aria-label={label}
        style={{ display: 'none' }}
        onChange={(e) => {
          const picked = e.currentTarget.files?.[0];
          onPick(picked ? { name: picked.name, size: picked.size, blob: picked } : null);
          e.currentTarget.value = '';
        }}
      />
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
