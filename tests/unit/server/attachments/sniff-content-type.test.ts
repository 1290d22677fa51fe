import { readFileSync } from 'node:fs';
import path from 'node:path';
import { sniffContentType } from '@/server/domain/attachments/sniff-content-type';

const fixture = (name: string) => readFileSync(path.join(__dirname, '../../../fixtures/attachments', name));
const bytes = (...b: number[]) => Uint8Array.from(b);
const text = (s: string) => new TextEncoder().encode(s);

describe('sniffContentType: magic numbers', () => {
  it.each([
    // Source: PNG specification (W3C PNG 3rd ed. / ISO/IEC 15948:2004), 5.2 "PNG signature": 137 80 78 71 13 10 26 10.
    ['PNG signature', bytes(0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13), 'image/png'],
    // Source: ITU-T T.81 (09/92), Table B.1: SOI = X'FFD8'; every marker begins with X'FF' (B.1.1.3).
    ['JPEG SOI then a marker', bytes(0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10), 'image/jpeg'],
    // Source: RFC 9649 (WebP Image Format), 2.5 "RIFF Header": 'RIFF', File Size (uint32 LE), 'WEBP'.
    ['RIFF … WEBP', new Uint8Array([...text('RIFF'), 4, 0, 0, 0, ...text('WEBP')]), 'image/webp'],
    // Source: ISO 32000-1:2008, 7.5.2 "File Header": the first line is %PDF-1.n.
    ['%PDF-', text('%PDF-1.7\n%\u00e2\u00e3\n1 0 obj'), 'application/pdf'],
  ])('%s → %s', (_what, head, type) => {
    expect(sniffContentType(head, 'anything.bin')).toBe(type);
  });

  it('reads the types of the GDAL-written fixtures from their bytes, whatever their names say', () => {
    expect(sniffContentType(fixture('ridge-64x48.png'), 'a.jpg')).toBe('image/png');
    expect(sniffContentType(fixture('ridge-64x48.jpg'), 'a.png')).toBe('image/jpeg');
    expect(sniffContentType(fixture('ridge-64x48-progressive.jpg'), 'a')).toBe('image/jpeg');
    expect(sniffContentType(fixture('ridge-64x48.webp'), 'a.pdf')).toBe('image/webp');
    expect(sniffContentType(fixture('ridge-64x48-lossless.webp'), 'a.pdf')).toBe('image/webp');
  });

  it('needs the whole signature: a near-miss is not an image', () => {
    // Only 7 of the 8 PNG signature bytes (the final LF is missing). Source: PNG specification 5.2.
    expect(sniffContentType(bytes(0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a), 'x.png')).toBeNull();
    // A RIFF file that is not WebP (WAVE audio). Source: RFC 9649 2.5 (the form type must be 'WEBP').
    expect(sniffContentType(new Uint8Array([...text('RIFF'), 4, 0, 0, 0, ...text('WAVE')]), 'x.webp')).toBeNull();
    // FF D8 alone without the next marker's FF. Source: ITU-T T.81 B.1.1.3.
    expect(sniffContentType(bytes(0xff, 0xd8, 0x00, 0x00), 'x.jpg')).toBeNull();
  });
});

describe('sniffContentType: text', () => {
  it('calls UTF-8 text plain, or CSV when the name ends in .csv', () => {
    const body = text('bearing,range_km\n045,12.5\n090,9.8\n');
    expect(sniffContentType(body, 'Crane Knoll bearings.CSV')).toBe('text/csv');
    expect(sniffContentType(body, 'bearings.txt')).toBe('text/plain');
    expect(sniffContentType(text('Höhe über Grund — 18 m\r\n\tcab floor'), 'notes')).toBe('text/plain');
  });

  it('accepts a UTF-8 byte order mark. Source: Unicode Standard 23.8 (U+FEFF as EF BB BF in UTF-8)', () => {
    expect(sniffContentType(new Uint8Array([0xef, 0xbb, 0xbf, ...text('a;b\n')]), 'x.csv')).toBe('text/csv');
  });

  it('refuses bytes that are not UTF-8 (RFC 3629: 0xC3 must be followed by a continuation byte 80–BF)', () => {
    expect(sniffContentType(bytes(0x61, 0xc3, 0x28, 0x62), 'x.txt')).toBeNull();
    // Latin-1 "é" on its own is not UTF-8 either.
    expect(sniffContentType(bytes(0x63, 0x61, 0x66, 0xe9), 'x.txt')).toBeNull();
  });

  it('refuses control characters that text does not contain (NUL, ESC), e.g. binary data', () => {
    expect(sniffContentType(text('abc\u0000def'), 'x.txt')).toBeNull();
    expect(sniffContentType(text('abc\u001b[31m'), 'x.txt')).toBeNull();
  });

  it('refuses an empty file', () => {
    expect(sniffContentType(new Uint8Array(0), 'x.txt')).toBeNull();
  });

  it('does not mutate its input', () => {
    const input = text('a,b\n');
    const copy = Uint8Array.from(input);
    sniffContentType(input, 'x.csv');
    expect(input).toEqual(copy);
  });
});
