import { mkdirSync, mkdtempSync, statSync, writeFileSync } from 'node:fs';
import { rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { brotliDecompressSync, gunzipSync } from 'node:zlib';
import type { Server } from 'node:http';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import compression from 'compression';
import express from 'express';
import { precompressedAssets, precompressWeb } from '@/server/http/precompressed-assets';

const webDir = mkdtempSync(path.join(os.tmpdir(), 'kenning-web-'));
const jsDir = path.join(webDir, '_expo', 'static', 'js', 'web');
afterAll(() => rm(webDir, { recursive: true, force: true }));

const SCRIPT = `__d(function(){${'console.log("a lookout sees far");'.repeat(400)}});`;
mkdirSync(jsDir, { recursive: true });
writeFileSync(path.join(jsDir, 'entry-0123abcd.js'), SCRIPT);
writeFileSync(path.join(webDir, 'secret.js'), 'not for the web');
writeFileSync(path.join(webDir, 'secret.js.br'), 'not for the web either');
const totals = precompressWeb(webDir);
// A script added after the build step has no compressed copies.
writeFileSync(path.join(jsDir, 'late-4567ef.js'), SCRIPT);

/** The app as server/app.ts puts it together: compression first, then the copies, then the files. */
const app = express();
app.use(compression());
app.use(precompressedAssets(webDir));
app.use(express.static(webDir, { index: false }));

let server: Server;
beforeAll(async () => {
  server = await new Promise<Server>((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
});
afterAll(() => new Promise((resolve) => server.close(resolve)));

/** The answer's status, headers and raw bytes (node:http does not decompress). */
function get(urlPath: string, acceptEncoding: string) {
  const port = (server.address() as AddressInfo).port;
  return new Promise<{ status: number; headers: http.IncomingHttpHeaders; body: Buffer }>((resolve, reject) => {
    http
      .get({ host: '127.0.0.1', port, path: urlPath, headers: { 'Accept-Encoding': acceptEncoding } }, (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
      })
      .on('error', reject);
  });
}

// Source: RFC 9110 §12.5.3 (Accept-Encoding picks among the codings a client accepts) and §8.4 (Content-Encoding
// names the coding applied); brotli is RFC 7932, gzip RFC 1952. Sending precompressed copies is common practice, no source.
describe('precompressed scripts', () => {
  const url = '/_expo/static/js/web/entry-0123abcd.js';

  it('the build step writes smaller brotli and gzip copies that decompress to the script', () => {
    expect(totals.raw).toBe(Buffer.byteLength(SCRIPT));
    expect(totals.br).toBeLessThan(totals.gz);
    expect(totals.gz).toBeLessThan(totals.raw);
  });

  it('sends the brotli copy to a client that accepts brotli, as it is', async () => {
    const res = await get(url, 'gzip, deflate, br, zstd');
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['content-type']).toMatch(/javascript/);
    expect(res.headers['vary']).toMatch(/Accept-Encoding/);
    expect(res.headers['cache-control']).toContain('immutable');
    const body = res.body;
    expect(body.length).toBe(statSync(path.join(jsDir, 'entry-0123abcd.js.br')).size);
    expect(brotliDecompressSync(body).toString()).toBe(SCRIPT);
  });

  it('sends the gzip copy to a client that accepts only gzip', async () => {
    const res = await get(url, 'gzip');
    expect(res.headers['content-encoding']).toBe('gzip');
    expect(gunzipSync(res.body).toString()).toBe(SCRIPT);
  });

  it('sends the plain script to a client that accepts no compression', async () => {
    const res = await get(url, 'identity');
    expect(res.headers['content-encoding']).toBeUndefined();
    expect(res.body.toString()).toBe(SCRIPT);
  });

  it('leaves a script without copies to the compression middleware', async () => {
    const res = await get('/_expo/static/js/web/late-4567ef.js', 'br');
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(brotliDecompressSync(res.body).toString()).toBe(SCRIPT);
  });

  it('never sends a copy from outside the static folder', async () => {
    const res = await get('/_expo/static/..%2F..%2Fsecret.js', 'br');
    expect(res.headers['content-encoding']).toBeUndefined();
    expect(res.body.toString()).not.toContain('either');
  });
});
