import { StyleSheet, View } from 'react-native';
import type { LengthRounding } from '../../geometry';
import { MoneyField } from '../quotes/MoneyField';
import { Button } from '../ui/Button';
import { ChoiceChips } from '../ui/ChoiceChips';
import { LengthField } from '../ui/LengthField';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, radius, space } from '../ui/theme';
import { glazingKindLabels, type GlazingMaterial, type Moulding } from './materials';
import type { MatBoardPrice } from './priceList';
import type { ShopSettings } from './schema';

interface Props {
  settings: ShopSettings;
  onChange: (patch: Partial<ShopSettings>) => void;
  rounding: LengthRounding;
  errors: Record<string, string>;
  editable: boolean;
}

const plies = ['2', '4', '6', '8'] as const;

/** Prices of what a frame is made of: board sheets by ply and size, glazing per square foot, mouldings per foot. */
export function MaterialPriceEditor({ settings, onChange, rounding, errors, editable }: Props) {
  const boards = settings.priceList.matBoards;
  const setBoards = (matBoards: MatBoardPrice[]) => onChange({ priceList: { ...settings.priceList, matBoards } });
  const setBoard = (i: number, patch: Partial<MatBoardPrice>) => setBoards(boards.map((b, j) => (j === i ? { ...b, ...patch } : b)));
  const setGlazing = (i: number, patch: Partial<GlazingMaterial>) => onChange({ glazing: settings.glazing.map((g, j) => (j === i ? { ...g, ...patch } : g)) });
  const setMoulding = (i: number, patch: Partial<Moulding>) => onChange({ mouldings: settings.mouldings.map((m, j) => (j === i ? { ...m, ...patch } : m)) });
  const sheetNames = settings.sheets.map((s) => ({ value: s.name, label: s.name }));
  return (
    <View style={styles.list}>
      <Text variant="label">Mat board, per sheet</Text>
      {boards.map((b, i) => (
        <View key={i} style={styles.item} testID={`board-price-${i}`}>
          <ChoiceChips label="Ply" disabled={!editable} options={plies.map((p) => ({ value: p, label: `${p}-ply` }))} value={String(b.ply) as (typeof plies)[number]} onChange={(p) => setBoard(i, { ply: Number(p) as MatBoardPrice['ply'] })} />
          {sheetNames.some((s) => s.value === b.sheetName) ? (
            <ChoiceChips label="Sheet" disabled={!editable} options={sheetNames} value={b.sheetName} onChange={(sheetName) => setBoard(i, { sheetName })} />
          ) : (
            <TextField label="Sheet (as named under sheet sizes)" value={b.sheetName} onChangeText={(sheetName) => setBoard(i, { sheetName })} editable={editable} error={errors[`priceList.matBoards.${i}.sheetName`]} />
          )}
          <MoneyField label="Price per sheet" cents={b.pricePerSheetCents} onChange={(pricePerSheetCents) => setBoard(i, { pricePerSheetCents })} error={errors[`priceList.matBoards.${i}.pricePerSheetCents`]} editable={editable} />
          {editable ? <Button kind="quiet" label="Remove" onPress={() => setBoards(boards.filter((_, j) => j !== i))} /> : null}
        </View>
      ))}
      {editable && sheetNames.length > 0 ? <Button kind="secondary" label="Add a board price" onPress={() => setBoards([...boards, { ply: 4, sheetName: sheetNames[0]!.value, pricePerSheetCents: 0 }])} /> : null}
      <Text variant="label">Glazing, per square foot</Text>
      {settings.glazing.map((g, i) => (
        <MoneyField key={g.kind} label={`${glazingKindLabels[g.kind]}, ${Number(g.thicknessIn.toFixed(3))} in`} cents={g.pricePerSqFtCents} onChange={(pricePerSqFtCents) => setGlazing(i, { pricePerSqFtCents })} error={errors[`glazing.${i}.pricePerSqFtCents`]} editable={editable} />
      ))}
      <Text variant="label">Mouldings</Text>
      {settings.mouldings.map((m, i) => (
        <View key={i} style={styles.item} testID={`moulding-${i}`}>
          <TextField label="Code" value={m.code} onChangeText={(code) => setMoulding(i, { code })} maxLength={40} editable={editable} error={errors[`mouldings.${i}.code`]} />
          <TextField label="Name" value={m.name} onChangeText={(name) => setMoulding(i, { name })} maxLength={80} editable={editable} error={errors[`mouldings.${i}.name`]} />
          <MoneyField label="Price per foot" cents={m.pricePerFootCents} onChange={(pricePerFootCents) => setMoulding(i, { pricePerFootCents })} error={errors[`mouldings.${i}.pricePerFootCents`]} editable={editable} />
          <LengthField label="Face width" value={m.faceWidthIn} rounding={rounding} onChange={(faceWidthIn) => setMoulding(i, { faceWidthIn })} error={errors[`mouldings.${i}.faceWidthIn`]} editable={editable} />
          <LengthField label="Rabbet depth" value={m.rabbetDepthIn} rounding={rounding} onChange={(rabbetDepthIn) => setMoulding(i, { rabbetDepthIn })} error={errors[`mouldings.${i}.rabbetDepthIn`]} editable={editable} />
          <TextField label="Weight (lb per foot)" value={String(m.weightLbPerFoot)} onChangeText={(t) => setMoulding(i, { weightLbPerFoot: Number(t) || 0 })} keyboardType="decimal-pad" editable={editable} error={errors[`mouldings.${i}.weightLbPerFoot`]} />
          {editable ? <Button kind="quiet" label="Remove" onPress={() => onChange({ mouldings: settings.mouldings.filter((_, j) => j !== i) })} /> : null}
        </View>
      ))}
      {editable ? (
        <Button kind="secondary" label="Add a moulding" onPress={() => onChange({ mouldings: [...settings.mouldings, { code: `M-${settings.mouldings.length + 1}`, name: 'New moulding', pricePerFootCents: 0, faceWidthIn: 1, rabbetDepthIn: 0.5, weightLbPerFoot: 0.5 }] })} />
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.md },
  item: { gap: space.sm, padding: space.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.paper },
});
