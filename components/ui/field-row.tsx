import { Children, type ReactNode } from 'react';
import { View } from 'react-native';
import { space } from './theme';

export interface FieldRowProps {
  children: ReactNode;
  /** Narrowest a field may be before it wraps, px (default 100). */
  minWidth?: number;
  /** Space between the fields, px (default `space.sm`). */
  gap?: number;
}

/**
 * Fields side by side, each an equal share of the row and at least `minWidth` wide, wrapping onto the next line
 * where the screen is too narrow for them all (a phone).
 */
export function FieldRow({ children, minWidth = 100, gap = space.sm }: FieldRowProps) {
  return (
    <View style={{ flexDirection: 'row', gap, flexWrap: 'wrap' }}>
      {Children.map(children, (child) =>
        child == null || typeof child === 'boolean' ? null : <View style={{ flex: 1, minWidth }}>{child}</View>,
      )}
    </View>
  );
}
