import { readdir, rm, stat } from 'node:fs/promises';
import path from 'node:path';

/** An upload folder untouched this long was left by a request that never finished (a crash, a kill). */
export const STALE_UPLOAD_MS = 60 * 60 * 1000;

/** The newest modification time of a folder and the files directly in it, ms. */
async function newestMtimeMs(dir: string): Promise<number> {
  let newest = (await stat(dir)).mtimeMs;
  for (const entry of await readdir(dir, { withFileTypes: true })) {
    const s = await stat(path.join(dir, entry.name)).catch(() => null);
    if (s) newest = Math.max(newest, s.mtimeMs);
  }
  return newest;
}

/**
 * Removes the per-request upload folders (`upload-*`, see `receiveUpload`) under
 * each root that nothing has written to for `olderThanMs`: what a server killed
 * mid-upload leaves behind. An upload still arriving keeps its file's mtime fresh,
 * so another server process sharing the folder loses nothing.
 *
 * @returns how many folders and bytes were removed
 */
export async function cleanStaleUploads(
  roots: string[],
  { olderThanMs = STALE_UPLOAD_MS, now = Date.now() }: { olderThanMs?: number; now?: number } = {},
): Promise<{ folders: number; bytes: number }> {
  let folders = 0;
  let bytes = 0;
  for (const root of roots) {
    const entries = await readdir(root, { withFileTypes: true }).catch(() => []);
    for (const entry of entries) {
      if (!entry.isDirectory() || !entry.name.startsWith('upload-')) continue;
      const dir = path.join(root, entry.name);
      try {
        if (now - (await newestMtimeMs(dir)) < olderThanMs) continue;
        for (const f of await readdir(dir)) bytes += (await stat(path.join(dir, f)).catch(() => ({ size: 0 }))).size;
        await rm(dir, { recursive: true, force: true });
        folders++;
      } catch {
        // Removed meanwhile by its own request: nothing to do.
      }
    }
  }
  return { folders, bytes };
}
