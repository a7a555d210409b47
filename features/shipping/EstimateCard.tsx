import { StyleSheet, View } from 'react-native';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import type { ShippingEstimateView, ShippingUnitsName } from './schema';
import { boxWords, weightWords } from './shippingWords';

interface Props {
  estimate: ShippingEstimateView;
  units: ShippingUnitsName;
  divisor: number;
  chosen: boolean;
}

function Line({ label, value, testID }: { label: string; value: string; testID?: string }) {
  return (
    <View style={styles.line}>
      <Text variant="caption">{label}</Text>
      <Text testID={testID}>{value}</Text>
    </View>
  );
}

/** One glazing's box and weights, with how each weight was made up. */
export function EstimateCard({ estimate: e, units, divisor, chosen }: Props) {
  const w = (n: number) => weightWords(n, units);
  const slug = e.isGlass ? 'glass' : 'acrylic';
  return (
    <View style={[styles.card, chosen && styles.chosen]} testID={`estimate-${slug}`}>
      <Text variant="label">
        With {e.glazingLabel.toLowerCase()}
        {chosen ? ' (chosen)' : ''}
      </Text>
      <Line label="Box, sides rounded up" value={boxWords(e, units)} testID={`box-${slug}`} />
      <Line label="Packed weight" value={w(e.weights.packed)} testID={`packed-${slug}`} />
      <Line label={`Dimensional weight (L x W x H / ${divisor})`} value={w(e.dimensional)} />
      <Line label="Billed weight" value={w(e.billed).replace('.0 ', ' ')} testID={`billed-${slug}`} />
      <Text variant="caption">
        Glazing {w(e.weights.glazing)}, mats {w(e.weights.mats)}, mounting board {w(e.weights.mounting)}, moulding {w(e.weights.moulding)}, box {w(e.weights.box)}. The pieces themselves are not included: weigh the packed box before buying a label.
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  card: { flexGrow: 1, flexBasis: 240, gap: space.xs, padding: space.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line },
  chosen: { borderColor: colors.accent, borderWidth: 2 },
  line: { flexDirection: 'row', flexWrap: 'wrap', justifyContent: 'space-between', gap: space.sm },
});
