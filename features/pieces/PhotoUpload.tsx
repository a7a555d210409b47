import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { ApiError } from '../api/client';
import { Button } from '../ui/Button';
import { Text } from '../ui/Text';
import { colors, space } from '../ui/theme';
import { pickPhoto } from '../ui/pickPhoto';
import { useUploadPhoto } from './queries';

interface Props {
  jobId: string;
  pieceId: string;
  pieceLabel: string;
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
    const picked = await pickPhoto();
    if (picked.kind === 'too_large') setProblem(picked.message);
    if (picked.kind !== 'picked') return;
    const form = new FormData();
    form.append('photo', picked.part, picked.name);
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
