import { StyleSheet, View } from 'react-native';
import type { LengthRounding } from '../../geometry';
import { Button } from '../ui/Button';
import { ChoiceChips } from '../ui/ChoiceChips';
import { colourWords } from '../ui/colourWords';
import { Swatch } from '../ui/Swatch';
import { thicknessText } from '../ui/thicknessText';
import { LengthField } from '../ui/LengthField';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, radius, space } from '../ui/theme';
import type { StockBoard } from './schema';

const plies = [
  { value: '2', label: '2-ply' },
  { value: '4', label: '4-ply' },
  { value: '6', label: '6-ply' },
  { value: '8', label: '8-ply' },
] as const;

// Common practice (varies by maker): about 0.015 in per ply.
const typicalThickness: Record<StockBoard['ply'], number> = { 2: 0.03, 4: 0.055, 6: 0.085, 8: 0.12 };

interface Props {
  boards: StockBoard[];
  onChange: (boards: StockBoard[]) => void;
  rounding: LengthRounding;
  errors: Record<string, string>;
  editable: boolean;
}

/** The mat boards the shop keeps: the designer offers only these. */
export function StockEditor({ boards, onChange, rounding, errors, editable }: Props) {
  const update = (i: number, patch: Partial<StockBoard>) => onChange(boards.map((b, j) => (j === i ? { ...b, ...patch } : b)));
  const add = () => {
    const id = `board-${Date.now().toString(36)}`;
    onChange([...boards, { id, name: 'New board', colour: '#F3EEE2', coreColour: '#FBF8F1', ply: 4, thicknessIn: 0.055 }]);
  };

  return (
    <View style={styles.list}>
      {boards.map((b, i) => (
        <View key={b.id} style={styles.board} testID={`board-${i}`}>
          <View style={styles.head}>
            <Swatch face={b.colour} core={b.coreColour} size={32} />
            <Text variant="label" style={styles.grow}>
              {b.name}
            </Text>
            {editable ? <Button label="Remove" kind="quiet" onPress={() => onChange(boards.filter((_, j) => j !== i))} /> : null}
          </View>
          {editable ? (
            <View style={styles.fields}>
              <TextField label="Name" value={b.name} onChangeText={(name) => update(i, { name })} error={errors[`stock.${i}.name`]} />
              <View style={styles.pair}>
                <View style={styles.grow}>
                  <TextField label="Face colour" value={b.colour} onChangeText={(colour) => update(i, { colour })} autoCapitalize="none" error={errors[`stock.${i}.colour`]} />
                </View>
                <View style={styles.grow}>
                  <TextField label="Core colour" value={b.coreColour} onChangeText={(coreColour) => update(i, { coreColour })} autoCapitalize="none" error={errors[`stock.${i}.coreColour`]} />
                </View>
              </View>
              <ChoiceChips
                label="Ply"
                options={plies}
                value={String(b.ply) as '2' | '4' | '6' | '8'}
                onChange={(p) => {
                  const ply = Number(p) as StockBoard['ply'];
                  update(i, { ply, thicknessIn: typicalThickness[ply] });
                }}
              />
              <LengthField
                label="Thickness"
                value={b.thicknessIn}
                rounding={rounding}
                decimals={3}
                onChange={(thicknessIn) => update(i, { thicknessIn })}
                hint="As the maker gives it; the bevel run equals the thickness at 45°."
                error={errors[`stock.${i}.thicknessIn`]}
              />
            </View>
          ) : (
            <Text variant="caption">
              {b.ply}-ply · {thicknessText(b.thicknessIn, rounding)} thick · {colourWords(b.colour)} face, {colourWords(b.coreColour)} core
            </Text>
          )}
        </View>
      ))}
      {editable ? <Button label="Add a board" kind="secondary" onPress={add} testID="add-board" /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.md },
  board: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, padding: space.md, gap: space.sm, backgroundColor: colors.paper },
  head: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  grow: { flex: 1 },
  fields: { gap: space.sm },
  pair: { flexDirection: 'row', gap: space.sm },
});
