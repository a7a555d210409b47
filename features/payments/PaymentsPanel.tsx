import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { jobQueries } from '../jobs/queries';
import { StyleSheet, View } from 'react-native';
import { authQueries } from '../auth/queries';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import { errorMessage } from '../ui/useFieldErrors';
import { ManualPaymentForm } from './ManualPaymentForm';
import { openProviderPage } from './openProviderPage';
import { paymentQueries, useStartCheckout } from './queries';
import { moneyText, paymentKindLabels, paymentMethodLabels, paymentStateLabels, type Payment, type PaymentList, type PaymentSummary } from './schema';
import { momentText } from '../ui/dates';

/**
 * The job's money: due, part paid or paid against the accepted quote, buttons that open the
 * provider's page for the deposit or the balance, the front desk's form for payments taken in
 * the shop, and every payment with who recorded it and when. `returnedFrom` is the provider's
 * session id when the browser has just come back from its page.
 */
export function PaymentsPanel({ jobId, returnedFrom }: { jobId: string; returnedFrom?: string }) {
  const list = useQuery(paymentQueries.job(jobId, returnedFrom));
  const landed = list.data?.payments.some((p) => p.checkoutSessionId === returnedFrom) ?? false;
  const client = useQueryClient();
  // The provider's payment is in the job's activity too once it has landed.
  useEffect(() => {
    if (landed) void client.invalidateQueries({ queryKey: jobQueries.activity(jobId).queryKey });
  }, [landed, client, jobId]);
  const me = useQuery(authQueries.me());
  const canTake = me.data !== undefined && me.data.member.role !== 'designer';
  const data = list.data;
  return (
    <View style={styles.card} testID="payments-section">
      <Text variant="heading">Payments</Text>
      {list.isError ? <Notice title="The payments could not be loaded">{list.error.message}</Notice> : null}
      {returnedFrom && data ? <ReturnNotice landed={landed} /> : null}
      {data && !data.summary ? (
        <Text variant="caption">No accepted quote yet. The deposit and the balance are worked out from the quote the customer accepts.</Text>
      ) : null}
      {data?.summary ? <SummaryBlock summary={data.summary} /> : null}
      {data?.summary && canTake ? <TakeOnline jobId={jobId} data={data} summary={data.summary} /> : null}
      {data?.summary && canTake && data.summary.balanceCents > 0 ? <ManualPaymentForm jobId={jobId} summary={data.summary} /> : null}
      {data && data.payments.length > 0 ? <PaymentRows payments={data.payments} /> : null}
    </View>
  );
}

function ReturnNotice({ landed }: { landed: boolean }) {
  if (landed) return <Notice tone="info" testID="payment-landed">The online payment is recorded.</Notice>;
  return <Notice tone="info">Waiting for the payment provider to confirm the payment; this updates by itself.</Notice>;
}

function SummaryBlock({ summary: s }: { summary: PaymentSummary }) {
  const m = (cents: number) => moneyText(cents, s.currency);
  return (
    <View style={styles.summary}>
      <Text variant="label" testID="payment-state" style={s.state === 'paid' ? styles.paid : styles.due}>
        {paymentStateLabels[s.state]}
      </Text>
      <Text testID="payment-amounts">{`Total ${m(s.totalCents)} · paid ${m(s.paidCents)} · still to pay ${m(s.balanceCents)}`}</Text>
      <Text variant="caption">
        {s.depositDueCents > 0 ? `Deposit asked: ${m(s.depositCents)}, ${m(s.depositDueCents)} of it not yet paid.` : `Deposit of ${m(s.depositCents)} paid.`}
        {` From quote version ${s.quoteVersion}.`}
      </Text>
      {s.overpaidCents > 0 ? <Notice title="Paid more than the total">{`The customer paid ${m(s.overpaidCents)} more than the total; refund the difference.`}</Notice> : null}
    </View>
  );
}

function TakeOnline({ jobId, data, summary: s }: { jobId: string; data: PaymentList; summary: PaymentSummary }) {
  const start = useStartCheckout(jobId);
  if (s.balanceCents === 0) return null;
  if (!data.onlineEnabled) return <Text variant="caption">Online card payments are not set up on this server; record payments taken in the shop below.</Text>;
  const go = (purpose: 'deposit' | 'balance') => start.mutate({ purpose }, { onSuccess: (answer) => openProviderPage(answer.url) });
  return (
    <View style={styles.online}>
      <View style={styles.buttons}>
        {s.depositDueCents > 0 ? (
          <Button label={`Take the deposit online (${moneyText(s.depositDueCents, s.currency)})`} onPress={() => go('deposit')} busy={start.isPending && start.variables?.purpose === 'deposit'} testID="pay-deposit" />
        ) : null}
        <Button
          kind={s.depositDueCents > 0 ? 'secondary' : 'primary'}
          label={`Take the balance online (${moneyText(s.balanceCents, s.currency)})`}
          onPress={() => go('balance')}
          busy={start.isPending && start.variables?.purpose === 'balance'}
          testID="pay-balance"
        />
      </View>
      <Text variant="caption">Opens the card payment page for the customer; once paid, it comes back to this job and the receipt is e-mailed.</Text>
      {start.isError ? <Notice>{errorMessage(start.error) ?? ''}</Notice> : null}
    </View>
  );
}

function PaymentRows({ payments }: { payments: Payment[] }) {
  return (
    <View testID="payment-list">
      {payments.map((p) => (
        <View key={p.id} style={styles.row} testID="payment-row">
          <Text variant="label">{`${moneyText(p.amountCents, p.currency)} · ${paymentMethodLabels[p.method]}`}</Text>
          <Text variant="caption">
            {`${paymentKindLabels[p.kind]} · ${momentText(p.at)} · ${p.recordedByName ? `recorded by ${p.recordedByName}` : 'confirmed by the payment provider'}`}
          </Text>
          {p.note ? <Text variant="caption">{p.note}</Text> : null}
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.sm, backgroundColor: colors.card, padding: space.lg, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.line },
  summary: { gap: space.xs },
  paid: { color: colors.accent },
  due: { color: colors.warn },
  online: { gap: space.sm },
  buttons: { gap: space.sm },
  row: { gap: space.xs, paddingVertical: space.sm, borderTopWidth: 1, borderTopColor: colors.line },
});
