import { useState } from 'react';
import { ScrollView, StyleSheet, View, type NativeScrollEvent, type NativeSyntheticEvent } from 'react-native';
import { AppText } from './app-text';
import { colors, radius, space } from './theme';

/** Pixels of slack before a side counts as having more to show. */
const SLACK = 2;

/** Which sides of a horizontal scroller hide content: pure, for the cue and its tests. */
export function hiddenSides(viewportPx: number, contentPx: number, scrollXPx: number): { left: boolean; right: boolean } {
  return { left: scrollXPx > SLACK, right: scrollXPx + viewportPx < contentPx - SLACK };
}

/**
 * A sideways scroller for wide tables that says when columns are off-screen:
 * a line above it ("More columns → scroll sideways") and a shaded edge on
 * the side that hides something. Nothing shows when everything fits.
 */
export function HorizontalScrollCue({ children, label = 'columns' }: { children: React.ReactNode; label?: string }) {
  const [viewport, setViewport] = useState(0);
  const [content, setContent] = useState(0);
  const [x, setX] = useState(0);
  const hidden = viewport > 0 ? hiddenSides(viewport, content, x) : { left: false, right: false };
  const onScroll = (e: NativeSyntheticEvent<NativeScrollEvent>) => setX(e.nativeEvent.contentOffset.x);
  return (
    <View style={{ gap: space.xs }}>
      {hidden.left || hidden.right ? (
        <AppText variant="small" tone="muted" style={{ alignSelf: 'flex-end' }} role="status">
          {hidden.right ? `More ${label} → scroll sideways` : `← more ${label} to the left`}
        </AppText>
      ) : null}
      <View>
        <ScrollView
          horizontal
          contentContainerStyle={{ minWidth: '100%' }}
          onLayout={(e) => setViewport(e.nativeEvent.layout.width)}
          onContentSizeChange={(w) => setContent(w)}
          onScroll={onScroll}
          scrollEventThrottle={32}
        >
          {children}
        </ScrollView>
        {hidden.left ? <View style={[styles.edge, styles.left]} pointerEvents="none" /> : null}
        {hidden.right ? <View style={[styles.edge, styles.right]} pointerEvents="none" /> : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  edge: { position: 'absolute', top: 0, bottom: 0, width: 14, backgroundColor: colors.ink, opacity: 0.14 },
  left: { left: 0, borderTopLeftRadius: radius.lg, borderBottomLeftRadius: radius.lg },
  right: { right: 0, borderTopRightRadius: radius.lg, borderBottomRightRadius: radius.lg },
});
