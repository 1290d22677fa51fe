import { readFileSync } from 'node:fs';
import path from 'node:path';
import { deflateSync, crc32 } from 'node:zlib';
import { PNG } from 'pngjs';
import { checkImage, ImageCheckError, MAX_IMAGE_SIDE_PX } from '@/server/domain/attachments/check-image';

const fixture = (name: string) => readFileSync(path.join(__dirname, '../../../fixtures/attachments', name));

/** The whole 64 × 48 fixtures of each format, with their content types (tests/fixtures/attachments/README.md). */
const WHOLE_FIXTURES = [
  ['ridge-64x48.png', 'image/png'],
  ['ridge-64x48.jpg', 'image/jpeg'],
  ['ridge-64x48-progressive.jpg', 'image/jpeg'],
  ['ridge-64x48.webp', 'image/webp'],
  ['ridge-64x48-lossless.webp', 'image/webp'],
] as const;

describe('checkImage: whole images', () => {
  // Dimensions as GDAL wrote them (tests/fixtures/attachments/README.md; `gdalinfo` "Size is 64, 48").
  it.each(WHOLE_FIXTURES)('%s is whole and 64 × 48', (name, type) => {
    expect(checkImage(fixture(name), type)).toEqual({ widthPx: 64, heightPx: 48 });
  });

  it('reports a JPEG with EXIF orientation 6 as displayed: 48 × 64. Source: EXIF 2.3 (CIPA DC-008) tag 0x0112, value 6 = rotate 90° CW', () => {
    expect(checkImage(fixture('ridge-64x48-orientation6.jpg'), 'image/jpeg')).toEqual({ widthPx: 48, heightPx: 64 });
  });

  it('accepts a PNG that pngjs writes, with the size pngjs was given', () => {
    const png = new PNG({ width: 300, height: 7 });
    png.data.fill(200);
    expect(checkImage(PNG.sync.write(png), 'image/png')).toEqual({ widthPx: 300, heightPx: 7 });
  });

  it('accepts bytes after a JPEG EOI (some cameras append data after the image)', () => {
    const jpeg = fixture('ridge-64x48.jpg');
    expect(checkImage(Buffer.concat([jpeg, Buffer.from('trailing data')]), 'image/jpeg')).toEqual({ widthPx: 64, heightPx: 48 });
  });
});

describe('checkImage: cut or damaged images are refused', () => {
  const cuts = (b: Buffer) => [b.length - 1, b.length - 2, Math.floor(b.length / 2), 40];
  // Source: PNG specification 5.6: IEND must be last; a file cut anywhere before its end lacks it.
  // Source: ITU-T T.81 B.2.1: the compressed image data ends with EOI (X'FFD9').
  // Source: RFC 9649 2.5: File Size counts the bytes after the first 8; a cut file is shorter.
  it.each(WHOLE_FIXTURES)('%s cut short', (name, type) => {
    const whole = fixture(name);
    for (const at of cuts(whole)) {
      expect(() => checkImage(whole.subarray(0, at), type)).toThrow(ImageCheckError);
    }
  });

  it('refuses a PNG whose chunk fails its CRC. Source: PNG specification 5.3 (CRC-32 over chunk type and data)', () => {
    const damaged = Buffer.from(fixture('ridge-64x48.png'));
    damaged[40] = damaged[40]! ^ 0xff; // a byte inside the first IDAT (IHDR ends at byte 33)
    expect(() => checkImage(damaged, 'image/png')).toThrow(/fails its CRC/);
  });

  it('refuses a PNG without image data (IHDR then IEND)', () => {
    const chunk = (type: string, data: Buffer) => {
      const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
      const out = Buffer.alloc(12 + data.length);
      out.writeUInt32BE(data.length, 0);
      body.copy(out, 4);
      out.writeUInt32BE(crc32(body), 8 + data.length);
      return out;
    };
    const ihdr = Buffer.from([0, 0, 0, 1, 0, 0, 0, 1, 8, 2, 0, 0, 0]);
    const signature = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    const noData = Buffer.concat([signature, chunk('IHDR', ihdr), chunk('IEND', Buffer.alloc(0))]);
    expect(() => checkImage(noData, 'image/png')).toThrow(/no image data/);
    // The same with one IDAT (a 1×1 RGB pixel: filter byte + 3 samples) is whole.
    const withData = Buffer.concat([
      signature,
      chunk('IHDR', ihdr),
      chunk('IDAT', deflateSync(Buffer.from([0, 10, 20, 30]))),
      chunk('IEND', Buffer.alloc(0)),
    ]);
    expect(checkImage(withData, 'image/png')).toEqual({ widthPx: 1, heightPx: 1 });
  });

  it('refuses a JPEG with no frame header (SOI straight to EOI)', () => {
    expect(() => checkImage(Buffer.from([0xff, 0xd8, 0xff, 0xd9]), 'image/jpeg')).toThrow(/no frame header/);
  });

  it(`refuses images larger than ${MAX_IMAGE_SIDE_PX} pixels on a side (declared in the header)`, () => {
    const png = Buffer.from(fixture('ridge-64x48.png'));
    png.writeUInt32BE(MAX_IMAGE_SIDE_PX + 1, 16); // IHDR width
    png.writeUInt32BE(crc32(png.subarray(12, 29)), 29); // keep the IHDR CRC valid
    expect(() => checkImage(png, 'image/png')).toThrow(/at most 30000 pixels/);
  });
});
