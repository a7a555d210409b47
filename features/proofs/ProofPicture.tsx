import { StyleSheet, View, type StyleProp, type ViewStyle } from 'react-native';
import Svg, { G, Path, Rect } from 'react-native-svg';
import type { Layout, MatLayerPaths } from '../../geometry';
import { PiecePhotos, type PiecePhoto } from '../designer/PiecePhotos';
import { colors } from '../ui/theme';

interface Props {
  layout: Layout;
  /** The mats' path data as the server drew them (top mat first). */
  drawing: readonly MatLayerPaths[];
  photos?: ReadonlyMap<string, PiecePhoto>;
  testID?: string;
  style?: StyleProp<ViewStyle>;
}

/**
 * The customer's picture of a frozen layout, drawn from the path data the
 * server sends with the proof, so this page loads none of the geometry that
 * works out bevels and reveals. Layered as the designer's picture: mounting
 * board, then each mat from the lowest up, core colour at the back edge under
 * the face colour at the face edge, a piece's photo under the lowest mat it shows through.
 */
export function ProofPicture({ layout, drawing, photos, testID, style }: Props) {
  const { width, height } = layout.outer;
  const layers = layout.mats.map((mat, index) => ({ mat, index, paths: drawing[index] })).reverse();
  return (
    <View style={[styles.box, style, { aspectRatio: width / height }]} testID={testID} role="img" aria-label="Read-only picture of the layout">
      <Svg width="100%" height="100%" viewBox={`0 0 ${width} ${height}`}>
        <Rect x={0} y={0} width={width} height={height} fill={layout.mountingBoard.color} />
        {layers.map(({ mat, index, paths }) => (
          <G key={mat.id} data-testid={`mat-layer-${index + 1}`}>
            {photos ? <PiecePhotos layout={layout} photos={photos} depth={index + 1} /> : null}
            {paths ? <Path d={paths.back} fill={mat.coreColor} fillRule="evenodd" /> : null}
            {paths ? <Path d={paths.face} fill={mat.color} fillRule="evenodd" /> : null}
          </G>
        ))}
        <Rect x={0} y={0} width={width} height={height} fill="none" stroke={colors.ink} strokeWidth={width / 400} />
      </Svg>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { width: '100%', maxHeight: 420, alignSelf: 'center' },
});
