import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, radius, space } from '../ui/theme';
import { errorMessage, serverFieldErrors } from '../ui/useFieldErrors';
import { MoneyField } from './MoneyField';
import { useEditQuote } from './queries';
import { centsText, derivedLineKinds, MAX_QUOTE_EXTRAS, type QuoteView } from './schema';

interface Change {
  amountCents: number;
  note: string;
}

const derived = new Set<string>(derivedLineKinds);

/** The computed lines (by position) with any changes made so far, and the extras. */
function startingPoint(quote: QuoteView) {
  const changes: Record<number, Change> = {};
  quote.lines.forEach((line, i) => {
    if (line.computedCents !== undefined) changes[i] = { amountCents: line.amountCents, note: line.note ?? '' };
  });
  const extras = quote.lines.filter((l) => l.kind === 'extra').map((l) => ({ label: l.label, amountCents: l.amountCents }));
  return { changes, extras };
}

/** Changes a draft: an amount per computed line with the reason, and extras typed by the framer. */
export function QuoteEditor({ jobId, quote, onDone }: { jobId: string; quote: QuoteView; onDone: () => void }) {
  const start = startingPoint(quote);
  const [changes, setChanges] = useState(start.changes);
  const [extras, setExtras] = useState(start.extras);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const edit = useEditQuote(jobId);
  const computed = quote.lines.map((line, index) => ({ line, index })).filter(({ line }) => !derived.has(line.kind) && line.kind !== 'extra');
  const save = () => {
    const adjustments = Object.entries(changes).map(([line, c]) => ({ line: Number(line), amountCents: c.amountCents, note: c.note }));
    edit.mutate({ quoteId: quote.id, input: { extras, adjustments } }, { onSuccess: onDone, onError: (e) => setErrors(serverFieldErrors(e)) });
  };
  const errorAt = (prefix: string) => Object.entries(errors).find(([k]) => k.startsWith(prefix))?.[1];
  return (
    <View style={styles.box}>
      <Text variant="label">Amounts</Text>
      {computed.map(({ line, index }) => {
        const change = changes[index];
        const priceList = line.computedCents ?? line.amountCents;
        return (
          <View key={index} style={styles.item}>
            <Text>{line.label}</Text>
            <Text variant="caption">Price list: {centsText(priceList)}</Text>
            {change ? (
              <>
                <MoneyField label="Amount" cents={change.amountCents} onChange={(amountCents) => setChanges({ ...changes, [index]: { ...change, amountCents } })} testID={`quote-amount-${index}`} />
                <TextField label="Why it changed" value={change.note} onChangeText={(note) => setChanges({ ...changes, [index]: { ...change, note } })} maxLength={200} error={errorAt(`adjustments.`)} />
                <Button kind="quiet" label="Use the price list's amount" onPress={() => setChanges(Object.fromEntries(Object.entries(changes).filter(([k]) => Number(k) !== index)))} />
              </>
            ) : (
              <Button kind="quiet" label="Change this amount" onPress={() => setChanges({ ...changes, [index]: { amountCents: priceList, note: '' } })} />
            )}
          </View>
        );
      })}
      <Text variant="label">Extras</Text>
      {extras.map((extra, i) => (
        <View key={i} style={styles.item}>
          <TextField label="What for" value={extra.label} onChangeText={(label) => setExtras(extras.map((e, j) => (j === i ? { ...e, label } : e)))} maxLength={120} error={errors[`extras.${i}.label`]} testID={`quote-extra-label-${i}`} />
          <MoneyField label="Amount" cents={extra.amountCents} onChange={(amountCents) => setExtras(extras.map((e, j) => (j === i ? { ...e, amountCents } : e)))} error={errors[`extras.${i}.amountCents`]} testID={`quote-extra-amount-${i}`} />
          <Button kind="quiet" label="Remove this extra" onPress={() => setExtras(extras.filter((_, j) => j !== i))} />
        </View>
      ))}
      {extras.length < MAX_QUOTE_EXTRAS ? <Button kind="secondary" label="Add an extra" onPress={() => setExtras([...extras, { label: '', amountCents: 0 }])} testID="quote-add-extra" /> : null}
      {edit.isError ? <Notice>{errorMessage(edit.error) ?? ''}</Notice> : null}
      <View style={styles.actions}>
        <Button kind="quiet" label="Cancel" onPress={onDone} />
        <Button label="Save the quote" onPress={save} busy={edit.isPending} testID="quote-save" />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.sm, padding: space.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.paper },
  item: { gap: space.xs, paddingBottom: space.sm, borderBottomWidth: 1, borderBottomColor: colors.line },
  actions: { flexDirection: 'row', justifyContent: 'flex-end', flexWrap: 'wrap', gap: space.sm },
});
