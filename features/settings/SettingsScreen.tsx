import { useQuery } from '@tanstack/react-query';
import { startTransition, useEffect, useState, type ReactNode } from 'react';
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { authQueries } from '../auth/queries';
import { Button } from '../ui/Button';
import { ChoiceChips } from '../ui/ChoiceChips';
import { LengthField } from '../ui/LengthField';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { PROOF_MAX_DAYS, PROOF_MIN_DAYS } from '../proofs/schema';
import { colors, radius, space } from '../ui/theme';
import { focusFirstInvalid } from '../ui/focusFirstInvalid';
import { errorMessage, localFieldErrors, serverFieldErrors } from '../ui/useFieldErrors';
import { CutterProfileEditor } from './CutterProfileEditor';
import { settingsQueries, useSaveSettings } from './queries';
import { shopSettings, type ShopSettings } from './schema';
import { SheetEditor } from './SheetEditor';
import { ShippingEditor } from './ShippingEditor';
import { StockEditor } from './StockEditor';
import { MaterialPriceEditor } from './MaterialPriceEditor';
import { PriceListEditor } from './PriceListEditor';

const roundingOptions = [
  { value: '1/8', label: '1/8 in' },
  { value: '1/16', label: '1/16 in' },
  { value: '1/32', label: '1/32 in' },
  { value: '0.5mm', label: '0.5 mm' },
] as const;

/** The unit and a rounding that goes with it: millimetres round to 0.5 mm, inches to a fraction. */
function withUnits(draft: ShopSettings, units: ShopSettings['units']): Partial<ShopSettings> {
  if (units === 'mm') return { units, rounding: '0.5mm' };
  return { units, rounding: draft.rounding === '0.5mm' ? '1/16' : draft.rounding };
}

function Section({ title, note, children }: { title: string; note?: string; children: ReactNode }) {
  return (
    <View style={styles.section}>
      <Text variant="heading">{title}</Text>
      {note ? <Text variant="caption">{note}</Text> : null}
      {children}
    </View>
  );
}

