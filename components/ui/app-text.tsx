import { Text, type TextProps } from 'react-native';
import { colors, type } from './theme';

type Variant = keyof typeof type;

export interface AppTextProps extends TextProps {
  variant?: Variant;
  tone?: 'ink' | 'muted' | 'danger' | 'inverse' | 'ember' | 'moss';
}

const tones = {
  ink: colors.ink,
  muted: colors.muted,
  danger: colors.danger,
  inverse: colors.surface,
  ember: colors.ember,
  moss: colors.moss,
} as const;

/** All text in Kenning goes through this, so Barlow and the type scale apply everywhere. */
export function AppText({ variant = 'body', tone = 'ink', style, ...rest }: AppTextProps) {
  const role = variant === 'display' || variant === 'title' ? 'heading' : undefined;
  return <Text role={role} style={[type[variant], { color: tones[tone] }, style]} {...rest} />;
}
