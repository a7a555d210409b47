import { StyleSheet, View } from 'react-native';
import { QuoteLines } from '../quotes/QuoteLines';
import type { PublicQuoteView } from '../quotes/schema';
import { Text } from '../ui/Text';
import { colors, space } from '../ui/theme';

/** The price that came with the design, line by line; approving the design accepts it. */
export function ProofQuote({ quote }: { quote: PublicQuoteView }) {
  return (
    <View style={styles.box} testID="proof-quote">
      <Text variant="heading">Price</Text>
      <QuoteLines lines={quote.lines} sums={quote} />
      <Text variant="caption">
        {quote.state === 'accepted' ? 'You accepted this price when you approved the design.' : 'Approving the design also accepts this price. Asking for changes does not.'}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({ box: { gap: space.sm, paddingTop: space.sm, borderTopWidth: 1, borderTopColor: colors.line } });
