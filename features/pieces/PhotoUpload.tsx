import * as DocumentPicker from 'expo-document-picker';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { ApiError } from '../api/client';
import { Button } from '../ui/Button';
import { Text } from '../ui/Text';
import { colors, space } from '../ui/theme';
import { useUploadPhoto } from './queries';
import { PHOTO_MAX_BYTES } from './schema';

interface Props {
  jobId: string;
  pieceId: string;
  pieceLabel: string;
}

const MAX_MB = PHOTO_MAX_BYTES / (1024 * 1024);

/** The picked file as a multipart part: a File on the web, a file URI on a phone. */
function photoPart(asset: DocumentPicker.DocumentPickerAsset): Blob {
  if (asset.file) return asset.file;
  // React Native's FormData reads { uri, name, type } and streams the file itself.
  return { uri: asset.uri, name: asset.name, type: asset.mimeType ?? 'application/octet-stream' } as unknown as Blob;
}

/** Words for a failed upload; the server's own message already says what to do. */
function uploadProblem(error: unknown): string {
  if (error instanceof ApiError) return error.message;
  return 'The photo could not be uploaded. Try again.';
}

/** Picks one photo and uploads it; a file over the limit is stopped here before it is sent. */
export function PhotoUpload({ jobId, pieceId, pieceLabel }: Props) {
  const upload = useUploadPhoto(jobId, pieceId);
  const [problem, setProblem] = useState<string | null>(null);

  const pick = async () => {
    setProblem(null);
    const picked = await DocumentPicker.getDocumentAsync({ type: 'image/*', multiple: false, copyToCacheDirectory: true, base64: false });
    const asset = picked.canceled ? undefined : picked.assets[0];
    if (!asset) return;
    if (asset.size !== undefined && asset.size > PHOTO_MAX_BYTES) {
      setProblem(`${asset.name} is ${(asset.size / (1024 * 1024)).toFixed(1)} MB; photos can be up to ${MAX_MB} MB. Save a smaller copy and try again.`);
      return;
    }
    const form = new FormData();
    form.append('photo', photoPart(asset), asset.name);
    upload.mutate(form, { onError: (e) => setProblem(uploadProblem(e)) });
  };

  return (
    <View style={styles.box}>
      <Button label="Add a photo" kind="secondary" onPress={() => void pick()} busy={upload.isPending} testID={`add-photo-${pieceLabel}`} />
      {problem ? (
        <Text variant="caption" style={styles.problem} role="alert" testID="photo-upload-problem">
          {problem}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.xs, alignItems: 'flex-start', alignSelf: 'stretch' },
  problem: { color: colors.danger },
});
