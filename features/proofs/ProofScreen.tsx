import { useQuery } from '@tanstack/react-query';
import { useLocalSearchParams } from 'expo-router';
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { parseLayout } from '../../geometry/layout';
import { ApiError } from '../api/client';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import { ArrivalForm } from '../shipping/ArrivalForm';
import { ProofAnswered, ProofDecision } from './ProofDecision';
import { ProofDesign } from './ProofDesign';
import { ProofQuote } from './ProofQuote';
import { proofQueries } from './queries';
import { PROOF_CLOSED_ADVICE, PROOF_CLOSED_MESSAGE, type PublicProofView } from './schema';

/** The page a proof link opens, without an account: the design, in pictures and words, and the customer's answer. */
export function ProofScreen() {
  const { token } = useLocalSearchParams<{ token: string }>();
  const secret = typeof token === 'string' ? token : '';
  const proof = useQuery(proofQueries.link(secret));

  return (
    <Screen maxWidth={760} title="Your framing proof">
      <View style={styles.card}>
        {proof.isPending ? <ActivityIndicator color={colors.accent} /> : null}
        {proof.isError ? <ClosedLink error={proof.error} /> : null}
        {proof.data ? <LinkStage token={secret} proof={proof.data.proof} /> : null}
      </View>
    </Screen>
  );
}

/**
 * A closed link says so in words true of every closed link (made up, revoked,
 * replaced or expired look the same from here); anything else (too many
 * attempts, no connection) says what happened, since the link may still be open.
 */
function ClosedLink({ error }: { error: Error }) {
  const closed = error instanceof ApiError && error.code === 'proof_closed';
  return (
    <>
      <Text variant="title">{closed ? PROOF_CLOSED_MESSAGE : 'The proof could not be loaded'}</Text>
      <Notice tone={closed ? 'info' : undefined} testID="proof-closed">{closed ? PROOF_CLOSED_ADVICE : error.message}</Notice>
    </>
  );
}

/** One page per stage of the link; later stages (e.g. after delivery) add a branch here. */
function LinkStage({ token, proof }: { token: string; proof: PublicProofView }) {
  switch (proof.stage) {
    case 'proof':
      return <OpenProof token={token} proof={proof} />;
  }
}

/** The design, then the quote (when the shop adds one), then the customer's answer. */
function OpenProof({ token, proof }: { token: string; proof: PublicProofView }) {
  if (proof.arrival) return <Arrived token={token} proof={proof} arrival={proof.arrival} />;
  const parsed = parseLayout(proof.layout);
  const decided = proof.state === 'approved' || proof.state === 'changes_asked';
  return (
    <>
      <Text variant="caption">{proof.shop.name} sent you this design</Text>
      <Text variant="title" testID="proof-title">
        {proof.jobTitle}
      </Text>
      {proof.message ? <Text testID="proof-message">{proof.message}</Text> : null}
      {parsed.ok ? (
        <ProofDesign layout={parsed.layout} drawing={proof.drawing} pieces={proof.pieces} />
      ) : (
        <Notice>The design could not be drawn here. Ask the shop to send it again.</Notice>
      )}
      {proof.quote ? <ProofQuote quote={proof.quote} /> : null}
      {decided ? <ProofAnswered proof={proof} /> : <ProofDecision token={token} />}
      <Text variant="caption">
        {proof.shop.email ? `Questions? Write to ${proof.shop.name} at ${proof.shop.email}. ` : ''}
        {decided ? '' : `This link stays open until ${new Date(proof.expiresAt).toLocaleDateString()}.`}
      </Text>
    </>
  );
}

/** Once shipped, the link asks how the frame arrived instead of showing the decision. */
function Arrived({ token, proof, arrival }: { token: string; proof: PublicProofView; arrival: NonNullable<PublicProofView['arrival']> }) {
  return (
    <>
      <Text variant="caption">{proof.jobTitle}</Text>
      <ArrivalForm token={token} arrival={arrival} shopName={proof.shop.name} />
      {proof.shop.email ? <Text variant="caption">Questions? Write to {proof.shop.name} at {proof.shop.email}.</Text> : null}
    </>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.md, backgroundColor: colors.card, padding: space.lg, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.line },
});
