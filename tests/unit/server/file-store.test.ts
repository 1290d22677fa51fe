import { createHash } from 'node:crypto';
import { existsSync, mkdtempSync, readdirSync, writeFileSync } from 'node:fs';
import { rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import { createDiskFileStore, FileTooLargeError } from '@/server/storage/file-store';

const read = async (s: Readable) => {
  const parts: Buffer[] = [];
  for await (const c of s) parts.push(c as Buffer);
  return Buffer.concat(parts);
};
const sha = (b: Buffer) => createHash('sha256').update(b).digest('hex');
const filesUnder = (dir: string): string[] =>
  readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
    e.isDirectory() ? filesUnder(path.join(dir, e.name)) : [path.join(dir, e.name)],
  );

describe('disk file store', () => {
  let root: string;
  beforeEach(() => {
    root = mkdtempSync(path.join(os.tmpdir(), 'kenning-store-test-'));
  });
  afterEach(() => rm(root, { recursive: true, force: true }));

  it('stores a buffer and gives the same bytes back, with size and sha256', async () => {
    const store = createDiskFileStore(root);
    const bytes = Buffer.from('lookout log, bearing 072°');
    const stored = await store.put(bytes);
    expect(stored.bytes).toBe(bytes.length);
    expect(stored.sha256).toBe(sha(bytes));
    expect(await read(await store.open(stored.key))).toEqual(bytes);
  });

  it('stores a stream in chunks', async () => {
    const store = createDiskFileStore(root);
    const chunks = Array.from({ length: 50 }, (_, i) => Buffer.alloc(1000, i));
    const stored = await store.put(Readable.from(chunks));
    expect(stored.bytes).toBe(50_000);
    expect(stored.sha256).toBe(sha(Buffer.concat(chunks)));
  });

  it('refuses a stream over the limit and leaves no file behind', async () => {
    const store = createDiskFileStore(root);
    const chunks = Array.from({ length: 10 }, () => Buffer.alloc(1000, 7));
    await expect(store.put(Readable.from(chunks), { maxBytes: 4500 })).rejects.toBeInstanceOf(FileTooLargeError);
    expect(filesUnder(root)).toEqual([]);
  });

  it('adopts a temp file by moving it', async () => {
    const store = createDiskFileStore(root);
    const temp = path.join(root, 'upload.tmp');
    writeFileSync(temp, 'elevation grid');
    const stored = await store.adopt(temp);
    expect(existsSync(temp)).toBe(false);
    expect((await read(await store.open(stored.key))).toString()).toBe('elevation grid');
    expect(store.localPath(stored.key).startsWith(root)).toBe(true);
  });

  it('removes a file, and removing it twice is fine', async () => {
    const store = createDiskFileStore(root);
    const { key } = await store.put(Buffer.from('x'));
    await store.remove(key);
    await store.remove(key);
    await expect(store.open(key)).rejects.toMatchObject({ code: 'ENOENT' });
  });

  it('refuses keys that could reach outside the store', () => {
    const store = createDiskFileStore(root);
    expect(() => store.localPath('../etc/passwd')).toThrow(/Not a file-store key/);
  });
});
