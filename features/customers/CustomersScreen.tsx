import { useInfiniteQuery } from '@tanstack/react-query';
import { useRouter } from 'expo-router';
import { useDeferredValue, useState } from 'react';
import { ActivityIndicator, Pressable, StyleSheet, Switch, View } from 'react-native';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, radius, space } from '../ui/theme';
import { customerQueries } from './queries';

export function CustomersScreen() {
  const router = useRouter();
  const [search, setSearch] = useState('');
  const [archived, setArchived] = useState(false);
  const q = useDeferredValue(search.trim());
  const list = useInfiniteQuery(customerQueries.pages(q, archived));
  const shown = list.data?.pages.flatMap((p) => p.customers) ?? [];
  const total = list.data?.pages[0]?.total ?? 0;

  return (
    <Screen title="Customers">
      <View style={styles.head}>
        <Text variant="title" style={styles.grow}>
          Customers
        </Text>
        <Button label="New customer" onPress={() => router.push('/customers/new')} testID="customers-new" />
      </View>
      <TextField label="Search" placeholder="Name or e-mail" value={search} onChangeText={setSearch} testID="customers-search" />
      <View style={styles.toggle}>
        <Switch value={archived} onValueChange={setArchived} aria-label="Include archived customers" trackColor={{ true: colors.accent, false: colors.line }} />
        <Text variant="caption">Include archived customers</Text>
      </View>
      {list.isPending ? <ActivityIndicator color={colors.accent} /> : null}
      {list.isError ? <Notice>{list.error.message}</Notice> : null}
      {list.data && total === 0 ? <Text variant="caption">{q ? `No customer matches “${q}”.` : 'No customers yet.'}</Text> : null}
      {total > 0 ? (
        <Text variant="caption" testID="customer-count">
          {total === 1 ? '1 customer' : `${total} customers`}
          {shown.length < total ? `, ${shown.length} shown` : ''}
        </Text>
      ) : null}
      <View style={styles.list}>
        {shown.map((c) => (
          <Pressable
            key={c.id}
            role="link"
            onPress={() => router.push({ pathname: '/customers/[id]', params: { id: c.id } })}
            style={({ pressed }) => [styles.row, pressed && styles.pressed]}
          >
            <Text variant="label">
              {c.name}
              {c.archivedAt ? ' (archived)' : ''}
            </Text>
            <Text variant="caption">{[c.email, c.phone].filter(Boolean).join(' · ') || 'No contact details'}</Text>
          </Pressable>
        ))}
      </View>
      {list.hasNextPage ? (
        <Button label="Show more" kind="secondary" busy={list.isFetchingNextPage} onPress={() => void list.fetchNextPage()} testID="customers-more" />
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  head: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  grow: { flex: 1 },
  toggle: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  list: { gap: space.sm },
  row: { backgroundColor: colors.card, borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, padding: space.md, gap: 2 },
  pressed: { opacity: 0.85 },
});
