import { useMemo } from 'react';
import { StyleSheet, View } from 'react-native';
import type { LengthRounding, OpeningLines } from '../../geometry';
import { formatLength, polygonsBounds } from '../../geometry';
import { Text } from '../ui/Text';
import { colors, space } from '../ui/theme';
import type { EditorState } from './editorState';

/** The strip's fixed height: it never changes the canvas size, so choosing something never refits the view. */
export const READOUT_HEIGHT = 48;

/**
 * The chosen opening's sight size and where its centre sits, in the shop's
 * rounding, while it moves. It sits in a strip under the canvas rather than
 * over it, so it never hides the bottom of the board.
 */
export function SelectionReadout({ state, lines, rounding }: { state: EditorState; lines: ReadonlyMap<string, OpeningLines>; rounding: LengthRounding }) {
  const opening = state.selection.length === 1 ? state.layout.openings.find((o) => o.id === state.selection[0]) : undefined;
  const sight = opening ? lines.get(opening.id)?.sight.polygons : undefined;
  // The sight lines stay the same objects through a drag (the opening only shifts), so their size is measured once.
  const box = useMemo(() => (sight ? polygonsBounds(sight) : null), [sight]);
  const f = (v: number) => formatLength(v, rounding);
  return (
    <View style={styles.strip}>
      {opening && box ? (
        <View testID="selection-readout">
          <Text variant="label" numberOfLines={1}>
            {opening.id}: {f(box.w)} x {f(box.h)} sight
          </Text>
          <Text variant="caption" numberOfLines={1}>
            centre {f(opening.center.x)} from left, {f(opening.center.y)} from top{opening.rotation ? `, turned ${opening.rotation}°` : ''}
          </Text>
        </View>
      ) : (
        <Text variant="caption" numberOfLines={2}>
          {state.selection.length > 1 ? `${state.selection.length} chosen.` : 'Tap an opening on the canvas to see its size and place.'}
        </Text>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  strip: {
    height: READOUT_HEIGHT, justifyContent: 'center', paddingHorizontal: space.md, backgroundColor: colors.card,
    borderTopWidth: 1, borderTopColor: colors.line,
  },
});
