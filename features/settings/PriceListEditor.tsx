import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { pieceKindLabels, pieceKinds } from '../pieces/schema';
import { MoneyField } from '../quotes/MoneyField';
import { parsePercent } from '../quotes/moneyText';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, radius, space } from '../ui/theme';
import { labourShapeLabels, labourShapes, type PriceList } from './priceList';

interface Props {
  prices: PriceList;
  onChange: (prices: PriceList) => void;
  errors: Record<string, string>;
  editable: boolean;
}

function PercentField({ label, value, max, onChange, error, editable, testID }: { label: string; value: number; max: number; onChange: (v: number) => void; error?: string; editable: boolean; testID?: string }) {
  const [text, setText] = useState(String(value));
  const [problem, setProblem] = useState<string | undefined>();
  const change = (next: string) => {
    setText(next);
    const parsed = parsePercent(next, max);
    setProblem(parsed.ok ? undefined : parsed.message);
    if (parsed.ok) onChange(parsed.value);
  };
  return <TextField label={`${label} (%)`} value={text} onChangeText={change} keyboardType="decimal-pad" editable={editable} error={problem ?? error} testID={testID} />;
}

/** Charges that are not per material: rates, work per piece and per opening, fitting, minimum. */
export function PriceListEditor({ prices, onChange, errors, editable }: Props) {
  const set = (patch: Partial<PriceList>) => onChange({ ...prices, ...patch });
  const e = (key: string) => errors[`priceList.${key}`];
  return (
    <View style={styles.list}>
      <TextField label="Currency code" value={prices.currency} onChangeText={(currency) => set({ currency: currency.toUpperCase() })} maxLength={3} autoCapitalize="characters" editable={editable} error={e('currency')} hint="Three letters, such as USD, CAD or EUR." />
      <View style={styles.group}>
        <PercentField label="Markup on materials" value={prices.markupPercent} max={500} onChange={(markupPercent) => set({ markupPercent })} error={e('markupPercent')} editable={editable} testID="price-markup" />
        <PercentField label="Tax rate" value={prices.taxRatePercent} max={50} onChange={(taxRatePercent) => set({ taxRatePercent })} error={e('taxRatePercent')} editable={editable} testID="price-tax" />
        <PercentField label="Deposit share of the total" value={prices.depositSharePercent} max={100} onChange={(depositSharePercent) => set({ depositSharePercent })} error={e('depositSharePercent')} editable={editable} testID="price-deposit" />
      </View>
      <View style={styles.group}>
        <MoneyField label="Shadowbox spacers, per foot" cents={prices.spacerPerFootCents} onChange={(spacerPerFootCents) => set({ spacerPerFootCents })} error={e('spacerPerFootCents')} editable={editable} />
        <MoneyField label="Fitting, per frame" cents={prices.fittingPerFrameCents} onChange={(fittingPerFrameCents) => set({ fittingPerFrameCents })} error={e('fittingPerFrameCents')} editable={editable} testID="price-fitting" />
        <MoneyField label="Minimum charge, before tax" cents={prices.minimumChargeCents} onChange={(minimumChargeCents) => set({ minimumChargeCents })} error={e('minimumChargeCents')} editable={editable} />
      </View>
      <Text variant="label">Mounting, per piece</Text>
      <View style={styles.group}>
        {pieceKinds.map((kind) => (
          <MoneyField
            key={kind}
            label={pieceKindLabels[kind]}
            cents={prices.mountingPerPieceCents[kind]}
            onChange={(c) => set({ mountingPerPieceCents: { ...prices.mountingPerPieceCents, [kind]: c } })}
            error={e(`mountingPerPieceCents.${kind}`)}
            editable={editable}
          />
        ))}
      </View>
      <Text variant="label">Cutting, per opening</Text>
      <View style={styles.group}>
        {labourShapes.map((shape) => (
          <MoneyField
            key={shape}
            label={labourShapeLabels[shape]}
            cents={prices.labourPerOpeningCents[shape]}
            onChange={(c) => set({ labourPerOpeningCents: { ...prices.labourPerOpeningCents, [shape]: c } })}
            error={e(`labourPerOpeningCents.${shape}`)}
            editable={editable}
          />
        ))}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.md },
  group: { gap: space.sm, padding: space.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.paper },
});
