import type { ReactNode } from 'react';
import { View } from 'react-native';
import { Segmented } from '@/components/check/unit-switch';
import { AppText } from '@/components/ui/app-text';
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

/** The ways to enter a geometry (drawing, typing, importing…), one at a time, and the chosen one's panel below. */
export function EntryModes<M extends string>({
  mode,
  onMode,
  options,
  children,
}: {
  mode: M;
  onMode: (mode: M) => void;
  options: { value: M; label: string }[];
  children: ReactNode;
}) {
  return (
    <View style={{ gap: space.sm }}>
      <Segmented<M> label="Enter it by" value={mode} onChange={onMode} options={options} />
      {children}
    </View>
  );
}
