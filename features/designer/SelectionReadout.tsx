import { StyleSheet, View } from 'react-native';
import type { LengthRounding, OpeningLines } from '../../geometry';
import { formatLength, polygonsBounds } from '../../geometry';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import type { EditorState } from './editorState';

/** The chosen opening's sight size and where its centre sits, in the shop's rounding, while it moves. */
export function SelectionReadout({ state, lines, rounding }: { state: EditorState; lines: ReadonlyMap<string, OpeningLines>; rounding: LengthRounding }) {
  if (state.selection.length !== 1) return null;
  const opening = state.layout.openings.find((o) => o.id === state.selection[0]);
  const box = opening ? polygonsBounds(lines.get(opening.id)?.sight.polygons ?? []) : null;
  if (!opening || !box) return null;
  const f = (v: number) => formatLength(v, rounding);
  return (
    <View style={styles.box} pointerEvents="none" testID="selection-readout">
      <Text variant="label">
        {opening.id}: {f(box.w)} x {f(box.h)} sight
      </Text>
      <Text variant="caption">
        centre {f(opening.center.x)} from left, {f(opening.center.y)} from top{opening.rotation ? `, turned ${opening.rotation}°` : ''}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    position: 'absolute', left: space.sm, bottom: space.sm, maxWidth: '80%', backgroundColor: colors.card, borderRadius: radius.sm,
    paddingHorizontal: space.sm, paddingVertical: space.xs, borderWidth: 1, borderColor: colors.line,
  },
});
