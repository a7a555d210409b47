import { memo, useCallback, type Dispatch } from 'react';
import { StyleSheet, View } from 'react-native';
import type { Layout, LengthRounding, OpeningLines } from '../../geometry';
import { formatLength } from '../../geometry/units';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { space } from '../ui/theme';
import type { EditorAction } from './editorState';
import { degreesReader, lengthReaders, outerSideLimit, revealLimit } from './fieldReaders';
import { MeasureField } from './MeasureField';
import { shapeLabels } from './newOpenings';
import { OpeningNumbersList } from './OpeningNumbersList';
import { OpeningSizeFields } from './OpeningSizeFields';

interface Props {
  layout: Layout;
  selection: readonly string[];
  /** Why the last change was refused, in plain words. */
  refusal: string | null;
  /** True while an opening is dragged or resized. */
  moving: boolean;
  lines: ReadonlyMap<string, OpeningLines>;
  dispatch: Dispatch<EditorAction>;
  rounding: LengthRounding;
  editable: boolean;
}

/** The chosen opening's numbers, typed the framer's way; with nothing chosen, the layout's outer size. */
export const OpeningProperties = memo(function OpeningProperties({ layout, selection, refusal: refused, moving, lines, dispatch, rounding, editable }: Props) {
  const show = useCallback((v: number) => formatLength(v, rounding), [rounding]);
  const showDegrees = useCallback((v: number) => `${v}°`, []);
  const { anyLength, outerSideLength, revealLength } = lengthReaders(rounding);
  const opening = selection.length === 1 ? layout.openings.find((o) => o.id === selection[0]) : undefined;
  const refusal = refused ? <Notice title="Not changed">{refused}</Notice> : null;

  if (!opening) {
    return (
      <View style={styles.panel}>
        {refusal}
        <Text variant="caption">{selection.length > 1 ? `${selection.length} openings chosen: use Arrange to line them up.` : 'Tap an opening on the canvas to edit it.'}</Text>
        <Text variant="label">Layout outer size</Text>
        <MeasureField label="Outer width" value={layout.outer.width} show={show} read={outerSideLength} hint={outerSideLimit} editable={editable} testID="field-outer-width"
          onCommit={(width) => dispatch({ type: 'resizeOuter', width, height: layout.outer.height })} />
        <MeasureField label="Outer height" value={layout.outer.height} show={show} read={outerSideLength} hint={outerSideLimit} editable={editable} testID="field-outer-height"
          onCommit={(height) => dispatch({ type: 'resizeOuter', width: layout.outer.width, height })} />
      </View>
    );
  }

  const { id } = opening;
  const patch = (changes: Parameters<typeof dispatchPatch>[2]) => dispatchPatch(dispatch, id, changes);
  return (
    <View style={styles.panel} testID="opening-properties">
      {refusal}
      <Text variant="heading">{id}</Text>
      <Text variant="caption">{shapeLabels[opening.shape.kind]}</Text>
      <OpeningSizeFields opening={opening} rounding={rounding} dispatch={dispatch} editable={editable} />
      <View style={styles.pair}>
        <View style={styles.half}>
          <MeasureField label="Centre from left" value={opening.center.x} show={show} read={anyLength} editable={editable} testID="field-x"
            onCommit={(x) => patch({ center: { x, y: opening.center.y } })} />
        </View>
        <View style={styles.half}>
          <MeasureField label="Centre from top" value={opening.center.y} show={show} read={anyLength} editable={editable} testID="field-y"
            onCommit={(y) => patch({ center: { x: opening.center.x, y } })} />
        </View>
      </View>
      <MeasureField label="Turn (degrees, clockwise)" value={opening.rotation} show={showDegrees} read={degreesReader} editable={editable} testID="field-rotation"
        onCommit={(rotation) => patch({ rotation })} />
      <View style={styles.row}>
        <Button kind="secondary" label="Turn 90° left" disabled={!editable} onPress={() => dispatch({ type: 'turn', degrees: -90 })} testID="turn-left" />
        <Button kind="secondary" label="Turn 90° right" disabled={!editable} onPress={() => dispatch({ type: 'turn', degrees: 90 })} testID="turn-right" />
      </View>
      <DepthStepper depth={opening.depth} matCount={layout.mats.length} editable={editable} onChange={(depth) => patch({ depth })} />
      {opening.reveals.map((reveal, k) => (
        <MeasureField key={k} label={`Reveal of mat ${k + 2} (${layout.mats[k + 1]?.name ?? ''})`} value={reveal} show={show} read={revealLength}
          hint={revealLimit} editable={editable} testID={`field-reveal-${k + 2}`}
          onCommit={(value) => patch({ reveals: opening.reveals.map((r, i) => (i === k ? value : r)) })} />
      ))}
      <MeasureField label="Room around the piece (minus = mat overlaps it)" value={opening.clearance} show={show} read={anyLength} editable={editable}
        testID="field-clearance" onCommit={(clearance) => patch({ clearance })} />
      <OpeningNumbersList layout={layout} lines={lines} openingId={id} rounding={rounding} moving={moving} />
    </View>
  );
});

function dispatchPatch(dispatch: Dispatch<EditorAction>, id: string, changes: Extract<EditorAction, { type: 'patch' }>['changes']) {
  dispatch({ type: 'patch', id, changes });
}

function DepthStepper({ depth, matCount, editable, onChange }: { depth: number; matCount: number; editable: boolean; onChange: (depth: number) => void }) {
  return (
    <View style={styles.row}>
      <Button kind="secondary" label="Fewer mats" disabled={!editable || depth <= 1} onPress={() => onChange(depth - 1)} testID="depth-less" />
      <Text variant="label" testID="depth-text" aria-live="polite">
        Cuts {depth} of {matCount} mat{matCount === 1 ? '' : 's'} (top {depth === 1 ? 'mat only' : `${depth}`})
      </Text>
      <Button kind="secondary" label="More mats" disabled={!editable || depth >= matCount} onPress={() => onChange(depth + 1)} testID="depth-more" />
    </View>
  );
}

const styles = StyleSheet.create({
  panel: { gap: space.md },
  pair: { flexDirection: 'row', gap: space.sm },
  half: { flex: 1, minWidth: 0 },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
});
