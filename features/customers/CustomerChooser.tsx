import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { useDeferredValue, useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, radius, space } from '../ui/theme';
import { customerQueries } from './queries';

/** Enough choices to find a recent customer at a glance; the search finds the rest. */
const SHOWN_CUSTOMERS = 12;

interface Props {
  value: string;
  onChange: (customerId: string) => void;
  error?: string;
  /** The id the field's error and focus go to, so a failed submit can point here. */
  testID?: string;
}

/** Pick a customer: the newest first, narrowed as one types a name or an e-mail. */
export function CustomerChooser({ value, onChange, error, testID = 'customer-search' }: Props) {
  const [search, setSearch] = useState('');
  const q = useDeferredValue(search.trim());
  const customers = useQuery({ ...customerQueries.list(q, false, 'recent'), placeholderData: keepPreviousData });
  const all = customers.data?.customers ?? [];
  const shown = all.slice(0, SHOWN_CUSTOMERS);
  // The chosen customer stays in view even when the search no longer matches them.
  const chosen = customers.data && value && !shown.some((c) => c.id === value) ? null : undefined;

  return (
    <View style={styles.box}>
      <TextField
        label="Customer"
        testID={testID}
        placeholder="Search by name or e-mail"
        value={search}
        onChangeText={setSearch}
        error={error}
        hint={q ? undefined : 'Newest customers first; type to search them all.'}
        autoCapitalize="none"
        autoCorrect={false}
      />
      <View style={styles.options} role="radiogroup" aria-label="Customer" testID="customer-options">
        {shown.map((c) => {
          const selected = c.id === value;
          return (
            <Pressable
              key={c.id}
              role="radio"
              aria-checked={selected}
              aria-label={c.email ? `${c.name}, ${c.email}` : c.name}
              onPress={() => onChange(c.id)}
              style={[styles.option, selected && styles.selected]}
              testID={`customer-option-${c.name}`}
            >
              <Text variant="label" style={selected ? styles.selectedText : undefined}>
                {c.name}
              </Text>
              {c.email ? (
                <Text variant="caption" style={selected ? styles.selectedText : undefined}>
                  {c.email}
                </Text>
              ) : null}
            </Pressable>
          );
        })}
        {customers.data && shown.length === 0 ? <Text variant="caption">{q ? `No customer matches “${q}”.` : 'No customers yet.'}</Text> : null}
      </View>
      {all.length > shown.length ? (
        <Text variant="caption">
          Showing the {shown.length} newest of {all.length}
          {q ? ` matching “${q}”` : ''}; type more of a name to narrow them.
        </Text>
      ) : null}
      {chosen === null ? <Text variant="caption">The chosen customer is not in this search; they stay chosen.</Text> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.sm },
  options: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  option: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, paddingHorizontal: space.md, paddingVertical: space.sm, backgroundColor: colors.paper, maxWidth: '100%' },
  selected: { backgroundColor: colors.accent, borderColor: colors.accent },
  selectedText: { color: colors.accentInk },
});
