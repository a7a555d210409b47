import { useRef, useState, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { Button } from '../ui/Button';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import { pannedBy, pinched, tapped, ZOOM_MAX, ZOOM_MIN, zoomFit, zoomPressed, type FrameSize, type ZoomKey, type ZoomView } from './proofZoom';
import { useZoomGestures } from './useZoomGestures';

/** Tallest the picture's frame grows on a wide screen, in pixels. */
const FRAME_MAX_HEIGHT = 420;

/**
 * The design in a frame that zooms and pans: pinch with two fingers, drag
 * with one once zoomed, tap to zoom in (tap again for the whole design), or
 * the buttons and keys (+, -, 0, arrows) for anyone who cannot pinch.
 */
export function ZoomablePicture({ aspectRatio, children }: { aspectRatio: number; children: ReactNode }) {
  const frame = useRef<View>(null);
  const [size, setSize] = useState<FrameSize>({ width: 1, height: 1 });
  const [view, setView] = useState<ZoomView>(zoomFit);
  const zoomed = view.scale > ZOOM_MIN;
  const press = (key: ZoomKey) => setView((v) => zoomPressed(v, key, size));
  useZoomGestures(frame, zoomed, {
    onTap: (spot) => setView((v) => tapped(v, spot, size)),
    onPan: (dx, dy) => setView((v) => pannedBy(v, dx, dy, size)),
    onPinch: (before, after) => setView((v) => pinched(v, before, after, size)),
    onKey: press,
  });
  return (
    <View style={styles.box}>
      <View
        ref={frame}
        tabIndex={0}
        role="group"
        aria-label="The design. Pinch or tap to zoom; with a keyboard, plus and minus zoom, the arrows move, 0 shows it whole."
        onLayout={(e) => setSize({ width: e.nativeEvent.layout.width || 1, height: e.nativeEvent.layout.height || 1 })}
        style={[styles.frame, { aspectRatio, maxWidth: FRAME_MAX_HEIGHT * aspectRatio }]}
        testID="proof-zoom-frame"
      >
        <View
          style={[styles.content, { transform: [{ translateX: view.x }, { translateY: view.y }, { scale: view.scale }] }]}
          testID="proof-zoom-content"
        >
          {children}
        </View>
      </View>
      <View style={styles.controls}>
        <Button kind="secondary" label="Zoom in" onPress={() => press('in')} disabled={view.scale >= ZOOM_MAX} testID="proof-zoom-in" />
        <Button kind="secondary" label="Zoom out" onPress={() => press('out')} disabled={!zoomed} testID="proof-zoom-out" />
        <Button kind="secondary" label="Whole design" onPress={() => press('fit')} disabled={!zoomed} testID="proof-zoom-fit" />
      </View>
      {zoomed ? (
        <View style={styles.controls}>
          <Button kind="quiet" label="Move left" onPress={() => press('left')} testID="proof-pan-left" />
          <Button kind="quiet" label="Move right" onPress={() => press('right')} testID="proof-pan-right" />
          <Button kind="quiet" label="Move up" onPress={() => press('up')} testID="proof-pan-up" />
          <Button kind="quiet" label="Move down" onPress={() => press('down')} testID="proof-pan-down" />
        </View>
      ) : null}
      <Text variant="caption" testID="proof-zoom-note">
        {zoomed
          ? `Enlarged ${Math.round(view.scale * 10) / 10} times. Drag to look around; tap once to see the whole design.`
          : 'Pinch or tap the picture to look closer.'}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.sm },
  frame: { width: '100%', alignSelf: 'center', overflow: 'hidden', borderRadius: radius.md, backgroundColor: colors.card },
  content: { position: 'absolute', left: 0, top: 0, right: 0, bottom: 0, transformOrigin: 'left top' },
  controls: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