export function SettingsScreen() {
  const me = useQuery(authQueries.me());
  const stored = useQuery(settingsQueries.shop());
  const save = useSaveSettings();
  const [draft, setDraft] = useState<ShopSettings | null>(null);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [saved, setSaved] = useState(false);
  useEffect(() => {
    // The first draft mounts the whole form (sheets, cutter, prices, shipping, stock): in a
    // transition React draws it in short slices, not in one task (~220 ms on a 4x slowed CPU).
    const settings = stored.data?.settings;
    if (settings && !draft) startTransition(() => setDraft(settings));
  }, [stored.data, draft]);
  // A refused save puts the focus on the first field named, with its message read beside it.
  useEffect(() => {
    if (Object.keys(errors).length > 0) focusFirstInvalid();
  }, [errors]);

  if (stored.isError) return <Screen><Notice title="Settings could not be loaded">{stored.error.message}</Notice></Screen>;
  if (!draft || !me.data) return <ActivityIndicator color={colors.accent} style={styles.loading} />;

  const owner = me.data.member.role === 'owner';
  const set = (patch: Partial<ShopSettings>) => {
    setSaved(false);
    setDraft({ ...draft, ...patch });
  };
  const submit = () => {
    const local = localFieldErrors(shopSettings, draft);
    setErrors(local);
    if (Object.keys(local).length > 0) return;
    save.mutate(draft, { onSuccess: () => setSaved(true), onError: (e) => setErrors(serverFieldErrors(e)) });
  };
  const r = draft.rounding;

  return (
    <Screen title="Shop settings">
      <Text variant="title">Shop settings</Text>
      {!owner ? <Notice tone="info">Only the shop's owner can change these; you can read them.</Notice> : null}
      <Section title="Measuring">
        <ChoiceChips label="Lengths in" disabled={!owner} options={[{ value: 'in', label: 'Inches' }, { value: 'mm', label: 'Millimetres' }]} value={draft.units} onChange={(units) => set(withUnits(draft, units))} testID="units" />
        <ChoiceChips label="Round to the nearest" disabled={!owner} options={roundingOptions.filter((o) => (o.value === '0.5mm') === (draft.units === 'mm'))} value={draft.rounding} onChange={(rounding) => set({ rounding })} testID="rounding" />
        <Text variant="caption">A number typed without a unit means {draft.units === 'mm' ? 'millimetres' : 'inches'}; add in, " or mm to say otherwise.</Text>
      </Section>
      <Section title="Checks and defaults" note="Starting points a framer can change per layout. The defaults are common practice, not a standard.">
        <LengthField label="Reveal of each lower mat" editable={owner} value={draft.defaultRevealIn} rounding={r} onChange={(defaultRevealIn) => set({ defaultRevealIn })} error={errors.defaultRevealIn} testID="default-reveal" />
        <LengthField label="Warn when board between openings is under" editable={owner} value={draft.bridgeWarnIn} rounding={r} onChange={(bridgeWarnIn) => set({ bridgeWarnIn })} error={errors.bridgeWarnIn} testID="bridge-warn" />
        <LengthField label="Mark an error when board between openings is under" editable={owner} value={draft.bridgeErrorIn} rounding={r} onChange={(bridgeErrorIn) => set({ bridgeErrorIn })} error={errors.bridgeErrorIn} testID="bridge-error" />
        <LengthField label="Smallest visible colour band" editable={owner} value={draft.minVisibleBandIn} rounding={r} onChange={(minVisibleBandIn) => set({ minVisibleBandIn })} error={errors.minVisibleBandIn} hint="The coloured strip of a lower mat is its reveal less the bevel above it." />
        <TextField
          label="Bevel angle (degrees)"
          editable={owner}
          keyboardType="numeric"
          value={String(draft.bevelAngleDeg)}
          onChangeText={(t) => set({ bevelAngleDeg: Number(t) || 0 })}
          error={errors.bevelAngleDeg}
        />
      </Section>
      <Section title="Boards in stock">
        <StockEditor boards={draft.stock} onChange={(stock) => set({ stock })} rounding={r} errors={errors} editable={owner} />
      </Section>
      <Section title="Sheet sizes" note="32 x 40 in is the common mat board sheet; 40 x 60 in the oversize one (common practice).">
        <SheetEditor sheets={draft.sheets} onChange={(sheets) => set({ sheets })} rounding={r} errors={errors} editable={owner} />
      </Section>
      <Section title="Cutters" note="Each cutter's file settings; exports ask which one to use.">
        <CutterProfileEditor profiles={draft.cutterProfiles} onChange={(cutterProfiles) => set({ cutterProfiles })} rounding={r} errors={errors} editable={owner} />
      </Section>
      <Section title="Prices of materials" note="Quotes price each mat by the smallest listed sheet that holds it, glazing by the outer size, moulding by the perimeter plus 8 face widths for the mitres.">
        <MaterialPriceEditor settings={draft} onChange={set} rounding={r} errors={errors} editable={owner} />
      </Section>
      <Section title="Price list" note="Work, rates and the deposit. Amounts in the shop's currency; the markup applies to materials only.">
        <PriceListEditor prices={draft.priceList} onChange={(priceList) => set({ priceList })} errors={errors} editable={owner} />
      </Section>
      <Section title="Shipping" note="How the box is sized and weighed, and the carriers whose tracking pages the shipped e-mail links to.">
        <ShippingEditor shipping={draft.shipping} onChange={(shipping) => set({ shipping })} errors={errors} editable={owner} />
      </Section>
      <Section title="Proofs for customers">
        <TextField
          label="Days a proof link stays open"
          hint={`Used when the sender does not choose; ${PROOF_MIN_DAYS} to ${PROOF_MAX_DAYS} days.`}
          editable={owner}
          keyboardType="numeric"
          value={String(draft.proofExpiryDays)}
          onChangeText={(t) => set({ proofExpiryDays: Number(t) || 0 })}
          error={errors.proofExpiryDays}
          testID="proof-expiry-days"
        />
      </Section>
      <Notice tone="info" title="Blades">
        Cut away from your body, retract the blade when you stop, replace dull blades rather than pressing harder, and put used blades in a sharps container. Follow your shop's own safety practice.
      </Notice>
      {owner ? (
        <View style={styles.saveRow}>
          {save.isError && Object.keys(errors).length === 0 ? <Notice>{errorMessage(save.error) ?? ''}</Notice> : null}
          {Object.keys(errors).length > 0 ? <Text style={styles.error}>Some fields need attention before saving.</Text> : null}
          {saved ? <Text testID="settings-saved">Saved.</Text> : null}
          <Button label="Save settings" onPress={submit} busy={save.isPending} testID="save-settings" />
        </View>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  loading: { marginTop: space.xxl },
  section: { gap: space.md, backgroundColor: colors.card, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.line, padding: space.lg },
  saveRow: { gap: space.sm, alignItems: 'flex-end' },
  error: { color: colors.danger },
});
