import { useQuery } from '@tanstack/react-query';
import { StyleSheet, View } from 'react-native';
import { moneyText, paymentMethodLabels, paymentMethods } from '../payments/schema';
import { Text } from '../ui/Text';
import { colors, space } from '../ui/theme';
import type { ActivityEntry } from './activitySchema';
import { jobQueries } from './queries';
import { jobStatusLabels, jobStatusSchema } from './schema';
import { momentText } from '../ui/dates';

const statusWord = (value: unknown) => {
  const parsed = jobStatusSchema.safeParse(value);
  return parsed.success ? jobStatusLabels[parsed.data] : String(value);
};

function proofDecisionWords(d: Record<string, unknown>): string {
  const version = typeof d.number === 'number' ? ` of version ${d.number}` : '';
  if (d.decision === 'revoked') return 'Revoked a proof link';
  if (d.decision === 'approved') return `The customer approved the proof${version}${typeof d.name === 'string' ? `, signed “${d.name}”` : ''}`;
  return `The customer asked for changes to the proof${version}${typeof d.comment === 'string' ? `: “${d.comment}”` : ''}`;
}

function paymentWords(d: Record<string, unknown>): string {
  if (typeof d.amountCents !== 'number' || typeof d.currency !== 'string') return 'Recorded a payment';
  const method = paymentMethods.find((m) => m === d.method);
  return `Recorded a payment of ${moneyText(d.amountCents, d.currency)}${method ? ` (${paymentMethodLabels[method].toLowerCase()})` : ''}`;
}

/** One plain sentence per entry; unknown kinds still show their name rather than vanish. */
export function describeActivity(entry: ActivityEntry): string {
  const d = entry.detail;
  switch (entry.kind) {
    case 'job_created':
      return 'Opened the job';
    case 'job_updated':
      return `Edited ${Array.isArray(d.fields) ? d.fields.join(', ') : 'the job'}`;
    case 'status_changed':
      return `${d.override === true ? 'Marked approved without a proof, ' : ''}Moved from ${statusWord(d.from)} to ${statusWord(d.to)}${typeof d.note === 'string' ? ` — “${d.note}”` : ''}`;
    case 'piece_added':
      return `Added a piece${typeof d.label === 'string' ? `: ${d.label}` : ''}`;
    case 'piece_removed':
      return `Removed a piece${typeof d.label === 'string' ? `: ${d.label}` : ''}`;
    case 'photo_added':
      return 'Added a photo';
    case 'outline_saved':
      return `Saved a traced outline${typeof d.label === 'string' ? ` for ${d.label}` : ''}`;
    case 'layout_created':
      return `Started a layout${typeof d.name === 'string' ? `: ${d.name}` : ''}`;
    case 'version_frozen':
      return `Froze version ${String(d.number ?? '')}`.trim();
    case 'proof_sent':
      return `Sent a proof for approval${typeof d.number === 'number' ? ` (version ${d.number})` : ''}`;
    case 'proof_decided':
      return proofDecisionWords(d);
    case 'file_exported':
      return `Exported a cut file${typeof d.format === 'string' ? ` (${d.format.toUpperCase()})` : ''}`;
    case 'cut_released':
      return `Released version ${String(d.number ?? '')} for cutting without the customer's approval${typeof d.reason === 'string' ? ` — “${d.reason}”` : ''}`;
    case 'payment_recorded':
      return paymentWords(d);
    case 'quote_built':
      return `Built quote version ${String(d.version ?? '')}${typeof d.total === 'string' ? `: ${d.total}` : ''}`;
    case 'arrival_noted':
      return d.photo ? 'The customer sent a photo of the frame on arrival' : `The customer said how it arrived${typeof d.comment === 'string' ? `: “${d.comment}”` : ''}`;
    default:
      return entry.kind.replace(/_/g, ' ');
  }
}

export function ActivityList({ jobId }: { jobId: string }) {
  const activity = useQuery(jobQueries.activity(jobId));
  return (
    <View style={styles.box} testID="activity">
      <Text variant="heading">Activity</Text>
      {activity.isError ? <Text variant="caption">The activity could not be loaded: {activity.error.message}</Text> : null}
      {activity.data?.activity.map((entry) => (
        <View key={entry.id} style={styles.row}>
          <Text style={styles.what}>{describeActivity(entry)}</Text>
          <Text variant="caption">
            {entry.memberName ?? 'Customer or system'} · {momentText(entry.at)}
          </Text>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.sm },
  row: { borderLeftWidth: 2, borderLeftColor: colors.line, paddingLeft: space.md, paddingVertical: space.xs },
  what: { fontSize: 14 },
});
