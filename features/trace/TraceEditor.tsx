import { useReducer, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { polygonArea, polygonBounds } from '../../geometry/polygon';
import { ApiError } from '../api/client';
import { Button } from '../ui/Button';
import { ChoiceChips } from '../ui/ChoiceChips';
import { Text } from '../ui/Text';
import { colors, space } from '../ui/theme';
import { OutlineCanvas } from './OutlineCanvas';
import { editOutline, startEditing } from './outlineEdits';
import { traceImageUrl, useSaveOutline } from './queries';
import type { TraceRun } from './schema';

interface Props {
  jobId: string;
  pieceId: string;
  trace: TraceRun & { result: NonNullable<TraceRun['result']> };
  onSaved: () => void;
}

/** The automatic outline over the squared photo, to correct and keep on the garment. */
export function TraceEditor({ jobId, pieceId, trace, onSaved }: Props) {
  const [state, dispatch] = useReducer(editOutline, trace.result.points, startEditing);
  const [selected, setSelected] = useState<number | null>(null);
  const [tool, setTool] = useState<'nodes' | 'move'>('nodes');
  const save = useSaveOutline(jobId, pieceId);
  const box = polygonBounds(state.points);

  return (
    <View style={styles.box}>
      <Text variant="caption">
        Drag a node to move it; press an edge to add a node. The photo is squared to the rectangle and drawn at true scale: the outline is {box.w.toFixed(2)} x {box.h.toFixed(2)} in, {polygonArea(state.points).toFixed(1)} sq in.
      </Text>
      <ChoiceChips label="Dragging moves" value={tool} onChange={setTool} testID="outline-tool" options={[{ value: 'nodes', label: 'One node' }, { value: 'move', label: 'The whole outline' }]} />
      <OutlineCanvas imageHref={traceImageUrl(trace.id)} widthIn={trace.result.imageWidthIn} heightIn={trace.result.imageHeightIn} points={state.points} dispatch={dispatch}
        selected={selected} onSelect={setSelected} tool={tool} />
      <View style={styles.row}>
        <Button kind="secondary" label="Undo" disabled={state.past.length === 0} onPress={() => dispatch({ type: 'undo' })} testID="outline-undo" />
        <Button kind="secondary" label="Redo" disabled={state.future.length === 0} onPress={() => dispatch({ type: 'redo' })} testID="outline-redo" />
        <Button kind="secondary" label="Delete node" disabled={selected === null} onPress={() => { dispatch({ type: 'deleteNode', index: selected! }); setSelected(null); }} testID="outline-delete" />
        <Button kind="secondary" label="Smooth around node" disabled={selected === null} onPress={() => dispatch({ type: 'smooth', index: selected!, reach: 3 })} testID="outline-smooth" />
        <Button kind="quiet" label="Back to the automatic trace" onPress={() => dispatch({ type: 'reset' })} testID="outline-reset" />
      </View>
      {save.isError ? <Text style={styles.problem} role="alert">{save.error instanceof ApiError ? save.error.message : 'The outline could not be saved. Try again.'}</Text> : null}
      {save.isSuccess ? <Text testID="outline-saved">Saved on the garment. Add it in the designer under “Opening for a piece”.</Text> : null}
      <Button label="Save the outline on the garment" busy={save.isPending} onPress={() => save.mutate({ traceId: trace.id, points: [...state.points] }, { onSuccess: onSaved })} testID="save-outline" />
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.md },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  problem: { color: colors.danger },
});
