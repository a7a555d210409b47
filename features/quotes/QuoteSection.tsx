import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { authQueries } from '../auth/queries';
import { layoutQueries } from '../layouts/queries';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import { quoteQueries } from './queries';
import { QuoteBuilder } from './QuoteBuilder';
import { QuoteEditor } from './QuoteEditor';
import { QuoteLines } from './QuoteLines';
import { moneyText, type QuoteState, type QuoteView } from './schema';
import { dayText, momentText } from '../ui/dates';

export const quoteStateLabels: Record<QuoteState, string> = {
  draft: 'Draft, not sent',
  sent: 'Sent with the proof',
  accepted: 'Accepted',
  replaced: 'Replaced',
};

/** The job's price: the newest quote in full, earlier versions in a line each; owners and designers build and edit. */
export function QuoteSection({ jobId }: { jobId: string }) {
  const quotes = useQuery(quoteQueries.job(jobId));
  const me = useQuery(authQueries.me());
  const canBuild = me.data !== undefined && me.data.member.role !== 'front_desk';
  const list = quotes.data?.quotes ?? [];
  const [current, ...earlier] = list;
  return (
    <View style={styles.card} testID="quote-section">
      <Text variant="heading">Quote</Text>
      {quotes.isError ? <Notice title="The quote could not be loaded">{quotes.error.message}</Notice> : null}
      {quotes.isSuccess && !current ? <Text variant="caption">No quote yet.{canBuild ? ' Build one from a layout below.' : ''}</Text> : null}
      {current ? <CurrentQuote jobId={jobId} quote={current} canEdit={canBuild} /> : null}
      {earlier.length > 0 ? (
        <View style={styles.versions}>
          <Text variant="label">Earlier versions</Text>
          {earlier.map((q) => (
            <Text key={q.id} variant="caption" testID="quote-version">
              Version {q.version} · {quoteStateLabels[q.state]} · {moneyText(q.totalCents, q.terms.currency)} · {dayText(q.createdAt)}
            </Text>
          ))}
        </View>
      ) : null}
      {canBuild ? <QuoteBuilder jobId={jobId} hasQuote={current !== undefined} /> : null}
    </View>
  );
}

function basisWords(q: QuoteView): string {
  const source = q.basis.versionNumber === null ? `${q.basis.layoutName}, working draft` : `${q.basis.layoutName}, version ${q.basis.versionNumber}`;
  return `${source} · ${q.basis.frame ?? 'no frame chosen: mats and work only'}`;
}

/** A draft priced from an older revision of the layout than the one a proof would freeze now. */
function useLayoutMovedOn(jobId: string, quote: QuoteView): boolean {
  const layouts = useQuery(layoutQueries.job(jobId));
  const layout = layouts.data?.layouts.find((l) => l.id === quote.basis.layoutId);
  if (!layout || quote.state !== 'draft') return false;
  if (quote.basis.draftRevision !== null) return layout.draftRevision !== quote.basis.draftRevision;
  return layout.versionCount !== quote.basis.versionNumber;
}

function CurrentQuote({ jobId, quote, canEdit }: { jobId: string; quote: QuoteView; canEdit: boolean }) {
  const [editing, setEditing] = useState(false);
  const movedOn = useLayoutMovedOn(jobId, quote);
  const t = quote.terms;
  return (
    <View style={styles.current}>
      <View style={styles.head}>
        <Text variant="label">Version {quote.version}</Text>
        <Text variant="label" style={quote.state === 'accepted' ? styles.accepted : undefined} testID="quote-state">
          {quoteStateLabels[quote.state]}
        </Text>
      </View>
      <Text variant="caption">{basisWords(quote)}</Text>
      {quote.state === 'accepted' && quote.acceptedName ? (
        <Text testID="quote-accepted-by">
          Accepted by {quote.acceptedName}
          {quote.acceptedAt ? ` on ${momentText(quote.acceptedAt)}` : ''}
        </Text>
      ) : null}
      <QuoteLines lines={quote.lines} sums={{ ...quote, currency: t.currency, taxRatePercent: t.taxRatePercent, depositSharePercent: t.depositSharePercent }} showNotes />
      {movedOn ? (
        <Notice title="The layout changed after this quote was built" testID="quote-stale">
          Build a new version so the price matches the design the customer will see.
        </Notice>
      ) : null}
      {quote.state === 'draft' ? (
        <Text variant="caption">This draft goes to the customer with the next proof you send; after that it can no longer be changed.</Text>
      ) : null}
      {quote.state === 'draft' && canEdit && !editing ? <Button kind="secondary" label="Change amounts or extras" onPress={() => setEditing(true)} testID="quote-edit" /> : null}
      {editing && quote.state === 'draft' ? <QuoteEditor jobId={jobId} quote={quote} onDone={() => setEditing(false)} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.sm, backgroundColor: colors.card, padding: space.lg, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.line },
  current: { gap: space.sm },
  head: { flexDirection: 'row', justifyContent: 'space-between', flexWrap: 'wrap', gap: space.sm },
  accepted: { color: colors.accent },
  versions: { gap: space.xs, paddingTop: space.sm, borderTopWidth: 1, borderTopColor: colors.line },
});
