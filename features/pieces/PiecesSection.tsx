import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import { PieceForm } from './PieceForm';
import { PieceRow } from './PieceRow';
import { pieceQueries } from './queries';

/** The job's physical pieces with their real sizes and photos, for the job detail screen. */
export function PiecesSection({ jobId }: { jobId: string }) {
  const pieces = useQuery(pieceQueries.job(jobId));
  const [adding, setAdding] = useState(false);

  return (
    <View style={styles.card} testID="pieces-section">
      <View style={styles.head}>
        <Text variant="heading">Pieces</Text>
        {adding ? null : <Button label="Add a piece" kind="secondary" onPress={() => setAdding(true)} testID="add-piece" />}
      </View>
      {adding ? <PieceForm jobId={jobId} onDone={() => setAdding(false)} /> : null}
      {pieces.isPending ? <ActivityIndicator color={colors.accent} /> : null}
      {pieces.isError ? <Notice title="The pieces could not be loaded">{pieces.error.message}</Notice> : null}
      {pieces.data?.pieces.length === 0 && !adding ? (
        <Text variant="caption" testID="pieces-empty">
          No pieces yet. Add the garment, photos, patches and plaque with their measured sizes.
        </Text>
      ) : null}
      {pieces.data?.pieces.map((piece) => <PieceRow key={piece.id} jobId={jobId} piece={piece} />)}
    </View>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.sm, backgroundColor: colors.card, padding: space.lg, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.line },
  head: { flexDirection: 'row', flexWrap: 'wrap', justifyContent: 'space-between', alignItems: 'center', gap: space.sm },
});
