import { memo, useMemo } from 'react';
import { StyleSheet, View } from 'react-native';
import type { Layout, LengthRounding, OpeningLines } from '../../geometry';
import { polygonsBounds } from '../../geometry/polygon';
import { formatLength } from '../../geometry/units';
import { Text } from '../ui/Text';
import { colors, space } from '../ui/theme';

/** The strip's fixed height: it never changes the canvas size, so choosing something never refits the view. */
export const READOUT_HEIGHT = 48;

/**
 * The chosen opening's sight size and where its centre sits, in the shop's
 * rounding, while it moves. It sits in a strip under the canvas rather than
 * over it, so it never hides the bottom of the board. The words are worked
 * out on every move; the strip is drawn again only when they change (a
 * drag stays on one rounding step for several moves).
 */
export function SelectionReadout({ layout, selection, lines, rounding }: { layout: Layout; selection: readonly string[]; lines: ReadonlyMap<string, OpeningLines>; rounding: LengthRounding }) {
  const opening = selection.length === 1 ? layout.openings.find((o) => o.id === selection[0]) : undefined;
  const sight = opening ? lines.get(opening.id)?.sight.polygons : undefined;
  // The sight lines stay the same objects through a drag (the opening only shifts), so their size is measured once.
  const box = useMemo(() => (sight ? polygonsBounds(sight) : null), [sight]);
  const f = (v: number) => formatLength(v, rounding);
  if (!opening || !box) {
    return <ReadoutStrip words={selection.length > 1 ? `${selection.length} chosen.` : 'Tap an opening on the canvas to see its size and place.'} />;
  }
  const size = `${opening.id}: ${f(box.w)} x ${f(box.h)} sight`;
  const place = `centre ${f(opening.center.x)} from left, ${f(opening.center.y)} from top${opening.rotation ? `, turned ${opening.rotation}°` : ''}`;
  return <ReadoutStrip size={size} words={place} />;
}

/** The strip itself: `size` and `words` for a chosen opening, or `words` alone. */
const ReadoutStrip = memo(function ReadoutStrip({ size, words }: { size?: string; words: string }) {
  return (
    <View style={styles.strip}>
      {size !== undefined ? (
        <View testID="selection-readout">
          <Text variant="label" numberOfLines={1}>{size}</Text>
          <Text variant="caption" numberOfLines={1}>{words}</Text>
        </View>
      ) : (
        <Text variant="caption" numberOfLines={2}>{words}</Text>
      )}
    </View>
  );
});

const styles = StyleSheet.create({
  strip: {
    height: READOUT_HEIGHT, justifyContent: 'center', paddingHorizontal: space.md, backgroundColor: colors.card,
    borderTopWidth: 1, borderTopColor: colors.line,
  },
});
