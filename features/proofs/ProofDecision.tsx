import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { Button } from '../ui/Button';
import { ChoiceChips } from '../ui/ChoiceChips';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { space } from '../ui/theme';
import { errorMessage } from '../ui/useFieldErrors';
import { useSchemaForm } from '../ui/useSchemaForm';
import { useDecideProof, type PickedPhoto } from './queries';
import { SketchPhotoPicker } from './SketchPhotoPicker';
import { proofApproveFields, proofChangesFields, type PublicProofView } from './schema';

type Choice = 'approve' | 'changes';

/** The customer's one answer: approve with a typed name, or say what should change. */
export function ProofDecision({ token }: { token: string }) {
  const [choice, setChoice] = useState<Choice>('approve');
  return (
    <View style={styles.box}>
      <Text variant="heading">Your answer</Text>
      <ChoiceChips<Choice>
        label="What would you like to do?"
        options={[
          { value: 'approve', label: 'Approve this design' },
          { value: 'changes', label: 'Ask for changes' },
        ]}
        value={choice}
        onChange={setChoice}
        testID="proof-choice"
      />
      {choice === 'approve' ? <ApproveForm token={token} /> : <ChangesForm token={token} />}
      <Text variant="caption">You can answer once. After that, write to the shop if something changes.</Text>
    </View>
  );
}

function ApproveForm({ token }: { token: string }) {
  const decide = useDecideProof(token);
  const { values, set, fields, hasFieldErrors, submit: check } = useSchemaForm(proofApproveFields, { name: '' });
  const submit = () => check((input, onError) => decide.mutate({ input: { decision: 'approve', ...input } }, { onError }));
  return (
    <>
      {decide.isError && !hasFieldErrors ? <Notice>{errorMessage(decide.error) ?? ''}</Notice> : null}
      <TextField label="Your name" hint="Typing your name approves the design as shown." value={values.name} onChangeText={set('name')} autoComplete="name" error={fields.name} testID="proof-name" maxLength={120} />
      <Button label="Approve the design" onPress={submit} busy={decide.isPending} testID="proof-approve" />
    </>
  );
}

function ChangesForm({ token }: { token: string }) {
  const decide = useDecideProof(token);
  const [photo, setPhoto] = useState<PickedPhoto | null>(null);
  const { values, set, fields, hasFieldErrors, submit: check } = useSchemaForm(proofChangesFields, { comment: '' });
  const submit = () => check((input, onError) => decide.mutate({ input: { decision: 'changes', ...input }, photo }, { onError }));
  return (
    <>
      {decide.isError && !hasFieldErrors ? <Notice>{errorMessage(decide.error) ?? ''}</Notice> : null}
      <TextField label="What should change?" value={values.comment} onChangeText={set('comment')} multiline numberOfLines={4} error={fields.comment} testID="proof-comment" maxLength={2000} />
      <SketchPhotoPicker photo={photo} onChange={setPhoto} />
      <Button label="Send my changes" onPress={submit} busy={decide.isPending} testID="proof-send-changes" />
    </>
  );
}

/** What the customer answered, shown instead of the form once decided. */
export function ProofAnswered({ proof }: { proof: PublicProofView }) {
  const when = proof.decidedAt ? new Date(proof.decidedAt).toLocaleString() : '';
  if (proof.state === 'approved') {
    return (
      <Notice tone="info" title="You approved this design" testID="proof-answered">
        {`Approved by ${proof.approvedName ?? ''} on ${when}. The shop will go ahead with it.`}
      </Notice>
    );
  }
  return (
    <Notice tone="info" title="You asked for changes" testID="proof-answered">
      {`On ${when} you wrote: "${proof.changesComment ?? ''}".${proof.changesPhotoSent ? ' Your photo went with it.' : ''} The shop will send you a new proof.`}
    </Notice>
  );
}

const styles = StyleSheet.create({ box: { gap: space.sm } });
