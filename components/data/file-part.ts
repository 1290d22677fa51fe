/** A file the person picked, as the picker describes it. */
export interface PickedFile {
  name: string;
  /** Bytes, when the picker knows. */
  size?: number;
  mimeType?: string;
  /** Local URI (native) or object URL (web), usable as an image source for a preview. */
  uri: string;
  /** The browser's File (web only). */
  file?: File;
}

/**
 * The value to append to FormData for a picked file. React Native's FormData
 * takes `{ uri, name, type }` and streams the file from disk.
 */
export function filePart(f: PickedFile): unknown {
  return { uri: f.uri, name: f.name, type: f.mimeType ?? 'application/octet-stream' };
}
