import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, radius, space } from '../ui/theme';
import { customerQueries } from './queries';

interface Props {
  value: string;
  onChange: (customerId: string) => void;
  error?: string;
}

/** Search the shop's customers and pick one; the list stays short enough to tap on a phone. */
export function CustomerChooser({ value, onChange, error }: Props) {
  const [search, setSearch] = useState('');
  const customers = useQuery(customerQueries.list(search.trim()));
  const shown = customers.data?.customers.slice(0, 8) ?? [];

  return (
    <View style={styles.box}>
      <TextField label="Customer" testID="customer-search" placeholder="Search by name or e-mail" value={search} onChangeText={setSearch} error={error} />
      <View style={styles.options} accessibilityRole="radiogroup">
        {shown.map((c) => {
          const selected = c.id === value;
          return (
            <Pressable
              key={c.id}
              accessibilityRole="radio"
              accessibilityState={{ checked: selected }}
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
        {customers.data && shown.length === 0 ? <Text variant="caption">No customer matches “{search}”.</Text> : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.sm },
  options: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  option: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, paddingHorizontal: space.md, paddingVertical: space.sm, backgroundColor: colors.paper },
  selected: { backgroundColor: colors.accent, borderColor: colors.accent },
  selectedText: { color: colors.accentInk },
});
