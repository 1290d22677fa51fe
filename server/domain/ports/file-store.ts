/* Port: the file store the use cases keep uploads in (a folder on disk in server/storage/file-store). */

import type { Readable } from 'node:stream';

/** What the store knows of one stored file. */
export interface StoredFile {
  /** Opaque key, e.g. `3f/3f2a…`; the only handle callers keep (in PostgreSQL). */
  readonly key: string;
  readonly bytes: number;
  /** sha256 of the content, hex. */
  readonly sha256: string;
}

/**
 * Where uploaded bytes live (attachments, terrain). Metadata belongs in
 * PostgreSQL; the store only keeps bytes under opaque keys, so a cloud bucket
 * can replace the disk later without touching callers.
 */
export interface FileStore {
  /** Streams `source` into a new file; either the whole file is stored or nothing. */
  put(source: Readable | Buffer, options?: { maxBytes?: number }): Promise<StoredFile>;
  /** Moves a file already on this machine (an upload's temp file) into the store. */
  adopt(localPath: string): Promise<StoredFile>;
  /** A stream of the file's bytes; rejects with code `ENOENT` when the key is unknown. */
  open(key: string): Promise<Readable>;
  /** A local path to read the file from (workers map terrain from it). */
  localPath(key: string): string;
  /** Removes the file; removing a missing key is not an error. */
  remove(key: string): Promise<void>;
}
