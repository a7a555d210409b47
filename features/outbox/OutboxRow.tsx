import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { ActivityIndicator, Pressable, StyleSheet, View } from 'react-native';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { colors, fonts, radius, space } from '../ui/theme';
import { outboxQueries } from './queries';
import type { OutboxItem } from './schema';
import { momentText } from '../ui/dates';

const purposeLabels: Record<string, string> = { invitation: 'Invitation', proof: 'Proof', shipped: 'Shipped notice' };

/** One sent message; tapping it opens its plain-text body in place. */
export function OutboxRow({ item }: { item: OutboxItem }) {
  const [open, setOpen] = useState(false);
  return (
    <View style={styles.card} role="listitem">
      <Pressable
        role="button"
        aria-expanded={open}
        aria-label={`${item.subject}, to ${item.toAddress}${item.error ? ', not sent' : ''}`}
        onPress={() => setOpen((o) => !o)}
        style={({ pressed }) => [styles.head, pressed && styles.pressed]}
        testID={`outbox-item-${item.id}`}
      >
        <View style={styles.top}>
          <Text variant="caption">
            {purposeLabels[item.purpose] ?? item.purpose} · {momentText(item.sentAt)}
          </Text>
          {item.error ? (
            <Text variant="label" style={styles.failed}>
              Not sent
            </Text>
          ) : null}
        </View>
        <Text variant="heading" numberOfLines={open ? undefined : 1}>
          {item.subject}
        </Text>
        <Text variant="caption" numberOfLines={1}>
          To {item.toAddress}
        </Text>
      </Pressable>
      {open ? <MessageBody id={item.id} /> : null}
    </View>
  );
}

function MessageBody({ id }: { id: string }) {
  const message = useQuery(outboxQueries.message(id));
  if (message.isPending) return <ActivityIndicator color={colors.accent} />;
  if (message.isError) return <Notice title="The message could not be loaded">{message.error.message}</Notice>;
  const m = message.data.message;
  return (
    <View style={styles.body}>
      {m.error ? <Notice title="The mail server did not take this message">{m.error}</Notice> : null}
      {m.withheld ? <Notice tone="info">{m.textBody}</Notice> : <Text style={styles.text} selectable testID="outbox-body">{m.textBody}</Text>}
    </View>
  );
}

const styles = StyleSheet.create({
  card: { backgroundColor: colors.card, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, overflow: 'hidden' },
  head: { padding: space.lg, gap: space.xs },
  pressed: { opacity: 0.85 },
  top: { flexDirection: 'row', justifyContent: 'space-between', gap: space.sm, flexWrap: 'wrap' },
  failed: { color: colors.danger },
  body: { borderTopWidth: 1, borderTopColor: colors.line, padding: space.lg, gap: space.sm },
  text: { fontFamily: fonts.regular, fontSize: 14, lineHeight: 21 },
});
