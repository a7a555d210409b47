import { StyleSheet, View } from 'react-native';
import type { z } from 'zod';
import type { LengthRounding } from '../../geometry';
import { Button } from '../ui/Button';
import { LengthField } from '../ui/LengthField';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, radius, space } from '../ui/theme';
import type { sheetSize } from './schema';

type Sheet = z.infer<typeof sheetSize>;

interface Props {
  sheets: Sheet[];
  onChange: (sheets: Sheet[]) => void;
  rounding: LengthRounding;
  errors: Record<string, string>;
  editable: boolean;
}

/** The board sheet sizes the shop buys; a layout larger than its mat's sheet is flagged. */
export function SheetEditor({ sheets, onChange, rounding, errors, editable }: Props) {
  const update = (i: number, patch: Partial<Sheet>) => onChange(sheets.map((s, j) => (j === i ? { ...s, ...patch } : s)));
  if (!editable) {
    return (
      <View style={styles.list}>
        {sheets.map((s, i) => (
          <Text key={`${s.name}-${i}`}>
            {s.name}: {s.widthIn} x {s.heightIn} in
          </Text>
        ))}
      </View>
    );
  }
  return (
    <View style={styles.list}>
      {sheets.map((s, i) => (
        <View key={i} style={styles.sheet} testID={`sheet-${i}`}>
          <TextField label="Name" value={s.name} onChangeText={(name) => update(i, { name })} error={errors[`sheets.${i}.name`]} />
          <View style={styles.pair}>
            <View style={styles.grow}>
              <LengthField label="Width" value={s.widthIn} rounding={rounding} onChange={(widthIn) => update(i, { widthIn })} error={errors[`sheets.${i}.widthIn`]} />
            </View>
            <View style={styles.grow}>
              <LengthField label="Height" value={s.heightIn} rounding={rounding} onChange={(heightIn) => update(i, { heightIn })} error={errors[`sheets.${i}.heightIn`]} />
            </View>
          </View>
          {sheets.length > 1 ? <Button label="Remove" kind="quiet" onPress={() => onChange(sheets.filter((_, j) => j !== i))} /> : null}
        </View>
      ))}
      <Button label="Add a sheet size" kind="secondary" onPress={() => onChange([...sheets, { name: 'New sheet', widthIn: 32, heightIn: 40 }])} testID="add-sheet" />
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.md },
  sheet: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, padding: space.md, gap: space.sm, backgroundColor: colors.paper },
  pair: { flexDirection: 'row', gap: space.sm },
  grow: { flex: 1 },
});
