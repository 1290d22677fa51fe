import { existsSync, mkdirSync, mkdtempSync, utimesSync, writeFileSync } from 'node:fs';
import { rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { cleanStaleUploads, STALE_UPLOAD_MS } from '@/server/storage/clean-stale-uploads';

const root = mkdtempSync(path.join(os.tmpdir(), 'kenning-clean-'));
afterAll(() => rm(root, { recursive: true, force: true }));

/** An upload folder with one file, last written `ageMs` ago. */
function upload(name: string, ageMs: number, bytes = 1000) {
  const dir = path.join(root, name);
  mkdirSync(dir);
  const file = path.join(dir, 'part');
  writeFileSync(file, Buffer.alloc(bytes));
  const t = (Date.now() - ageMs) / 1000;
  utimesSync(file, t, t);
  utimesSync(dir, t, t);
  return dir;
}

it('removes the upload folders a killed server left, and keeps uploads still arriving and other folders', async () => {
  const abandoned = upload('upload-abandoned', STALE_UPLOAD_MS + 60_000, 75_000);
  const arriving = upload('upload-arriving', 5_000);
  const other = upload('not-an-upload', STALE_UPLOAD_MS * 2);
  // An old folder whose file is still being written is still arriving.
  const slow = upload('upload-slow', 1_000);
  const t = (Date.now() - STALE_UPLOAD_MS * 3) / 1000;
  utimesSync(slow, t, t);

  const result = await cleanStaleUploads([root, path.join(root, 'missing-root')]);
  expect(result).toEqual({ folders: 1, bytes: 75_000 });
  expect(existsSync(abandoned)).toBe(false);
  expect(existsSync(arriving)).toBe(true);
  expect(existsSync(slow)).toBe(true);
  expect(existsSync(other)).toBe(true);
});
