import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { ApiError } from '../api/client';
import { Button } from '../ui/Button';
import { ChoiceChips } from '../ui/ChoiceChips';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { space } from '../ui/theme';
import { errorMessage } from '../ui/useFieldErrors';
import { useRecordManualPayment } from './queries';
import { centsFromText, manualPaymentMethods, MAX_PAYMENT_NOTE, moneyText, paymentMethodLabels, type PaymentSummary } from './schema';

type Method = (typeof manualPaymentMethods)[number];
const methodOptions = manualPaymentMethods.map((m) => ({ value: m, label: paymentMethodLabels[m] }));

/** Cash, a cheque or a card taken in the shop: the front desk types what came in; the server checks it against the balance. */
export function ManualPaymentForm({ jobId, summary }: { jobId: string; summary: PaymentSummary }) {
  const record = useRecordManualPayment(jobId);
  const [method, setMethod] = useState<Method>('cash');
  const [amount, setAmount] = useState('');
  const [note, setNote] = useState('');
  const [amountError, setAmountError] = useState<string | undefined>();

  const submit = () => {
    const cents = centsFromText(amount);
    if (cents === null || cents === 0) return setAmountError('Type the amount received, like 120 or 120.50');
    setAmountError(undefined);
    record.mutate(
      { method, amountCents: cents, note: note.trim() || null },
      {
        onSuccess: () => {
          setAmount('');
          setNote('');
        },
      },
    );
  };
  const fields = record.error instanceof ApiError ? record.error.fields : {};
  const serverAmount = fields.amountCents;
  return (
    <View style={styles.form} testID="manual-payment">
      <Text variant="label">Record a payment taken in the shop</Text>
      <ChoiceChips label="How it was paid" options={methodOptions} value={method} onChange={setMethod} testID="manual-method" />
      <TextField
        label={`Amount (${summary.currency.toUpperCase()})`}
        value={amount}
        onChangeText={setAmount}
        inputMode="decimal"
        hint={`Still to pay: ${moneyText(summary.balanceCents, summary.currency)}`}
        error={amountError ?? serverAmount}
        testID="manual-amount"
      />
      <TextField label="Note (optional): cheque or receipt number" value={note} onChangeText={setNote} maxLength={MAX_PAYMENT_NOTE} error={fields.note} testID="manual-note" />
      <Button label="Record payment" onPress={submit} busy={record.isPending} testID="manual-record" />
      {record.isError && !serverAmount ? <Notice>{errorMessage(record.error) ?? ''}</Notice> : null}
      {record.data ? <ReceiptNotice emailedTo={record.data.emailedTo} mailError={record.data.mailError} /> : null}
    </View>
  );
}

function ReceiptNotice({ emailedTo, mailError }: { emailedTo: string | null; mailError: string | null }) {
  if (mailError) return <Notice title="Recorded, but the receipt e-mail failed">{mailError}</Notice>;
  return <Notice tone="info">{emailedTo ? `Recorded. The receipt was e-mailed to ${emailedTo}.` : 'Recorded. The customer has no e-mail address, so no receipt was sent.'}</Notice>;
}

const styles = StyleSheet.create({
  form: { gap: space.sm, marginTop: space.sm },
});
