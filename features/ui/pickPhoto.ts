import * as DocumentPicker from 'expo-document-picker';
import { PHOTO_MAX_BYTES } from '../pieces/schema';

export const PHOTO_MAX_MB = PHOTO_MAX_BYTES / (1024 * 1024);

/** What choosing a photo gave: nothing (cancelled), a file over the limit, or a multipart part to send. */
export type PhotoPick =
  | { readonly kind: 'cancelled' }
  | { readonly kind: 'too_large'; readonly message: string }
  | { readonly kind: 'picked'; readonly part: Blob; readonly name: string };

/** The picked file as a multipart part: a File on the web, a file URI on a phone. */
function photoPart(asset: DocumentPicker.DocumentPickerAsset): Blob {
  if (asset.file) return asset.file;
  // React Native's FormData reads { uri, name, type } and streams the file itself.
  return { uri: asset.uri, name: asset.name, type: asset.mimeType ?? 'application/octet-stream' } as unknown as Blob;
}

/**
 * One photo from the device, the same way everywhere a photo is uploaded (pieces, a customer's sketch,
 * the arrival page): a file over the server's limit is stopped here, before it is sent.
 */
export async function pickPhoto(): Promise<PhotoPick> {
  const picked = await DocumentPicker.getDocumentAsync({ type: 'image/*', multiple: false, copyToCacheDirectory: true, base64: false });
  const asset = picked.canceled ? undefined : picked.assets[0];
  if (!asset) return { kind: 'cancelled' };
  if (asset.size !== undefined && asset.size > PHOTO_MAX_BYTES) {
    const size = (asset.size / (1024 * 1024)).toFixed(1);
    return { kind: 'too_large', message: `${asset.name} is ${size} MB; photos can be up to ${PHOTO_MAX_MB} MB. Save a smaller copy and try again.` };
  }
  return { kind: 'picked', part: photoPart(asset), name: asset.name };
}
