import * as DocumentPicker from 'expo-document-picker';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { PHOTO_MAX_BYTES } from '../pieces/schema';
import { Button } from '../ui/Button';
import { Text } from '../ui/Text';
import { colors, space } from '../ui/theme';
import type { PickedPhoto } from './queries';

const MAX_MB = PHOTO_MAX_BYTES / (1024 * 1024);

/** The picked file as a multipart part: a File on the web, a file URI on a phone. */
function photoPart(asset: DocumentPicker.DocumentPickerAsset): Blob {
  if (asset.file) return asset.file;
  return { uri: asset.uri, name: asset.name, type: asset.mimeType ?? 'application/octet-stream' } as unknown as Blob;
}

/** An optional photo of the customer's own sketch or note; a file over the limit is stopped before it is sent. */
export function SketchPhotoPicker({ photo, onChange }: { photo: PickedPhoto | null; onChange: (photo: PickedPhoto | null) => void }) {
  const [problem, setProblem] = useState<string | null>(null);
  const pick = async () => {
    setProblem(null);
    const picked = await DocumentPicker.getDocumentAsync({ type: 'image/*', multiple: false, copyToCacheDirectory: true, base64: false });
    const asset = picked.canceled ? undefined : picked.assets[0];
    if (!asset) return;
    if (asset.size !== undefined && asset.size > PHOTO_MAX_BYTES) {
      setProblem(`${asset.name} is ${(asset.size / (1024 * 1024)).toFixed(1)} MB; a photo can be up to ${MAX_MB} MB. Send a smaller copy.`);
      return;
    }
    onChange({ part: photoPart(asset), name: asset.name });
  };
  return (
    <View style={styles.box}>
      <Text variant="caption">You can add a photo of a sketch or a note (JPEG, PNG, WebP or AVIF, up to {MAX_MB} MB).</Text>
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
