import type { ReactNode } from 'react';
import { View } from 'react-native';
import { Segmented } from '@/components/check/unit-switch';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { colors, radius, space } from '@/components/ui/theme';

/**
 * The box of one geometry field (an outline, a shoreline): its label, what it
 * holds now (announced), its error (the form's or the server's, announced),
 * then the ways to enter it.
 */
export function GeometryFieldBox({
  label,
  summary,
  error,
  ariaLabel,
  children,
}: {
  label: string;
  summary: string;
  error?: string;
  /** A name for the whole box (for screen readers), if it needs one. */
  ariaLabel?: string;
  children: ReactNode;
}) {
  return (
    <View
      style={{
        gap: space.sm,
        padding: space.md,
        borderRadius: radius.md,
        borderWidth: 1,
        borderColor: error ? colors.danger : colors.line,
      }}
      aria-label={ariaLabel}
    >
      <AppText variant="label">{label}</AppText>
      <AppText tone="muted" aria-live="polite">
        {summary}
      </AppText>
      {error ? (
        <AppText variant="small" tone="danger" role="alert">
          {error}
        </AppText>
      ) : null}
      {children}
    </View>
  );
}

/**
 * How a geometry field's value is entered. Shut: a button that opens it, and
 * one that removes the value where `onRemove` is given. Open: the ways to
 * enter it, drawing on the map first, one at a time, and the chosen one's
 * panel below.
 */
export function GeometryEntry<M extends string>({
  editing,
  openLabel,
  onOpen,
  removeLabel,
  onRemove,
  mode,
  onMode,
  otherModes,
  children,
}: {
  editing: boolean;
  openLabel: string;
  onOpen: () => void;
  removeLabel: string;
  onRemove?: () => void;
  mode: M | 'draw';
  onMode: (mode: M | 'draw') => void;
  /** The ways after drawing on the map. */
  otherModes: { value: M; label: string }[];
  children: ReactNode;
}) {
  if (!editing) {
    return (
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button kind="secondary" label={openLabel} onPress={onOpen} />
        {onRemove ? <Button kind="quiet" label={removeLabel} onPress={onRemove} /> : null}
      </View>
    );
  }
  return (
    <View style={{ gap: space.sm }}>
      <Segmented<M | 'draw'>
        label="Enter it by"
        value={mode}
        onChange={onMode}
        options={[{ value: 'draw', label: 'Drawing on the map' }, ...otherModes]}
      />
      {children}
    </View>
  );
}
