import { memo } from 'react';
import type { Dispatch } from 'react';
import { StyleSheet, View } from 'react-native';
import type { AlignEdge } from '../../geometry';
import { Button } from '../ui/Button';
import { Text } from '../ui/Text';
import { space } from '../ui/theme';
import type { EditorAction } from './editorState';

/** Common practice: a bottom border about 1/2 in wider than the top looks centred to the eye. */
const WEIGHTED_BOTTOM_IN = 0.5;

const ALIGN: { edge: AlignEdge; label: string }[] = [
  { edge: 'left', label: 'Left edges' },
  { edge: 'centerX', label: 'Centres across' },
  { edge: 'right', label: 'Right edges' },
  { edge: 'top', label: 'Top edges' },
  { edge: 'centerY', label: 'Centres down' },
  { edge: 'bottom', label: 'Bottom edges' },
];

/** Copying, removing and lining up the chosen openings (all openings when none is chosen, for centring). */
export const ArrangePanel = memo(function ArrangePanel({ dispatch, selectionCount }: { dispatch: Dispatch<EditorAction>; selectionCount: number }) {
  const none = selectionCount === 0;
  return (
    <View style={styles.panel} testID="arrange">
      <View style={styles.grid}>
        <Button kind="secondary" label="Duplicate" disabled={none} onPress={() => dispatch({ type: 'duplicate' })} testID="duplicate" />
        <Button kind="secondary" label="Delete" disabled={none} onPress={() => dispatch({ type: 'remove' })} testID="delete" />
      </View>
      <Text variant="label">Line up the chosen openings</Text>
      <View style={styles.grid}>
        {ALIGN.map((a) => (
          <Button key={a.edge} kind="secondary" label={a.label} disabled={selectionCount < 2} onPress={() => dispatch({ type: 'align', edge: a.edge })} />
        ))}
        <Button kind="secondary" label="Even gaps across" disabled={selectionCount < 3} onPress={() => dispatch({ type: 'distribute', axis: 'horizontal' })} />
        <Button kind="secondary" label="Even gaps down" disabled={selectionCount < 3} onPress={() => dispatch({ type: 'distribute', axis: 'vertical' })} />
      </View>
      <Text variant="caption">Shift-click or Shift-tap openings to choose more than one. Hold Alt while dragging to place an opening without it jumping to nearby lines.</Text>
      <Text variant="label">Pairs and groups</Text>
      <View style={styles.grid}>
        <Button kind="secondary" label="Mirror second onto first" disabled={selectionCount !== 2} onPress={() => dispatch({ type: 'mirrorPair' })} testID="mirror" />
        <Button kind="secondary" label="Turn group 90°" disabled={none} onPress={() => dispatch({ type: 'quarterTurnGroup', clockwise: true })} />
        <Button kind="secondary" label="Centre on the mat" onPress={() => dispatch({ type: 'centreGroup', bottomWeight: 0 })} testID="centre" />
        <Button kind="secondary" label="Centre, weighted bottom" onPress={() => dispatch({ type: 'centreGroup', bottomWeight: WEIGHTED_BOTTOM_IN })} testID="centre-weighted" />
      </View>
      <Text variant="caption">Keys: arrows nudge by the shop's rounding (Shift: 1 in), Ctrl/Cmd+Z undo, Shift+Ctrl/Cmd+Z or Ctrl+Y redo, Ctrl/Cmd+D duplicate, Delete removes.</Text>
    </View>
  );
});

const styles = StyleSheet.create({
  panel: { gap: space.sm },
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
});
