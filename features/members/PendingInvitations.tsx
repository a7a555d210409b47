import { StyleSheet, View } from 'react-native';
import { roleLabels } from '../auth/schema';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import { errorMessage } from '../ui/useFieldErrors';
import { useInvite, useRevokeInvitation } from './queries';
import type { InvitationSummary } from './schema';
import { weekdayText } from '../ui/dates';

/** Owner only: invitations not yet used; withdraw one, or send an expired one again. */
export function PendingInvitations({ invitations }: { invitations: InvitationSummary[] }) {
  const revoke = useRevokeInvitation();
  const resend = useInvite();
  const failure = revoke.error ?? resend.error;
  if (invitations.length === 0) return null;

  return (
    <View style={styles.list} testID="pending-invitations">
      <Text variant="heading">Waiting to join</Text>
      {failure ? <Notice>{errorMessage(failure) ?? ''}</Notice> : null}
      {invitations.map((inv) => (
        <View key={inv.id} style={styles.row}>
          <View style={styles.who}>
            <Text variant="label" numberOfLines={1}>
              {inv.email}
            </Text>
            <Text variant="caption">
              {roleLabels[inv.role]} · {inv.state === 'expired' ? 'link expired' : `link works until ${formatDay(inv.expiresAt)}`}
              {inv.invitedByName ? ` · invited by ${inv.invitedByName}` : ''}
            </Text>
          </View>
          <View style={styles.actions}>
            <Button label="Send again" kind="secondary" onPress={() => resend.mutate({ email: inv.email, role: inv.role })} busy={resend.isPending && resend.variables?.email === inv.email} />
            <Button label="Withdraw" kind="quiet" onPress={() => revoke.mutate(inv.id)} busy={revoke.isPending && revoke.variables === inv.id} />
          </View>
        </View>
      ))}
    </View>
  );
}

function formatDay(iso: string): string {
  return weekdayText(iso);
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  row: {
    backgroundColor: colors.card,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.line,
    borderStyle: 'dashed',
    padding: space.md,
    gap: space.sm,
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
  },
  who: { flexGrow: 1, flexBasis: 220, minWidth: 0 },
  actions: { flexDirection: 'row', gap: space.xs },
});
