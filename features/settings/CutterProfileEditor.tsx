import { StyleSheet, Switch, View } from 'react-native';
import type { LengthRounding } from '../../geometry';
import { Button } from '../ui/Button';
import { ChoiceChips } from '../ui/ChoiceChips';
import { LengthField } from '../ui/LengthField';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, radius, space } from '../ui/theme';
import { defaultShopSettings, originCorners, type CutterProfile } from './schema';

interface Props {
  profiles: CutterProfile[];
  onChange: (profiles: CutterProfile[]) => void;
  rounding: LengthRounding;
  errors: Record<string, string>;
  editable: boolean;
}

const cornerLabels: Record<(typeof originCorners)[number], string> = {
  'top-left': 'Top left',
  'bottom-left': 'Bottom left',
  'top-right': 'Top right',
  'bottom-right': 'Bottom right',
};

function Toggle({ label, value, onChange, disabled }: { label: string; value: boolean; onChange: (v: boolean) => void; disabled: boolean }) {
  return (
    <View style={styles.toggle}>
      <Text style={styles.grow}>{label}</Text>
      <Switch value={value} onValueChange={onChange} disabled={disabled} aria-label={label} trackColor={{ true: colors.accent, false: colors.line }} />
    </View>
  );
}

/** How each of the shop's cutters wants its files. */
export function CutterProfileEditor({ profiles, onChange, rounding, errors, editable }: Props) {
  const update = (i: number, patch: Partial<CutterProfile>) => onChange(profiles.map((p, j) => (j === i ? { ...p, ...patch } : p)));
  const add = () =>
    onChange([
      ...profiles,
      { ...(profiles[0] ?? defaultShopSettings.cutterProfiles[0]!), id: `cutter-${Date.now().toString(36)}`, name: 'Another cutter' },
    ]);

  return (
    <View style={styles.list}>
      {profiles.map((p, i) => (
        <View key={p.id} style={styles.card} testID={`cutter-${i}`}>
          <View style={styles.head}>
            <Text variant="label" style={styles.grow}>
              {p.name}
            </Text>
            {editable && profiles.length > 1 ? <Button label="Remove" kind="quiet" onPress={() => onChange(profiles.filter((_, j) => j !== i))} /> : null}
          </View>
          <TextField label="Name" value={p.name} editable={editable} onChangeText={(name) => update(i, { name })} error={errors[`cutterProfiles.${i}.name`]} />
          <ChoiceChips label="File units" disabled={!editable} options={[{ value: 'in', label: 'Inches' }, { value: 'mm', label: 'Millimetres' }]} value={p.units} onChange={(units) => update(i, { units })} />
          <ChoiceChips label="Cutting path follows" disabled={!editable} options={[{ value: 'back', label: 'Back edge' }, { value: 'face', label: 'Face edge' }]} value={p.pathEdge} onChange={(pathEdge) => update(i, { pathEdge })} />
          <ChoiceChips label="Origin corner" disabled={!editable} options={originCorners.map((c) => ({ value: c, label: cornerLabels[c] }))} value={p.origin} onChange={(origin) => update(i, { origin })} />
          <Toggle label="Board lies face down (mirror the file)" value={p.mirrored} disabled={!editable} onChange={(mirrored) => update(i, { mirrored })} />
          <Toggle label="True arcs and circles" value={p.arcs} disabled={!editable} onChange={(arcs) => update(i, { arcs })} />
          <Toggle label="Cutter picks each circle's direction (write circles as CIRCLE)" value={p.cutterChoosesCircleDirection} disabled={!editable} onChange={(cutterChoosesCircleDirection) => update(i, { cutterChoosesCircleDirection })} />
          <Toggle label="One file per mat" value={p.filePerMat} disabled={!editable} onChange={(filePerMat) => update(i, { filePerMat })} />
          <LengthField label="Curve tolerance" decimals={4} value={p.chordToleranceIn} rounding={rounding} editable={editable} onChange={(chordToleranceIn) => update(i, { chordToleranceIn })} hint="Largest gap between a straight segment and the true curve." error={errors[`cutterProfiles.${i}.chordToleranceIn`]} />
          <View style={styles.pair}>
            <View style={styles.grow}>
              <LengthField label="Largest sheet width" value={p.maxSheetWidthIn} rounding={rounding} editable={editable} onChange={(maxSheetWidthIn) => update(i, { maxSheetWidthIn })} error={errors[`cutterProfiles.${i}.maxSheetWidthIn`]} />
            </View>
            <View style={styles.grow}>
              <LengthField label="Largest sheet height" value={p.maxSheetHeightIn} rounding={rounding} editable={editable} onChange={(maxSheetHeightIn) => update(i, { maxSheetHeightIn })} error={errors[`cutterProfiles.${i}.maxSheetHeightIn`]} />
            </View>
          </View>
        </View>
      ))}
      {editable ? <Button label="Add a cutter" kind="secondary" onPress={add} /> : null}
    </View>
  );
}


const styles = StyleSheet.create({
  list: { gap: space.md },
  card: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, padding: space.md, gap: space.sm, backgroundColor: colors.paper },
  head: { flexDirection: 'row', alignItems: 'center' },
  toggle: { flexDirection: 'row', alignItems: 'center', gap: space.sm, minHeight: 40 },
  grow: { flex: 1 },
  pair: { flexDirection: 'row', gap: space.sm },
});
