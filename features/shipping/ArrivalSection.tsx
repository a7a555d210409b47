import { useQuery } from '@tanstack/react-query';
import { Image, StyleSheet, View } from 'react-native';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import { shippingQueries, useSetShowcase } from './queries';

/** How the frame arrived, in the customer's words and photos; one photo can be the shop's showcase. */
export function ArrivalSection({ jobId }: { jobId: string }) {
  const report = useQuery(shippingQueries.arrival(jobId));
  const showcase = useSetShowcase(jobId);
  if (!report.data) return null;
  const r = report.data;
  return (
    <View style={styles.card} testID="arrival">
      <Text variant="heading">How it arrived</Text>
      {!r.comment && r.photos.length === 0 ? <Text variant="caption">Nothing from the customer yet. The shipped e-mail asks them.</Text> : null}
      {r.comment ? <Text testID="arrival-comment">“{r.comment}”</Text> : null}
      <View style={styles.photos}>
        {r.photos.map((p, i) => (
          <View key={p.id} style={styles.photo}>
            <Image source={{ uri: p.url }} style={styles.image} resizeMode="contain" aria-label={`Customer's photo ${i + 1} of the frame on arrival`} testID="arrival-photo" />
            {p.showcase ? (
              <Text variant="label" testID="showcase-mark">Showcase photo</Text>
            ) : (
              <Button label="Use as showcase" kind="secondary" busy={showcase.isPending && showcase.variables === p.id} onPress={() => showcase.mutate(p.id)} testID={`showcase-${i}`} />
            )}
          </View>
        ))}
      </View>
      {showcase.isError ? <Notice>{showcase.error.message}</Notice> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.md, backgroundColor: colors.card, padding: space.lg, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.line },
  photos: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  photo: { gap: space.xs, alignItems: 'flex-start' },
  image: { width: 140, height: 140, backgroundColor: colors.paper, borderRadius: radius.sm },
});
