import { useMemo } from 'react';
import { StyleSheet, View, type StyleProp, type ViewStyle } from 'react-native';
import Svg, { Rect } from 'react-native-svg';
import type { Layout } from '../../geometry';
import { createLayoutEngine } from '../../geometry/engine';
import { colors } from '../ui/theme';
import { MatStackDrawing } from './MatStackDrawing';
import type { PiecePhoto } from './PiecePhotos';

/** A still picture of a layout, e.g. a frozen version: nothing on it can be moved. */
export function MatPreview({ layout, testID, style, photos }: { layout: Layout; testID?: string; style?: StyleProp<ViewStyle>; photos?: ReadonlyMap<string, PiecePhoto> }) {
  const lines = useMemo(() => createLayoutEngine().lines(layout), [layout]);
  const { width, height } = layout.outer;
  return (
    <View style={[styles.box, style, { aspectRatio: width / height }]} testID={testID} role="img" aria-label="Read-only picture of the layout">
      <Svg width="100%" height="100%" viewBox={`0 0 ${width} ${height}`}>
        <MatStackDrawing layout={layout} lines={lines} photos={photos} />
        <Rect x={0} y={0} width={width} height={height} fill="none" stroke={colors.ink} strokeWidth={width / 400} />
      </Svg>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { width: '100%', maxHeight: 420, alignSelf: 'center' },
});
