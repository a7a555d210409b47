import { useQuery } from '@tanstack/react-query';
import { memo, useState, type Dispatch } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import type { Layout, LengthRounding } from '../../geometry';
import { pieceSizeText } from '../pieces/pieceSize';
import { pieceKindLabels } from '../pieces/schema';
import { Button } from '../ui/Button';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, radius, space } from '../ui/theme';
import type { EditorAction } from './editorState';
import { MAX_OPENINGS, MAX_OUTLINE_POINTS } from '../../geometry/layoutSchema';
import { newOpening, newShapeKinds, openingForPieceOf, outlineFromText, outlineOpening, shapeLabels } from './newOpenings';
import { pieceQueries } from '../pieces/queries';

interface Props {
  jobId: string;
  layout: Layout;
  defaultReveal: number;
  rounding: LengthRounding;
  dispatch: Dispatch<EditorAction>;
}

/**
 * Thousands grouped with commas ("10,000"). The first number formatted through
 * Intl on a page loads its locale data, a long task on a phone, for one label.
 */
function digitsGrouped(n: number): string {
  return String(n).replace(/\B(?=(\d{3})+(?!\d))/g, ',');
}

/** New openings: plain shapes, one sized for a piece of the job, or a traced outline pasted as points. */
export const AddWindowPanel = memo(function AddWindowPanel({ jobId, layout, defaultReveal, rounding, dispatch }: Props) {
  const pieces = useQuery(pieceQueries.job(jobId));
  const [outlineText, setOutlineText] = useState('');
  const [outlineError, setOutlineError] = useState<string | undefined>();

  const addOutline = () => {
    const read = outlineFromText(outlineText);
    if (!read.ok) return setOutlineError(read.error);
    setOutlineError(undefined);
    setOutlineText('');
    dispatch({ type: 'add', opening: outlineOpening(layout, read.points, defaultReveal) });
  };

  return (
    <View style={styles.panel} testID="add-window">
      <Text variant="label">Add opening</Text>
      <Text variant="caption" testID="opening-count">{layout.openings.length} of at most {MAX_OPENINGS} openings; outlines up to {digitsGrouped(MAX_OUTLINE_POINTS)} points.</Text>
      <View style={styles.grid}>
        {newShapeKinds.map((kind) => (
          <Button key={kind} kind="secondary" label={shapeLabels[kind]} testID={`add-${kind}`} onPress={() => dispatch({ type: 'add', opening: newOpening(layout, kind) })} />
        ))}
      </View>
      <Text variant="label">Opening for a piece</Text>
      {pieces.data?.pieces.length ? (
        <View style={styles.pieces}>
          {pieces.data.pieces.map((piece) => (
            <Pressable key={piece.id} role="button" aria-label={`Add an opening for ${piece.label}`} style={styles.piece} testID={`add-piece-${piece.id}`}
              onPress={() => dispatch({ type: 'add', opening: openingForPieceOf(layout, piece, defaultReveal) })}>
              <Text variant="label">{piece.label}</Text>
              <Text variant="caption">{pieceKindLabels[piece.kind]}, {pieceSizeText(piece.widthIn, piece.heightIn, rounding)}</Text>
            </Pressable>
          ))}
        </View>
      ) : (
        <Text variant="caption">{pieces.isPending ? 'Loading the pieces…' : 'This job has no pieces with sizes yet.'}</Text>
      )}
      <Text variant="caption">A photo opening overlaps the print by 1/4 in, a patch or plaque by 1/8 in; a garment gets 1/4 in of room (common practice).</Text>
      <TextField label="Traced outline (points in inches, JSON)" value={outlineText} onChangeText={setOutlineText} multiline error={outlineError}
        placeholder='[{"x": 0, "y": 0}, {"x": 10, "y": 0}, ...]' testID="outline-text" autoCapitalize="none" autoCorrect={false} />
      <Button kind="secondary" label="Add traced outline" onPress={addOutline} disabled={outlineText.trim() === ''} testID="add-outline" />
    </View>
  );
});

const styles = StyleSheet.create({
  panel: { gap: space.sm },
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  pieces: { gap: space.xs },
  piece: { minHeight: 44, padding: space.sm, borderWidth: 1, borderColor: colors.accent, borderRadius: radius.md, backgroundColor: colors.card },
});
