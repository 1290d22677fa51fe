import { useWindowDimensions } from 'react-native';
import { WIDE_BREAKPOINT } from './theme';

/** Phone first: `wide` switches on the side rail and two-pane layouts. */
export function useLayout() {
  const { width } = useWindowDimensions();
  return { width, wide: width >= WIDE_BREAKPOINT };
}
