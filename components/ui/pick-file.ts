import * as DocumentPicker from 'expo-document-picker';
import type { PickedFile } from '@/components/data/file-part';

/**
 * Opens the system's file picker for one file of the given content types
 * (an `<input type="file">` in the browser). Null when the person cancels.
 */
export async function pickFile(types: readonly string[]): Promise<PickedFile | null> {
  const result = await DocumentPicker.getDocumentAsync({ type: [...types], multiple: false, copyToCacheDirectory: true });
  const asset = result.canceled ? undefined : result.assets[0];
  if (!asset) return null;
  return { name: asset.name, size: asset.size, mimeType: asset.mimeType, uri: asset.uri, file: asset.file };
}
