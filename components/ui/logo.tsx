import { View } from 'react-native';
import Svg, { Circle, Line, Path } from 'react-native-svg';
import { AppText } from './app-text';
import { colors, space } from './theme';

/** The Kenning mark: an eye above the earth's curve, its sight line touching the horizon. */
export function LogoMark({ size = 36, inverse = false }: { size?: number; inverse?: boolean }) {
  const fg = inverse ? colors.lantern : colors.ember;
  const earth = inverse ? colors.railText : colors.ink;
  return (
    <Svg width={size} height={size} viewBox="0 0 40 40" aria-hidden>
      <Path d="M2 34 Q20 22 38 34" stroke={earth} strokeWidth={3} fill="none" strokeLinecap="round" />
      <Line x1="7" y1="9" x2="36" y2="26" stroke={fg} strokeWidth={2.4} strokeLinecap="round" />
      <Circle cx="7" cy="9" r="4" fill={fg} />
    </Svg>
  );
}

export function Wordmark({ inverse = false }: { inverse?: boolean }) {
  return (
    <View style={{ flexDirection: 'row', alignItems: 'center', gap: space.sm }} aria-label="Kenning">
      <LogoMark inverse={inverse} />
      <AppText variant="title" tone={inverse ? 'inverse' : 'ink'} style={{ letterSpacing: 1.5 }}>
        KENNING
      </AppText>
    </View>
  );
}
