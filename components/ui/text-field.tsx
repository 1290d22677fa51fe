import { forwardRef, useId, useState } from 'react';
import { StyleSheet, TextInput, View, type TextInputProps } from 'react-native';
import { AppText } from './app-text';
import { colors, fonts, radius, space, TOUCH } from './theme';

export interface TextFieldProps extends TextInputProps {
  label: string;
  /** Shown under the input in the danger tone. */
  error?: string;
  hint?: string;
  /** Unit shown inside the field's right edge, e.g. "m". */
  unit?: string;
}

/** A labelled input with its error under it; the error is announced to screen readers. */
export const TextField = forwardRef<TextInput, TextFieldProps>(function TextField(
  { label, error, hint, unit, style, onFocus, onBlur, ...rest },
  ref,
) {
  const id = useId();
  const [focused, setFocused] = useState(false);
  return (
    <View style={styles.wrap}>
      <AppText variant="label" nativeID={`${id}-label`}>
        {label}
      </AppText>
      <View style={[styles.box, focused && styles.focused, !!error && styles.invalid]}>
        <TextInput
          ref={ref}
          aria-labelledby={`${id}-label`}
          aria-invalid={!!error}
          aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
          placeholderTextColor={colors.muted}
          style={[styles.input, style]}
          onFocus={(e) => {
            setFocused(true);
            onFocus?.(e);
          }}
          onBlur={(e) => {
            setFocused(false);
            onBlur?.(e);
          }}
          {...rest}
        />
        {unit ? (
          <AppText variant="small" tone="muted" style={styles.unit}>
            {unit}
          </AppText>
        ) : null}
      </View>
      {error ? (
        <AppText variant="small" tone="danger" nativeID={`${id}-error`} role="alert">
          {error}
        </AppText>
      ) : hint ? (
        <AppText variant="small" tone="muted" nativeID={`${id}-hint`}>
          {hint}
        </AppText>
      ) : null}
    </View>
  );
});

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  box: {
    flexDirection: 'row',
    alignItems: 'center',
    minHeight: TOUCH + 4,
    borderWidth: 1.5,
    borderColor: colors.lineStrong,
    borderRadius: radius.md,
    backgroundColor: colors.surface,
  },
  focused: { borderColor: colors.focus },
  invalid: { borderColor: colors.danger },
  input: {
    flex: 1,
    minWidth: 0,
    minHeight: TOUCH,
    paddingHorizontal: space.md,
    fontFamily: fonts.regular,
    fontSize: 16,
    color: colors.ink,
    outlineStyle: 'none',
  } as object,
  unit: { paddingRight: space.md },
});
