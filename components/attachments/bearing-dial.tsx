import Svg, { Circle, Line, Path } from 'react-native-svg';
import { colors } from '@/components/ui/theme';

/**
 * A small dial with a needle along a bearing (clockwise from north, up).
 * Decorative: the bearing is always written beside it.
 */
export function BearingDial({
  bearingDeg,
  size = 28,
  color = colors.ink,
}: {
  bearingDeg: number;
  size?: number;
  color?: string;
}) {
  const r = 10;
  const a = (bearingDeg * Math.PI) / 180;
  const tip = { x: 12 + r * Math.sin(a), y: 12 - r * Math.cos(a) };
  return (
    <Svg width={size} height={size} viewBox="0 0 24 24" aria-hidden>
      <Circle cx={12} cy={12} r={r + 1} fill={colors.surface} stroke={color} strokeWidth={1.4} />
      <Path d="M12 1.5 10.6 4h2.8z" fill={color} />
      <Line x1={12} y1={12} x2={tip.x} y2={tip.y} stroke={colors.ember} strokeWidth={2.2} strokeLinecap="round" />
      <Circle cx={12} cy={12} r={1.6} fill={color} />
    </Svg>
  );
}
