import { Link } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { useShopRounding } from '../settings/queries';
import { Button } from '../ui/Button';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import { PhotoThumb } from './PhotoThumb';
import { PhotoUpload } from './PhotoUpload';
import { PieceForm } from './PieceForm';
import { pieceSizeText } from './pieceSize';
import { useDeletePiece } from './queries';
import { pieceKindLabels, type Piece } from './schema';

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;

/** One piece: what it is, its size, its photos, and the ways to change or remove it. */
export function PieceRow({ jobId, piece }: { jobId: string; piece: Piece }) {
  const [editing, setEditing] = useState(false);
  const [confirming, setConfirming] = useState(false);
  const remove = useDeletePiece(jobId);
  const rounding = useShopRounding();

  if (editing) return <PieceForm jobId={jobId} piece={piece} onDone={() => setEditing(false)} />;
  return (
    <View style={styles.row} testID={`piece-row-${piece.label}`}>
      <View style={styles.head}>
        <View style={styles.kind}>
          <Text variant="label">{pieceKindLabels[piece.kind]}</Text>
        </View>
        <Text variant="heading" style={styles.label}>
          {piece.label}
        </Text>
        <Text testID="piece-size">{pieceSizeText(piece.widthIn, piece.heightIn, rounding)}</Text>
        <View style={styles.actions}>
          <Button label="Change" kind="quiet" onPress={() => setEditing(true)} testID={`edit-piece-${piece.label}`} />
          <Button label="Remove" kind="quiet" onPress={() => setConfirming(true)} testID={`remove-piece-${piece.label}`} />
        </View>
      </View>
      {piece.notes ? <Text variant="caption">{piece.notes}</Text> : null}
      {piece.photos.length > 0 ? (
        <View style={styles.photos}>
          {piece.photos.map((photo) => (
            <PhotoThumb key={photo.id} jobId={jobId} photo={photo} pieceLabel={piece.label} />
          ))}
        </View>
      ) : null}
      <PhotoUpload jobId={jobId} pieceId={piece.id} pieceLabel={piece.label} />
      {piece.kind === 'garment' ? (
        <Link href={{ pathname: '/trace/[pieceId]', params: { pieceId: piece.id, job: jobId } }} testID={`trace-piece-${piece.label}`} style={styles.trace}>
          <Text style={styles.traceText}>{piece.outline ? 'Trace the outline again' : 'Trace the outline from a photo'}</Text>
        </Link>
      ) : null}
      {piece.outline ? <Text variant="caption" testID="piece-outline-saved">Traced outline saved ({piece.outline.points.length} points).</Text> : null}
      {confirming ? (
        <View style={styles.confirm} role="alert">
          <Text>
            Remove {piece.label}
            {piece.photos.length ? ` and its ${plural(piece.photos.length, 'photo')}` : ''}? A layout that shows it keeps the opening and its size.
          </Text>
          {remove.isError ? <Text style={styles.problem}>{remove.error.message}</Text> : null}
          <View style={styles.confirmActions}>
            <Button label="Keep it" kind="quiet" onPress={() => setConfirming(false)} />
            <Button label="Remove piece" busy={remove.isPending} onPress={() => remove.mutate(piece.id)} testID="confirm-remove-piece" />
          </View>
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { gap: space.sm, paddingVertical: space.md, borderTopWidth: 1, borderTopColor: colors.line },
  head: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  kind: { backgroundColor: colors.accentSoft, borderRadius: radius.sm, paddingHorizontal: space.sm, paddingVertical: 2 },
  label: { flexShrink: 1 },
  photos: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  actions: { flexDirection: 'row', marginLeft: 'auto' },
  confirm: { gap: space.sm, padding: space.md, borderRadius: radius.md, backgroundColor: colors.warnSoft, borderWidth: 1, borderColor: colors.warn },
  confirmActions: { flexDirection: 'row', justifyContent: 'flex-end', gap: space.sm },
  problem: { color: colors.danger },
  trace: { alignSelf: 'flex-start', paddingVertical: space.xs },
  traceText: { color: colors.accent, textDecorationLine: 'underline' },
});
