import { MAX_MATS } from '../../geometry/layoutSchema';
import { memo, useState, type Dispatch } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import type { Layout, Mat } from '../../geometry';
import type { ShopSettings, StockBoard } from '../settings/schema';
import { Button } from '../ui/Button';
import { colourWords } from '../ui/colourWords';
import { Swatch } from '../ui/Swatch';
import { thicknessText } from '../ui/thicknessText';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import type { EditorAction } from './editorState';

interface Props {
  layout: Layout;
  selection: readonly string[];
  dispatch: Dispatch<EditorAction>;
  settings: ShopSettings;
  editable: boolean;
}

/** The mat a stock board makes, cut from the same sheet as the rest of the stack. */
export function matFromBoard(board: StockBoard, layout: Layout, bevelAngle: number): Mat {
  return {
    id: board.id,
    name: board.name,
    color: board.colour,
    coreColor: board.coreColour,
    ply: board.ply === 2 ? 'other' : board.ply,
    thickness: board.thicknessIn,
    bevelAngle,
    sheet: layout.mats[0]?.sheet ?? { width: 32, height: 40 },
  };
}

/** The stack top first: each mat's board, its place in the stack, and whether the chosen opening cuts it. */
export const MatStackPanel = memo(function MatStackPanel({ layout, selection, dispatch, settings, editable }: Props) {
  const [choosing, setChoosing] = useState<number | null>(null);
  const chosen = selection.length === 1 ? layout.openings.find((o) => o.id === selection[0]) : undefined;
  const unused = settings.stock.find((b) => !layout.mats.some((m) => m.name === b.name)) ?? settings.stock[0];
  return (
    <View style={styles.panel} testID="mat-stack">
      {layout.mats.map((mat, index) => (
        <View key={mat.id} style={styles.mat} testID={`mat-row-${index + 1}`}>
          <View style={styles.head}>
            <Swatch face={mat.color} core={mat.coreColor} />
            <View style={styles.words}>
              <Text variant="label">Mat {index + 1}{index === 0 ? ' (top)' : ''}: {mat.name}</Text>
              <Text variant="caption">
                {mat.ply === 'other' ? 'Other ply' : `${mat.ply}-ply`}, {thicknessText(mat.thickness, settings.rounding)} thick
                {chosen ? (chosen.depth > index ? ` · cut by ${chosen.id}` : ` · not cut by ${chosen.id}`) : ''}
              </Text>
            </View>
          </View>
          {editable ? (
            <View style={styles.row}>
              <Button kind="quiet" label="Move up" disabled={index === 0} onPress={() => dispatch({ type: 'moveMat', index, by: -1 })} />
              <Button kind="quiet" label="Move down" disabled={index === layout.mats.length - 1} onPress={() => dispatch({ type: 'moveMat', index, by: 1 })} />
              <Button kind="quiet" label="Board…" onPress={() => setChoosing(choosing === index ? null : index)} testID={`mat-board-${index + 1}`} />
              <Button kind="quiet" label="Remove" disabled={layout.mats.length <= 1} onPress={() => dispatch({ type: 'removeMat', index })} testID={`mat-remove-${index + 1}`} />
            </View>
          ) : null}
          {choosing === index ? (
            <View style={styles.stock} role="radiogroup" aria-label={`Board for mat ${index + 1}`}>
              {settings.stock.map((board) => {
                const { id: _id, sheet: _sheet, ...changes } = matFromBoard(board, layout, mat.bevelAngle);
                return (
                  <Pressable key={board.id} role="radio" aria-checked={board.name === mat.name} style={styles.board}
                    onPress={() => { dispatch({ type: 'changeMat', index, changes }); setChoosing(null); }}>
                    <Swatch face={board.colour} core={board.coreColour} />
                    <Text variant="caption">{board.name} ({board.ply}-ply)</Text>
                  </Pressable>
                );
              })}
            </View>
          ) : null}
        </View>
      ))}
      {editable && unused && layout.mats.length < MAX_MATS ? (
        <Button kind="secondary" label="Add mat below" testID="add-mat"
          onPress={() => dispatch({ type: 'addMat', mat: matFromBoard(unused, layout, settings.bevelAngleDeg) })} />
      ) : null}
      {editable ? <Text variant="caption">{layout.mats.length} of at most {MAX_MATS} mats.</Text> : null}
      <View style={styles.head}>
        <Swatch face={layout.mountingBoard.color} />
        <Text variant="caption" style={styles.words} testID="mounting-board">
          Mounting board below: {boardName(layout.mountingBoard.color, settings.stock)}, {layout.mountingBoard.cut ? 'cut to size' : 'not cut'}.
        </Text>
      </View>
    </View>
  );
});

/** The shop's own name for a colour when a stock board has it, otherwise the colour in plain words. */
function boardName(colour: string, stock: readonly StockBoard[]): string {
  return stock.find((b) => b.colour.toLowerCase() === colour.toLowerCase())?.name ?? colourWords(colour);
}

const styles = StyleSheet.create({
  panel: { gap: space.md },
  mat: { gap: space.xs, borderBottomWidth: 1, borderBottomColor: colors.line, paddingBottom: space.sm },
  head: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  words: { flex: 1, minWidth: 0 },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  stock: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  board: { flexDirection: 'row', alignItems: 'center', gap: space.xs, padding: space.xs, borderWidth: 1, borderColor: colors.line, borderRadius: radius.sm, minHeight: 44 },
});
