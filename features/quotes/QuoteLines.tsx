import { StyleSheet, View } from 'react-native';
import { Text } from '../ui/Text';
import { colors, space } from '../ui/theme';
import { centsText, moneyText } from './schema';

interface Line {
  label: string;
  explanation: string;
  amountCents: number;
  note?: string;
  computedCents?: number;
}

interface Sums {
  currency: string;
  subtotalCents: number;
  taxRatePercent: number;
  taxCents: number;
  totalCents: number;
  depositSharePercent: number;
  depositCents: number;
}

/** A quote's lines, each with its sum in words, and the totals; used by the shop and by the customer's page. */
export function QuoteLines({ lines, sums, showNotes = false }: { lines: readonly Line[]; sums: Sums; showNotes?: boolean }) {
  return (
    <View style={styles.box}>
      {lines.map((line, i) => (
        <View key={i} style={styles.line} testID="quote-line">
          <View style={styles.row}>
            <Text style={styles.label}>{line.label}</Text>
            <Text variant="label">{centsText(line.amountCents)}</Text>
          </View>
          <Text variant="caption">{line.explanation}</Text>
          {showNotes && line.computedCents !== undefined ? (
            <Text variant="caption" style={styles.changed}>
              Changed from {centsText(line.computedCents)}: {line.note ?? ''}
            </Text>
          ) : null}
        </View>
      ))}
      <Sum label="Subtotal" amount={centsText(sums.subtotalCents)} />
      <Sum label={`Tax, ${sums.taxRatePercent} %`} amount={centsText(sums.taxCents)} />
      <Sum label="Total" amount={moneyText(sums.totalCents, sums.currency)} strong testID="quote-total" />
      <Sum label={`Deposit, ${sums.depositSharePercent} % of the total`} amount={moneyText(sums.depositCents, sums.currency)} testID="quote-deposit" />
    </View>
  );
}

function Sum({ label, amount, strong = false, testID }: { label: string; amount: string; strong?: boolean; testID?: string }) {
  return (
    <View style={[styles.row, styles.sum]}>
      <Text variant={strong ? 'label' : 'body'} style={[styles.label, strong && styles.strong]}>
        {label}
      </Text>
      <Text variant="label" style={strong ? styles.strong : undefined} testID={testID}>
        {amount}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.xs },
  line: { gap: 2, paddingVertical: space.xs, borderBottomWidth: 1, borderBottomColor: colors.line },
  row: { flexDirection: 'row', justifyContent: 'space-between', gap: space.sm, alignItems: 'baseline' },
  label: { flexShrink: 1 },
  sum: { paddingTop: space.xs },
  changed: { color: colors.ink },
  strong: { fontSize: 18, lineHeight: 24 },
});
