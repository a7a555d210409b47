import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import { OutboxRow } from './OutboxRow';
import { OUTBOX_PAGE_SIZE, outboxQueries } from './queries';

/** Every e-mail the shop sent, newest first, including the ones that failed. */
export function OutboxScreen() {
  const [offset, setOffset] = useState(0);
  const page = useQuery(outboxQueries.page(offset));
  const total = page.data?.total ?? 0;

  return (
    <Screen title="Outbox">
      <Text variant="title">Outbox</Text>
      <Text variant="caption">The e-mail this shop has sent. Tap a message to read it.</Text>
      {page.isPending ? <ActivityIndicator color={colors.accent} /> : null}
      {page.isError ? <Notice title="The outbox could not be loaded">{page.error.message}</Notice> : null}
      {page.data && total === 0 ? (
        <View style={styles.empty} testID="outbox-empty">
          <Text>Nothing sent yet. The invitations you send appear here.</Text>
        </View>
      ) : null}
      {page.data && page.data.messages.length > 0 ? (
        <View style={styles.list} role="list" testID="outbox-list">
          {page.data.messages.map((m) => (
            <OutboxRow key={m.id} item={m} />
          ))}
        </View>
      ) : null}
      {total > OUTBOX_PAGE_SIZE ? (
        <View style={styles.pager}>
          <Button label="Newer" kind="secondary" disabled={offset === 0} onPress={() => setOffset(Math.max(0, offset - OUTBOX_PAGE_SIZE))} />
          <Text variant="caption">
            {offset + 1}–{Math.min(offset + OUTBOX_PAGE_SIZE, total)} of {total}
          </Text>
          <Button label="Older" kind="secondary" disabled={offset + OUTBOX_PAGE_SIZE >= total} onPress={() => setOffset(offset + OUTBOX_PAGE_SIZE)} />
        </View>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  empty: { backgroundColor: colors.card, borderRadius: radius.lg, padding: space.xl, borderWidth: 1, borderColor: colors.line, borderStyle: 'dashed' },
  pager: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.sm },
});
