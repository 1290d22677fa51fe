import { crc32 } from 'node:zlib';
import { imageSize } from 'image-size';

/** Why an image was refused; `message` is meant for people. */
export class ImageCheckError extends Error {
  override name = 'ImageCheckError';
}

export type ImageContentType = 'image/png' | 'image/jpeg' | 'image/webp';

/** Largest side accepted, pixels (a 200-megapixel phone camera gives about 16 320 × 12 240). */
export const MAX_IMAGE_SIDE_PX = 30_000;

const IMAGE_SIZE_TYPE: Record<ImageContentType, string> = { 'image/png': 'png', 'image/jpeg': 'jpg', 'image/webp': 'webp' };
const NAME: Record<ImageContentType, string> = { 'image/png': 'PNG', 'image/jpeg': 'JPEG', 'image/webp': 'WebP' };

/**
 * Checks that an image whose type was sniffed is whole, and measures it.
 * The container is walked to its end — PNG chunks with their CRCs up to
 * IEND, JPEG marker segments and entropy-coded data up to EOI, the WebP RIFF
 * chunks up to the size its header declares — so a truncated or damaged file
 * is refused. Pixels are not decoded (that would cost a worker thread per
 * upload); `image-size` reads the dimensions from the header.
 *
 * @param bytes - the whole file
 * @param type - the type {@link sniffContentType} found
 * @returns width and height in pixels as displayed (JPEG EXIF orientations 5–8 swap them)
 * @throws {ImageCheckError} when the file is incomplete, damaged or has no readable size
 *
 * Sources: PNG specification (W3C / ISO/IEC 15948) 5.3 "Chunk layout", 5.6
 * "Chunk ordering"; ITU-T T.81 Annex B (marker segments, byte stuffing,
 * RSTn, EOI); RFC 9649 sections 2.4–2.5 (RIFF chunks, padding to even size);
 * EXIF 2.3 (CIPA DC-008) tag 0x0112 Orientation.
 *
 * @example
 * checkImage(readFileSync('ridge-view.png'), 'image/png'); // { widthPx: 1600, heightPx: 900 }
 */
export function checkImage(bytes: Uint8Array, type: ImageContentType): { widthPx: number; heightPx: number } {
  const complete = type === 'image/png' ? pngProblem(bytes) : type === 'image/jpeg' ? jpegProblem(bytes) : webpProblem(bytes);
  if (complete) throw new ImageCheckError(`This ${NAME[type]} image is ${complete}.`);
  let size: ReturnType<typeof imageSize>;
  try {
    size = imageSize(bytes);
  } catch {
    throw new ImageCheckError(`This ${NAME[type]} image has no readable size.`);
  }
  if (size.type !== IMAGE_SIZE_TYPE[type] || !(size.width > 0) || !(size.height > 0)) {
    throw new ImageCheckError(`This ${NAME[type]} image has no readable size.`);
  }
  if (size.width > MAX_IMAGE_SIDE_PX || size.height > MAX_IMAGE_SIDE_PX) {
    throw new ImageCheckError(
      `Images can be at most ${MAX_IMAGE_SIDE_PX} pixels on a side (this one is ${size.width} × ${size.height}).`,
    );
  }
  const turned = type === 'image/jpeg' && (size.orientation ?? 1) >= 5;
  return turned ? { widthPx: size.height, heightPx: size.width } : { widthPx: size.width, heightPx: size.height };
}

const u32be = (b: Uint8Array, i: number) => ((b[i]! << 24) | (b[i + 1]! << 16) | (b[i + 2]! << 8) | b[i + 3]!) >>> 0;
const u32le = (b: Uint8Array, i: number) => (b[i]! | (b[i + 1]! << 8) | (b[i + 2]! << 16) | (b[i + 3]! << 24)) >>> 0;
const fourCc = (b: Uint8Array, i: number) => String.fromCharCode(b[i]!, b[i + 1]!, b[i + 2]!, b[i + 3]!);

/** PNG: IHDR first, every chunk whole with a matching CRC (over type and data), at least one IDAT, then IEND. */
function pngProblem(b: Uint8Array): string | null {
  let i = 8;
  let sawData = false;
  while (i + 12 <= b.length) {
    const length = u32be(b, i);
    const type = fourCc(b, i + 4);
    if (length > 0x7fffffff) return 'damaged (a chunk length is out of range)';
    if (i === 8 && type !== 'IHDR') return 'damaged (it does not start with its header chunk)';
    if (i + 12 + length > b.length) return 'incomplete (cut off inside a chunk)';
    if (crc32(b.subarray(i + 4, i + 8 + length)) !== u32be(b, i + 8 + length)) return `damaged (the ${type} chunk fails its CRC)`;
    if (type === 'IDAT') sawData = true;
    if (type === 'IEND') return sawData ? null : 'damaged (it has no image data)';
    i += 12 + length;
  }
  return 'incomplete (its end chunk is missing)';
}

const isFrameMarker = (m: number) => m >= 0xc0 && m <= 0xcf && m !== 0xc4 && m !== 0xc8 && m !== 0xcc;

/** JPEG: marker segments with their lengths, scans up to the next marker, a frame header, ending in EOI. */
function jpegProblem(b: Uint8Array): string | null {
  let i = 2; // after SOI
  let sawFrame = false;
  while (i < b.length) {
    if (b[i] !== 0xff) return 'damaged (a marker is missing)';
    while (i < b.length && b[i] === 0xff) i++; // fill bytes may precede a marker
    if (i >= b.length) break;
    const marker = b[i++]!;
    if (marker === 0xd9) return sawFrame ? null : 'damaged (it has no frame header)';
    if (marker === 0x01 || (marker >= 0xd0 && marker <= 0xd7)) continue; // TEM and RSTn stand alone
    if (marker === 0x00 || marker === 0xd8) return 'damaged (a marker is out of place)';
    if (i + 2 > b.length) break;
    const length = (b[i]! << 8) | b[i + 1]!;
    if (length < 2) return 'damaged (a segment length is out of range)';
    if (i + length > b.length) break;
    if (isFrameMarker(marker)) sawFrame = true;
    i += length;
    if (marker === 0xda) {
      // Entropy-coded data runs to the next marker; FF00 is a stuffed byte, FFD0–FFD7 restart markers.
      for (;;) {
        const ff = b.indexOf(0xff, i);
        if (ff < 0 || ff + 1 >= b.length) return 'incomplete (cut off inside the image data)';
        const next = b[ff + 1]!;
        if (next === 0x00 || (next >= 0xd0 && next <= 0xd7)) i = ff + 2;
        else if (next === 0xff) i = ff + 1;
        else {
          i = ff;
          break;
        }
      }
    }
  }
  return 'incomplete (its end marker is missing)';
}

/** WebP: the RIFF size covers the file, and the chunks (padded to even sizes) fill it exactly. */
function webpProblem(b: Uint8Array): string | null {
  if (b.length < 20) return 'incomplete (cut off in its header)';
  const end = 8 + u32le(b, 4);
  if (end > b.length) return 'incomplete (shorter than its header says)';
  let i = 12;
  let chunks = 0;
  while (i + 8 <= end) {
    const size = u32le(b, i + 4);
    const next = i + 8 + size + (size % 2);
    // Some writers leave out the pad byte after an odd-sized last chunk; its data is still whole.
    if (next === end + 1 && size % 2 === 1) return null;
    if (next > end) return 'incomplete (cut off inside a chunk)';
    i = next;
    chunks++;
  }
  return chunks > 0 && i === end ? null : 'damaged (its chunks do not fill the file)';
}
