import type { PickedFile } from './file-part';

export type { PickedFile } from './file-part';

/** The value to append to FormData for a picked file: in the browser, the File itself. */
export function filePart(f: PickedFile): unknown {
  if (!f.file) throw new Error('The browser did not hand over the picked file. Choose it again.');
  return f.file;
}
