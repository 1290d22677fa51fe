import { cleanFileName, FILE_NAME_MAX } from '@/server/domain/attachments/clean-file-name';
import { typeOfExtension } from '@/server/domain/attachments/type-of-extension';

describe('cleanFileName', () => {
  it('drops folders a client sent with the name. Source: RFC 7578 4.2', () => {
    expect(cleanFileName('C:\\Users\\crew\\north.jpg')).toBe('north.jpg');
    expect(cleanFileName('../../etc/passwd')).toBe('passwd');
  });
  it('removes control characters and leading dots, keeps other Unicode', () => {
    expect(cleanFileName('.hidden\u0000name\r\n.png')).toBe('hiddenname.png');
    expect(cleanFileName('Blick nach Süden.webp')).toBe('Blick nach Süden.webp');
  });
  it('falls back when nothing is left', () => {
    expect(cleanFileName('   ')).toBe('upload');
    expect(cleanFileName('folder/')).toBe('upload');
  });
  it('shortens long names keeping the extension', () => {
    const long = `${'a'.repeat(400)}.jpeg`;
    const cleaned = cleanFileName(long);
    expect([...cleaned]).toHaveLength(FILE_NAME_MAX);
    expect(cleaned.endsWith('.jpeg')).toBe(true);
  });
});

describe('typeOfExtension', () => {
  // Source: IANA media type registrations (file extensions listed in each registration).
  it.each([
    ['view.JPG', 'image/jpeg'],
    ['view.jpeg', 'image/jpeg'],
    ['view.png', 'image/png'],
    ['view.webp', 'image/webp'],
    ['plan.pdf', 'application/pdf'],
    ['notes.txt', 'text/plain'],
    ['bearings.csv', 'text/csv'],
  ])('%s → %s', (name, type) => {
    expect(typeOfExtension(name)).toBe(type);
  });
  it('knows nothing of other or missing extensions', () => {
    expect(typeOfExtension('notes')).toBeNull();
    expect(typeOfExtension('log.1')).toBeNull();
    expect(typeOfExtension('archive.tar.gz')).toBeNull();
  });
});
