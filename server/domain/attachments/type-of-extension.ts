import type { AttachmentContentType } from '@/shared/schemas/attachment';

const BY_EXTENSION: Record<string, AttachmentContentType> = {
  jpg: 'image/jpeg',
  jpeg: 'image/jpeg',
  jpe: 'image/jpeg',
  png: 'image/png',
  webp: 'image/webp',
  pdf: 'application/pdf',
  txt: 'text/plain',
  text: 'text/plain',
  csv: 'text/csv',
};

/**
 * The accepted type a file name's extension stands for, or null when the
 * extension is missing or not one Kenning knows. Used to refuse a file whose
 * name claims one type while its bytes are another (a text file named
 * `view.jpg`), never to decide the type.
 *
 * @param fileName - a file name (no folders), any case
 * @returns the content type the extension usually means, or null
 *
 * Source: IANA media type registrations for image/jpeg, image/png,
 * image/webp, application/pdf, text/plain and text/csv (their usual file
 * extensions).
 *
 * @example
 * typeOfExtension('North view.JPG'); // 'image/jpeg'
 * typeOfExtension('notes');          // null
 */
export function typeOfExtension(fileName: string): AttachmentContentType | null {
  const match = /\.([a-z0-9]{1,8})$/i.exec(fileName.trim());
  return match ? (BY_EXTENSION[match[1]!.toLowerCase()] ?? null) : null;
}
