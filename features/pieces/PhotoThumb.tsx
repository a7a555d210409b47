import { useState } from 'react';
import { Image, Linking, Pressable, StyleSheet, View } from 'react-native';
import { Button } from '../ui/Button';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import { photoUrl, useDeletePhoto } from './queries';
import type { PhotoSummary } from './schema';

const THUMB_PX = 112;

/**
 * A photo's preview, whole and uncropped inside a square (a plaque's text or a
 * jersey's sleeves stay in view); tap opens the original, and removal asks first.
 */
export function PhotoThumb({ jobId, photo, pieceLabel }: { jobId: string; photo: PhotoSummary; pieceLabel: string }) {
  const remove = useDeletePhoto(jobId);
  const [confirming, setConfirming] = useState(false);
  const description = `Photo of ${pieceLabel}, ${photo.widthPx} by ${photo.heightPx} pixels`;

  return (
    <View style={styles.box}>
      <Pressable role="link" aria-label={`Open ${description}`} onPress={() => void Linking.openURL(photoUrl(photo.id, 'original'))}>
        <Image source={{ uri: photoUrl(photo.id) }} style={styles.image} resizeMode="contain" aria-label={description} testID="photo-thumb" />
      </Pressable>
      {confirming ? (
        <View style={styles.confirm}>
          <Text variant="caption">Remove this photo?</Text>
          <Button label="Keep" kind="quiet" onPress={() => setConfirming(false)} />
          <Button label="Remove" kind="secondary" busy={remove.isPending} onPress={() => remove.mutate(photo.id)} testID="confirm-remove-photo" />
        </View>
      ) : (
        <Button label="Remove photo" kind="quiet" onPress={() => setConfirming(true)} testID="remove-photo" />
      )}
      {remove.isError ? (
        <Text variant="caption" style={styles.problem} role="alert">
          {remove.error.message}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { width: THUMB_PX + space.xl * 2, alignItems: 'center', gap: space.xs },
  image: { width: THUMB_PX, height: THUMB_PX, borderRadius: radius.sm, backgroundColor: colors.paper, borderWidth: 1, borderColor: colors.line },
  confirm: { alignItems: 'center' },
  problem: { color: colors.danger },
});
