import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { PHOTO_MAX_MB, pickPhoto } from '../ui/pickPhoto';
import { Button } from '../ui/Button';
import { Text } from '../ui/Text';
import { colors, space } from '../ui/theme';
import type { PickedPhoto } from './queries';

/** An optional photo of the customer's own sketch or note; a file over the limit is stopped before it is sent. */
export function SketchPhotoPicker({ photo, onChange }: { photo: PickedPhoto | null; onChange: (photo: PickedPhoto | null) => void }) {
  const [problem, setProblem] = useState<string | null>(null);
  const pick = async () => {
    setProblem(null);
    const picked = await pickPhoto();
    if (picked.kind === 'too_large') setProblem(picked.message);
    if (picked.kind === 'picked') onChange({ part: picked.part, name: picked.name });
  };
  return (
    <View style={styles.box}>
      <Text variant="caption">You can add a photo of a sketch or a note (JPEG, PNG, WebP or AVIF, up to {PHOTO_MAX_MB} MB).</Text>
      {photo ? (
        <View style={styles.row}>
          <Text testID="proof-sketch-name">Photo added: {photo.name}</Text>
          <Button kind="secondary" label="Remove the photo" onPress={() => onChange(null)} testID="proof-sketch-remove" />
        </View>
      ) : (
        <Button kind="secondary" label="Add a photo" onPress={() => void pick()} testID="proof-sketch-add" />
      )}
      {problem ? (
        <Text variant="caption" style={styles.problem} role="alert">
          {problem}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.xs, alignItems: 'flex-start', alignSelf: 'stretch' },
  row: { gap: space.xs, alignItems: 'flex-start' },
  problem: { color: colors.danger },
});
