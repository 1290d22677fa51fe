import type { AttachmentContentType } from '@/shared/schemas/attachment';

const startsWith = (bytes: Uint8Array, signature: readonly number[], at = 0) =>
  bytes.length >= at + signature.length && signature.every((b, i) => bytes[at + i] === b);
const ascii = (text: string) => [...text].map((c) => c.charCodeAt(0));

/** PNG signature: 137 80 78 71 13 10 26 10 (PNG specification, 5.2 "PNG signature"). */
export const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a] as const;
/** JPEG: the SOI marker X'FFD8' followed by the X'FF' that opens the next marker (ITU-T T.81, B.1.1.3 and Table B.1). */
export const JPEG_SOI = [0xff, 0xd8, 0xff] as const;
/** WebP: "RIFF", a 4-byte size, then "WEBP" (RFC 9649, 2.5 "RIFF Header"). */
export const RIFF = ascii('RIFF');
export const WEBP = ascii('WEBP');
/** PDF: the header line starts "%PDF-" (ISO 32000-1:2008, 7.5.2 "File Header"). */
export const PDF_HEADER = ascii('%PDF-');
/** UTF-8 byte order mark, allowed before text (Unicode Standard, 23.8 "Specials"). */
const UTF8_BOM = [0xef, 0xbb, 0xbf] as const;

/** C0 control characters other than TAB, LF, FF and CR, and DEL: not found in text files. */
// eslint-disable-next-line no-control-regex
const NOT_TEXT = /[\u0000-\u0008\u000B\u000E-\u001F\u007F]/;

/**
 * Tells what a file is from its bytes, not from its name or the type its
 * sender declared: JPEG, PNG and WebP images and PDF by their leading magic
 * numbers; anything else counts as text when it is valid UTF-8 (an optional
 * byte order mark) without control characters other than TAB, LF, FF and CR.
 * Text can't be told apart from CSV by its bytes, so text whose name ends in
 * `.csv` is `text/csv` and other text is `text/plain`.
 *
 * Only the leading bytes decide the image and PDF types; whether an image is
 * complete is {@link checkImage}'s job.
 *
 * @param bytes - the whole file (text needs every byte to be judged)
 * @param fileName - the uploader's file name, only to tell CSV from plain text
 * @returns the content type, or null when the file is none of the accepted types (or empty)
 *
 * Sources: the PNG specification (W3C, ISO/IEC 15948) section 5.2; ITU-T T.81
 * (JPEG) Annex B; RFC 9649 (WebP) section 2.5; ISO 32000-1 (PDF) section 7.5.2;
 * RFC 3629 (UTF-8).
 *
 * @example
 * sniffContentType(Buffer.from('%PDF-1.7\n…'), 'report.txt'); // 'application/pdf'
 * sniffContentType(Buffer.from('a,b\n1,2\n'), 'counts.csv');  // 'text/csv'
 */
export function sniffContentType(bytes: Uint8Array, fileName: string): AttachmentContentType | null {
  if (bytes.length === 0) return null;
  if (startsWith(bytes, PNG_SIGNATURE)) return 'image/png';
  if (startsWith(bytes, JPEG_SOI)) return 'image/jpeg';
  if (startsWith(bytes, RIFF) && startsWith(bytes, WEBP, 8)) return 'image/webp';
  if (startsWith(bytes, PDF_HEADER)) return 'application/pdf';
  const body = startsWith(bytes, UTF8_BOM) ? bytes.subarray(UTF8_BOM.length) : bytes;
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true, ignoreBOM: true }).decode(body);
  } catch {
    return null;
  }
  if (NOT_TEXT.test(text)) return null;
  return /\.csv$/i.test(fileName.trim()) ? 'text/csv' : 'text/plain';
}
