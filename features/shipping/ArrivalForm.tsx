import { useState } from 'react';
import { Image, StyleSheet, View } from 'react-native';
import { PHOTO_MAX_MB, pickPhoto } from '../ui/pickPhoto';
import type { PublicProofView } from '../proofs/schema';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, radius, space } from '../ui/theme';
import { useArrivalComment, useArrivalPhoto } from './queries';

type Arrival = NonNullable<PublicProofView['arrival']>;

function ArrivalPhotos({ token, arrival }: { token: string; arrival: Arrival }) {
  const upload = useArrivalPhoto(token);
  const [problem, setProblem] = useState<string | null>(null);
  const room = arrival.maxPhotos - arrival.photos.length;
  const pick = async () => {
    setProblem(null);
    const picked = await pickPhoto();
    if (picked.kind === 'too_large') setProblem(picked.message);
    if (picked.kind !== 'picked') return;
    const form = new FormData();
    form.append('photo', picked.part, picked.name);
    upload.mutate(form, { onError: (e) => setProblem(e.message) });
  };
  return (
    <View style={styles.block}>
      <View style={styles.photos}>
        {arrival.photos.map((p, i) => (
          <Image key={p.url} source={{ uri: p.url }} style={styles.image} resizeMode="contain" aria-label={`Your photo ${i + 1}`} testID="arrival-own-photo" />
        ))}
      </View>
      {room > 0 ? (
        <Button label={arrival.photos.length ? 'Add another photo' : 'Add a photo'} kind="secondary" busy={upload.isPending} onPress={() => void pick()} testID="arrival-add-photo" />
      ) : (
        <Text variant="caption">Thank you for the photos.</Text>
      )}
      <Text variant="caption">Up to {arrival.maxPhotos} photos, JPEG, PNG, WebP or AVIF, {PHOTO_MAX_MB} MB each.</Text>
      {problem ? <Notice>{problem}</Notice> : null}
    </View>
  );
}

/** After delivery the proof's link asks how the frame arrived: a comment and up to three photos. */
export function ArrivalForm({ token, arrival, shopName }: { token: string; arrival: Arrival; shopName: string }) {
  const save = useArrivalComment(token);
  const [comment, setComment] = useState(arrival.comment ?? '');
  const fieldError = save.error && 'fields' in save.error ? (save.error.fields as Record<string, string>).comment : undefined;
  return (
    <View style={styles.block} testID="arrival-form">
      <Text variant="title">How did it arrive?</Text>
      <Text>{shopName} shipped your frame. Tell them how it came through, and show it on your wall or in its box if you like.</Text>
      <TextField label="Your note to the shop" value={comment} onChangeText={setComment} multiline numberOfLines={4} error={fieldError} testID="arrival-comment-field" />
      <Button label={arrival.comment ? 'Update the note' : 'Send the note'} busy={save.isPending} onPress={() => save.mutate(comment)} testID="arrival-send" />
      {save.isSuccess ? <Text testID="arrival-thanks">Thank you, {shopName} has your note.</Text> : null}
      {save.isError && !fieldError ? <Notice>{save.error.message}</Notice> : null}
      <ArrivalPhotos token={token} arrival={arrival} />
      <Notice tone="info" title="Hanging it">
        Hang a heavy frame from two hangers into studs, or into anchors rated for at least twice its weight, following local building codes; ask a licensed installer if unsure.
      </Notice>
    </View>
  );
}

const styles = StyleSheet.create({
  block: { gap: space.md },
  photos: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  image: { width: 110, height: 110, backgroundColor: colors.paper, borderRadius: radius.sm },
});
