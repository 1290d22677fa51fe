import { createHash, randomUUID } from 'node:crypto';
import { createReadStream, createWriteStream } from 'node:fs';
import { mkdir, rename, rm, stat } from 'node:fs/promises';
import path from 'node:path';
import { Readable, Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { FileStore } from '@/server/domain/ports/file-store';
export type { StoredFile, FileStore } from '@/server/domain/ports/file-store';

/** Thrown when a write exceeds its byte limit; nothing is left stored. */
export class FileTooLargeError extends Error {
  override name = 'FileTooLargeError';
  constructor(readonly limitBytes: number) {
    super(`The file is larger than ${limitBytes} bytes.`);
  }
}

const KEY = /^[0-9a-f]{2}\/[0-9a-f]{32}$/;

/**
 * A {@link FileStore} on the local disk under `root`. Files are written to a
 * temporary name in the same folder and renamed into place, so a reader never
 * sees half a file and a failed write leaves nothing behind.
 */
export function createDiskFileStore(root: string): FileStore {
  const fileOf = (key: string) => {
    if (!KEY.test(key)) throw new Error(`Not a file-store key: ${key}`);
    return path.join(root, key);
  };
  const newKey = () => {
    const id = randomUUID().replaceAll('-', '');
    return `${id.slice(0, 2)}/${id}`;
  };
  const hashFile = async (file: string) => {
    const hash = createHash('sha256');
    await pipeline(createReadStream(file), hash);
    return hash.digest('hex');
  };

  return {
    async put(source, options = {}) {
      const key = newKey();
      const target = fileOf(key);
      await mkdir(path.dirname(target), { recursive: true });
      const temp = `${target}.part`;
      const hash = createHash('sha256');
      let bytes = 0;
      const limit = options.maxBytes ?? Infinity;
      const meter = new Transform({
        transform(chunk: Buffer, _enc, done) {
          bytes += chunk.length;
          if (bytes > limit) return done(new FileTooLargeError(limit));
          hash.update(chunk);
          done(null, chunk);
        },
      });
      try {
        const input = Buffer.isBuffer(source) ? Readable.from([source]) : source;
        await pipeline(input, meter, createWriteStream(temp, { flags: 'wx' }));
        await rename(temp, target);
      } catch (e) {
        await rm(temp, { force: true });
        throw e;
      }
      return { key, bytes, sha256: hash.digest('hex') };
    },

    async adopt(localPath) {
      const key = newKey();
      const target = fileOf(key);
      await mkdir(path.dirname(target), { recursive: true });
      const sha256 = await hashFile(localPath);
      try {
        await rename(localPath, target);
      } catch (e) {
        // Another file system (e.g. /tmp on tmpfs): copy through put, then drop the source.
        if ((e as NodeJS.ErrnoException).code !== 'EXDEV') throw e;
        const stored = await this.put(createReadStream(localPath));
        await rm(localPath, { force: true });
        return stored;
      }
      return { key, bytes: (await stat(target)).size, sha256 };
    },

    async open(key) {
      const file = fileOf(key);
      await stat(file);
      return createReadStream(file);
    },

    localPath: fileOf,

    async remove(key) {
      await rm(fileOf(key), { force: true });
    },
  };
}
