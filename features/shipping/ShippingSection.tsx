import { useQuery } from '@tanstack/react-query';
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { glazingKindLabels, isGlass, type GlazingKind } from '../settings/materials';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import { EstimateCard } from './EstimateCard';
import { PackingList } from './PackingList';
import { shippingQueries, useMarkShipped } from './queries';
import { ShipForm, ShipmentLine } from './ShipForm';
import { hangingWords } from './shippingWords';

/** The job's box, its weights with glass and with acrylic, the packing list, and marking it shipped. */
export function ShippingSection({ jobId }: { jobId: string }) {
  const shipping = useQuery(shippingQueries.job(jobId));
  const ship = useMarkShipped(jobId);
  if (shipping.isPending) return <ActivityIndicator color={colors.accent} />;
  if (shipping.isError) return <Notice title="Shipping could not be loaded">{shipping.error.message}</Notice>;
  const s = shipping.data;
  const chosen = s.estimates.find((e) => e.glazingKind === s.chosenGlazing) ?? null;
  const chosenKind = s.chosenGlazing as GlazingKind | null;
  return (
    <View style={styles.card} testID="shipping">
      <Text variant="heading">Shipping</Text>
      {s.missing ? <Notice tone="info">{s.missing}</Notice> : null}
      {s.estimates.length > 0 ? (
        <View style={styles.pair}>
          {s.estimates.map((e) => (
            <EstimateCard key={e.glazingKind} estimate={e} units={s.units} divisor={s.divisor} chosen={e.glazingKind === s.chosenGlazing} />
          ))}
        </View>
      ) : null}
      {s.estimates.length > 0 ? (
        <Notice tone={chosenKind && isGlass(chosenKind) ? 'warn' : 'info'} title="Safety: glazing in a box">
          Ship framed work with acrylic rather than glass where you can: it is lighter and does not shatter in the box. If glass must travel, handle it with gloves and eye protection and tape it so a break cannot scatter.
        </Notice>
      ) : null}
      {chosen ? (
        <Notice tone="info" title="Safety: hanging" testID="hanging-caution">
          {hangingWords(chosen, s.units)}
        </Notice>
      ) : null}
      <PackingList shipping={s} glazingLabel={chosenKind ? glazingKindLabels[chosenKind] : null} acrylic={chosenKind ? !isGlass(chosenKind) : false} />
      {s.shipment ? <ShipmentLine shipment={s.shipment} /> : <ShipForm ship={ship} carriers={s.carriers} />}
      {ship.data?.emailedTo ? <Text variant="caption">The shipped notice went to {ship.data.emailedTo}.</Text> : null}
      {ship.data?.mailError ? <Notice>{`Marked shipped, but the e-mail failed: ${ship.data.mailError}`}</Notice> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.md, backgroundColor: colors.card, padding: space.lg, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.line },
  pair: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
});
