import { useMemo } from 'react';
import { StyleSheet, View } from 'react-native';
import type { Layout } from '../../geometry/layoutSchema';
import { formatLength } from '../../geometry/units';
import type { PiecePhoto } from '../designer/PiecePhotos';
import { colourWords } from '../ui/colourWords';
import { Swatch } from '../ui/Swatch';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import { ProofPicture } from './ProofPicture';
import type { PublicProofView } from './schema';
import { ZoomablePicture } from './ZoomablePicture';

const inches = (value: number) => formatLength(value, '1/16');

/** The frozen design as the cut files will make it, with its outer size, mats and pieces in plain words. */
export function ProofDesign({ layout, drawing, pieces }: { layout: Layout; drawing: PublicProofView['drawing']; pieces: PublicProofView['pieces'] }) {
  const photos = useMemo(() => photosByPiece(pieces), [pieces]);
  return (
    <View style={styles.section}>
      {drawing ? (
        <ZoomablePicture aspectRatio={layout.outer.width / layout.outer.height}>
          <ProofPicture layout={layout} drawing={drawing} photos={photos} testID="proof-picture" style={styles.picture} />
        </ZoomablePicture>
      ) : (
        <Text>The picture of this design could not be drawn; the sizes and colours below are as frozen.</Text>
      )}
      <Text testID="proof-outer">
        Finished size of the mats: {inches(layout.outer.width)} wide by {inches(layout.outer.height)} high.
      </Text>
      <Text variant="heading">Mats, from the top</Text>
      {layout.mats.map((mat, i) => (
        <View key={mat.id} style={styles.row}>
          <Swatch face={mat.color} core={mat.coreColor} />
          <Text style={styles.rowText}>
            {i + 1}. {mat.name} ({colourWords(mat.color)}), with a {colourWords(mat.coreColor)} core showing at the bevel
          </Text>
        </View>
      ))}
      <Text variant="heading">Your pieces</Text>
      {pieces.length === 0 ? <Text variant="caption">No pieces are listed on this job.</Text> : null}
      {pieces.map((piece, i) => (
        <Text key={i} testID="proof-piece">
          {piece.label}: {inches(piece.widthIn)} by {inches(piece.heightIn)}
        </Text>
      ))}
      <Text variant="heading">Openings</Text>
      <Text>{layout.openings.length === 1 ? 'One opening is cut in the mats.' : `${layout.openings.length} openings are cut in the mats.`}</Text>
    </View>
  );
}

/** The pieces' photos as the designer's drawing takes them, by piece id. */
function photosByPiece(pieces: PublicProofView['pieces']): ReadonlyMap<string, PiecePhoto> {
  const byId = new Map<string, PiecePhoto>();
  for (const piece of pieces) {
    if (!piece.photo) continue;
    const { url, widthIn, heightIn, traced } = piece.photo;
    byId.set(piece.id, { href: url, widthIn, heightIn, ...(traced ? { traced } : {}) });
  }
  return byId;
}

const styles = StyleSheet.create({
  section: { gap: space.sm },
  picture: { width: '100%', height: '100%', maxHeight: undefined },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  rowText: { flex: 1 },
});
