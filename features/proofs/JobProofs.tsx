import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Image, StyleSheet, View } from 'react-native';
import { ApiError } from '../api/client';
import { authQueries } from '../auth/queries';
import { layoutQueries } from '../layouts/queries';
import { Button } from '../ui/Button';
import { ChoiceChips } from '../ui/ChoiceChips';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, radius, space } from '../ui/theme';
import { errorMessage } from '../ui/useFieldErrors';
import { proofQueries, useRevokeProof, useSendProof } from './queries';
import { proofStateLabels, type ProofSummary } from './schema';
import { dayText, momentText } from '../ui/dates';

/** The job's proofs with their states; designers send a new one (freezing the draft) or revoke an open one. */
export function JobProofs({ jobId }: { jobId: string }) {
  const proofs = useQuery(proofQueries.job(jobId));
  const me = useQuery(authQueries.me());
  const canSend = me.data !== undefined && me.data.member.role !== 'front_desk';
  const latestChanges = proofs.data?.proofs.find((p) => p.state === 'changes_asked' || p.state === 'approved');
  return (
    <View style={styles.card} testID="proofs-section">
      <Text variant="heading">Proofs for the customer</Text>
      {proofs.isError ? <Notice title="The proofs could not be loaded">{proofs.error.message}</Notice> : null}
      {latestChanges?.state === 'changes_asked' && latestChanges === proofs.data?.proofs[0] ? (
        <Notice title="The customer asked for changes" testID="proof-changes-asked">
          {latestChanges.changesComment ?? ''}
        </Notice>
      ) : null}
      {latestChanges?.state === 'changes_asked' && latestChanges === proofs.data?.proofs[0] && latestChanges.changesPhotoUrl ? (
        <ChangesPhoto url={latestChanges.changesPhotoUrl} />
      ) : null}
      {proofs.data?.proofs.length === 0 ? <Text variant="caption">No proof sent yet.</Text> : null}
      {proofs.data?.proofs.map((p) => <ProofRow key={p.id} jobId={jobId} proof={p} canRevoke={canSend} />)}
      {canSend ? <SendProof jobId={jobId} /> : null}
    </View>
  );
}

function ProofRow({ jobId, proof, canRevoke }: { jobId: string; proof: ProofSummary; canRevoke: boolean }) {
  const revoke = useRevokeProof(jobId);
  const open = proof.state === 'sent' || proof.state === 'opened';
  return (
    <View style={styles.row} testID="proof-row">
      <Text variant="label" testID="proof-state">
        {proofStateLabels[proof.state]}
      </Text>
      <Text variant="caption">
        {proof.layoutName}, version {proof.versionNumber} · sent {momentText(proof.sentAt)}
        {proof.sentByName ? ` by ${proof.sentByName}` : ''} · open until {dayText(proof.expiresAt)}
      </Text>
      {proof.approvedName ? <Text>Approved by {proof.approvedName}</Text> : null}
      {proof.changesComment ? <Text>Customer wrote: {proof.changesComment}</Text> : null}
      {proof.changesPhotoUrl ? <Text variant="caption">With a photo of their sketch or note.</Text> : null}
      {open && canRevoke ? <Button kind="secondary" label="Revoke the link" onPress={() => revoke.mutate(proof.id)} busy={revoke.isPending} testID="proof-revoke" /> : null}
      {revoke.isError ? <Notice>{revoke.error.message}</Notice> : null}
    </View>
  );
}

/** The customer's photo of a sketch or note, served to signed-in staff only. */
function ChangesPhoto({ url }: { url: string }) {
  return (
    <View style={styles.photoBox}>
      <Text variant="label">The customer's photo</Text>
      <Image source={{ uri: url }} style={styles.photo} resizeMode="contain" testID="proof-changes-photo" alt="Photo the customer sent with their request for changes" />
    </View>
  );
}

function SendProof({ jobId }: { jobId: string }) {
  const layouts = useQuery(layoutQueries.job(jobId));
  const send = useSendProof(jobId);
  const [chosen, setChosen] = useState<string | null>(null);
  const [message, setMessage] = useState('');
  const [delivery, setDelivery] = useState<'link' | 'email'>('email');
  const list = layouts.data?.layouts ?? [];
  if (list.length === 0) return <Text variant="caption">Start a layout to send a proof of it.</Text>;
  const layout = list.find((l) => l.id === chosen) ?? list[0]!;
  const sendNow = () =>
    send.mutate({ layoutId: layout.id, baseRevision: layout.draftRevision, message, emailCustomer: delivery === 'email' }, { onSuccess: () => setMessage('') });
  return (
    <View style={styles.send}>
      {list.length > 1 ? (
        <ChoiceChips label="Layout to send" options={list.map((l) => ({ value: l.id, label: l.name }))} value={layout.id} onChange={setChosen} />
      ) : null}
      <TextField label="Message to the customer" value={message} onChangeText={setMessage} multiline maxLength={2000} testID="proof-message-input" />
      <ChoiceChips
        label="How the customer gets the link"
        options={[
          { value: 'email', label: 'E-mail it to the customer' },
          { value: 'link', label: 'I will pass the link on myself' },
        ]}
        value={delivery}
        onChange={setDelivery}
        testID="proof-delivery"
      />
      <Text variant="caption">Sending freezes the current draft of {layout.name} as a new version; a layout that cannot be cut is not sent. An open proof of this job is replaced. The job's newest quote, if there is one, goes with it.</Text>
      <Button label="Send proof" onPress={sendNow} busy={send.isPending} testID="send-proof" />
      {send.isError ? <Notice>{sendErrorWords(send.error)}</Notice> : null}
      {send.data?.emailedTo ? <Notice tone="info">{`The link was e-mailed to ${send.data.emailedTo}.`}</Notice> : null}
      {send.data?.mailError ? <Notice title="The proof was made but the e-mail failed">{send.data.mailError}</Notice> : null}
      {send.data ? <SentLink link={send.data.link} /> : null}
    </View>
  );
}

/** The server's words, with the named field's reason when there is one (e.g. no customer e-mail). */
function sendErrorWords(error: Error): string {
  const fields = error instanceof ApiError ? Object.values(error.fields) : [];
  return fields[0] ?? errorMessage(error) ?? error.message;
}

/** The link is shown once, right after sending: the server keeps only its hash. */
function SentLink({ link }: { link: string }) {
  return (
    <View style={styles.link}>
      <Text variant="label">Link for the customer (shown only now; copy it)</Text>
      <Text selectable testID="proof-link">
        {link}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.sm, backgroundColor: colors.card, padding: space.lg, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.line },
  row: { gap: space.xs, paddingVertical: space.sm, borderTopWidth: 1, borderTopColor: colors.line },
  send: { gap: space.sm, marginTop: space.sm },
  photoBox: { gap: space.xs },
  photo: { width: '100%', maxWidth: 360, aspectRatio: 1, borderRadius: radius.sm, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.card },
  link: { gap: space.xs, padding: space.sm, borderRadius: radius.sm, borderWidth: 1, borderColor: colors.line },
});
