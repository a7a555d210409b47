import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { defaultShippingSettings, metricShippingDefaults, TRACKING_PLACEHOLDER, type Carrier, type ShippingSettings } from '../shipping/schema';
import { Button } from '../ui/Button';
import { ChoiceChips } from '../ui/ChoiceChips';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, radius, space } from '../ui/theme';

interface Props {
  shipping: ShippingSettings;
  onChange: (shipping: ShippingSettings) => void;
  errors: Record<string, string>;
  editable: boolean;
}

/** A number typed freely ("0." stays while typing); the value changes only when the text reads as a number. */
function NumberField({ label, value, onChange, error, editable, testID }: { label: string; value: number; onChange: (n: number) => void; error?: string; editable: boolean; testID?: string }) {
  const [text, setText] = useState(String(value));
  return (
    <TextField
      label={label}
      value={text}
      editable={editable}
      keyboardType="decimal-pad"
      error={error}
      testID={testID}
      onChangeText={(t) => {
        setText(t);
        const n = Number(t.replace(',', '.'));
        if (t.trim() !== '' && Number.isFinite(n)) onChange(n);
      }}
    />
  );
}

/** Switching units starts from the other system's defaults, so a pound figure is never read as kilograms. */
function withUnits(s: ShippingSettings, units: ShippingSettings['units']): ShippingSettings {
  if (units === s.units) return s;
  const base = units === 'in/lb' ? defaultShippingSettings : metricShippingDefaults;
  return { ...s, units, padding: base.padding, divisor: base.divisor, matBoardWeight: base.matBoardWeight, mountingBoardWeight: base.mountingBoardWeight, boxWeight: base.boxWeight };
}

function CarrierRow({ carrier, index, onChange, onRemove, errors }: { carrier: Carrier; index: number; onChange: (c: Carrier) => void; onRemove: () => void; errors: Record<string, string> }) {
  return (
    <View style={styles.carrier} testID={`carrier-${index}`}>
      <TextField label="Carrier" value={carrier.name} onChangeText={(name) => onChange({ ...carrier, name })} error={errors[`shipping.carriers.${index}.name`]} />
      <TextField
        label="Tracking page address"
        value={carrier.trackingUrl}
        autoCapitalize="none"
        onChangeText={(trackingUrl) => onChange({ ...carrier, trackingUrl })}
        hint={`Put ${TRACKING_PLACEHOLDER} where the tracking number goes.`}
        error={errors[`shipping.carriers.${index}.trackingUrl`]}
      />
      <Button label="Remove carrier" kind="quiet" onPress={onRemove} />
    </View>
  );
}

/** Packing and carriers: the box's padding, the dimensional divisor, board and carton weights, tracking pages. */
export function ShippingEditor({ shipping: s, onChange, errors, editable }: Props) {
  const set = (patch: Partial<ShippingSettings>) => onChange({ ...s, ...patch });
  const inch = s.units === 'in/lb';
  const perArea = inch ? 'lb per sq ft' : 'kg per m²';
  const e = (key: string) => errors[`shipping.${key}`];
  return (
    <View style={styles.list} key={s.units}>
      <ChoiceChips label="Units" disabled={!editable} options={[{ value: 'in/lb', label: 'Inches and pounds' }, { value: 'cm/kg', label: 'Centimetres and kilograms' }]} value={s.units} onChange={(units) => onChange(withUnits(s, units))} testID="shipping-units" />
      <NumberField label={`Padding on each side (${inch ? 'in' : 'cm'})`} value={s.padding} onChange={(padding) => set({ padding })} error={e('padding')} editable={editable} testID="shipping-padding" />
      <NumberField label="Dimensional divisor" value={s.divisor} onChange={(divisor) => set({ divisor })} error={e('divisor')} editable={editable} testID="shipping-divisor" />
      <Text variant="caption">Carriers publish it: 139 for inches and pounds, 5000 for centimetres and kilograms at the time of writing. Check your carrier's current rule.</Text>
      <NumberField label={`One mat board (${perArea})`} value={s.matBoardWeight} onChange={(matBoardWeight) => set({ matBoardWeight })} error={e('matBoardWeight')} editable={editable} />
      <NumberField label={`Mounting board (${perArea})`} value={s.mountingBoardWeight} onChange={(mountingBoardWeight) => set({ mountingBoardWeight })} error={e('mountingBoardWeight')} editable={editable} />
      <NumberField label={`Box, per area of its surface (${perArea})`} value={s.boxWeight} onChange={(boxWeight) => set({ boxWeight })} error={e('boxWeight')} editable={editable} />
      <Text variant="caption">The starting weights are rough figures; weigh a sheet of your own board and a flat box to set them.</Text>
      <Text variant="label">Carriers</Text>
      {editable
        ? s.carriers.map((c, i) => (
            <CarrierRow key={i} carrier={c} index={i} errors={errors} onChange={(next) => set({ carriers: s.carriers.map((x, j) => (j === i ? next : x)) })} onRemove={() => set({ carriers: s.carriers.filter((_, j) => j !== i) })} />
          ))
        : s.carriers.map((c) => <Text key={c.name}>{c.name}: {c.trackingUrl}</Text>)}
      {editable ? <Button label="Add a carrier" kind="secondary" onPress={() => set({ carriers: [...s.carriers, { name: `Carrier ${s.carriers.length + 1}`, trackingUrl: `https://carrier.example/track/${TRACKING_PLACEHOLDER}` }] })} testID="add-carrier" /> : null}
      {errors['shipping.carriers'] ? <Text style={styles.error}>{errors['shipping.carriers']}</Text> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.md },
  carrier: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, padding: space.md, gap: space.sm, backgroundColor: colors.paper },
  error: { color: colors.danger },
});
