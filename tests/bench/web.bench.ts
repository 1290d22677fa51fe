/**
 * The first screens of the built web app (dist/web, `npm run build:web`) on
 * loopback in headless Chromium at the phone viewport (390×844), each run in
 * a fresh browser context (empty cache):
 *
 * - first-load JS of the sign-in page: the scripts index.html names, raw and
 *   as the server sends them (the bytes on the wire) to a browser that accepts
 *   brotli (Chromium does, over http too) and to one that accepts only gzip;
 *   and every script the browser fetched before the form was usable;
 * - sign-in usable: navigation start → the E-mail field and the Sign in
 *   button are in the page (React renders on the client, so present = wired);
 * - signed-in home usable: with a session cookie, navigation start of `/` →
 *   the site list shows the demo district;
 * - sign-in to home: from pressing Sign in (page already loaded) → the same.
 *
 * Medians of several runs. Measurement only: no assertions, no pass/fail.
 * Targets from issue 12: sign-in ≤ 1.0 s, home ≤ 1.2 s, first-load JS ≤ 350 KB compressed.
 */
import { existsSync } from 'node:fs';
import http from 'node:http';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import type { Browser, Page } from 'playwright-core';
import { createApp } from '@/server/app';
import { createDatabase } from '@/server/data/database';
import { DEMO_PASSWORD } from '@/server/seeders/demo';
import { launchBrowser, newPage } from '@/tests/support/browser';
import { scratchFileStore, TEST_CONFIG } from '@/tests/support/test-db';

const WEB_DIST_DIR = path.join(__dirname, '..', '..', 'dist', 'web');
const RUNS = 7;
const EMAIL = 'planner@demo.kenning.test';
/** Text the signed-in home shows once the site list has loaded (demo data). */
const HOME_MARKER = 'Harrowmere Forest District';

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
};
const kib = (bytes: number) => bytes / 1024;

/** Milliseconds since navigation start when the sign-in form is in the page. */
function signInUsableAt(page: Page) {
  return page
    .waitForFunction(
      () => {
        const button = [...document.querySelectorAll('[role="button"],button')].some((b) => b.textContent?.trim() === 'Sign in');
        return button && document.querySelectorAll('input').length >= 2 ? performance.now() : false;
      },
      undefined,
      { polling: 'raf', timeout: 30_000 },
    )
    .then((h) => h.jsonValue() as Promise<number>);
}

/** Milliseconds since navigation start when the home shows the site list. */
function homeUsableAt(page: Page) {
  return page
    .waitForFunction((marker) => (document.body.innerText.includes(marker) ? performance.now() : false), HOME_MARKER, {
      polling: 'raf',
      timeout: 30_000,
    })
    .then((h) => h.jsonValue() as Promise<number>);
}

/** The bytes the server sends for `url` to a client that accepts `acceptEncoding` (node:http does not decompress), and the encoding used. */
function sentBytes(url: URL, acceptEncoding: string) {
  return new Promise<{ bytes: number; encoding: string }>((resolve, reject) => {
    http
      .get(url, { headers: { 'Accept-Encoding': acceptEncoding } }, (res) => {
        let bytes = 0;
        res.on('data', (chunk: Buffer) => (bytes += chunk.length));
        res.on('end', () => resolve({ bytes, encoding: String(res.headers['content-encoding'] ?? 'identity') }));
      })
      .on('error', reject);
  });
}

/** The scripts index.html loads before anything renders, summed raw and as sent with brotli and with gzip. */
async function initialScripts(base: string) {
  const html = await (await fetch(`${base}/sign-in`)).text();
  const srcs = [...html.matchAll(/<script[^>]*\ssrc="([^"]+)"/g)].map((m) => m[1]!);
  let raw = 0;
  let br = 0;
  let gzip = 0;
  const encodings = new Set<string>();
  for (const src of srcs) {
    const url = new URL(src, base);
    raw += (await sentBytes(url, 'identity')).bytes;
    const b = await sentBytes(url, 'gzip, deflate, br, zstd');
    const g = await sentBytes(url, 'gzip, deflate');
    br += b.bytes;
    gzip += g.bytes;
    encodings.add(`${b.encoding}/${g.encoding}`);
  }
  return { count: srcs.length, raw, br, gzip, encodings: [...encodings].join(', ') };
}

async function signInRun(browser: Browser, base: string) {
  const { context, page } = await newPage(browser, 'phone');
  const scripts: string[] = [];
  page.on('request', (r) => {
    if (r.resourceType() === 'script') scripts.push(r.url());
  });
  try {
    await page.goto(`${base}/sign-in`, { waitUntil: 'commit' });
    const ms = await signInUsableAt(page);
    // Where the time went: when the last script, the last font and the session answer had arrived.
    // (No named functions inside: tsx would wrap them in a helper the page does not have.)
    const arrived = await page.evaluate(() =>
      performance.getEntriesByType('resource').reduce(
        (acc, e) => {
          const end = (e as PerformanceResourceTiming).responseEnd;
          if (e.name.endsWith('.js')) acc.scripts = Math.max(acc.scripts, end);
          else if (/\.(ttf|otf|woff2?)(\?|$)/.test(e.name)) acc.fonts = Math.max(acc.fonts, end);
          else if (e.name.includes('/api/')) acc.api = Math.max(acc.api, end);
          return acc;
        },
        { scripts: 0, fonts: 0, api: 0 },
      ),
    );
    return { ms, scripts: [...scripts], arrived };
  } finally {
    await context.close();
  }
}

/** `dwellMs`: how long the user stays on the home before opening the site (the shell preloads the deferred chunk). */
async function homeRun(browser: Browser, base: string, dwellMs = 0) {
  const { context, page } = await newPage(browser, 'phone');
  try {
    const res = await context.request.post(`${base}/api/auth/sign-in`, { data: { email: EMAIL, password: DEMO_PASSWORD } });
    if (!res.ok()) throw new Error(`sign-in for the benchmark failed: ${res.status()}`);
    await page.goto(`${base}/`, { waitUntil: 'commit' });
    const home = await homeUsableAt(page);
    if (dwellMs) await page.waitForTimeout(dwellMs);
    // On to the site: the first deferred screen, so its chunk loads on the way.
    const pressedAt = await page.evaluate(() => performance.now());
    await page.getByRole('link', { name: HOME_MARKER }).click();
    const siteAt = await page
      .waitForFunction(
        (label) => (document.querySelector(`[aria-label="${label}"]`) ? performance.now() : false),
        `Sketch of ${HOME_MARKER}`,
        { polling: 'raf', timeout: 30_000 },
      )
      .then((h) => h.jsonValue() as Promise<number>);
    return { home, toSite: siteAt - pressedAt };
  } finally {
    await context.close();
  }
}

async function signInToHomeRun(browser: Browser, base: string) {
  const { context, page } = await newPage(browser, 'phone');
  try {
    await page.goto(`${base}/sign-in`);
    await page.getByLabel('E-mail').fill(EMAIL);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    const button = page.getByRole('button', { name: 'Sign in' });
    await button.waitFor();
    const pressedAt = await page.evaluate(() => performance.now());
    await button.click();
    return (await homeUsableAt(page)) - pressedAt;
  } finally {
    await context.close();
  }
}

export async function benchWeb(databaseUrl: string, runs = RUNS) {
  if (!existsSync(path.join(WEB_DIST_DIR, 'index.html'))) {
    throw new Error(`no web build in ${WEB_DIST_DIR}: run \`npm run build:web\` first`);
  }
  const db = createDatabase(databaseUrl);
  const app = createApp({ db, config: { ...TEST_CONFIG, WEB_DIST_DIR }, files: scratchFileStore().files });
  const server = await new Promise<Server>((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const { browser, close } = await launchBrowser();
  try {
    const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    const initial = await initialScripts(base);
    // One warm-up of each path (server caches, Chromium's own start-up), not counted.
    const first = await signInRun(browser, base);
    await homeRun(browser, base);
    const signIn: number[] = [];
    const arrived = { scripts: [] as number[], fonts: [] as number[], api: [] as number[] };
    const home: number[] = [];
    const toSite: number[] = [];
    const toSiteAfterPause: number[] = [];
    const signInToHome: number[] = [];
    for (let i = 0; i < runs; i++) {
      const run = await signInRun(browser, base);
      signIn.push(run.ms);
      arrived.scripts.push(run.arrived.scripts);
      arrived.fonts.push(run.arrived.fonts);
      arrived.api.push(run.arrived.api);
      const h = await homeRun(browser, base);
      home.push(h.home);
      toSite.push(h.toSite);
      toSiteAfterPause.push((await homeRun(browser, base, 2500)).toSite);
      signInToHome.push(await signInToHomeRun(browser, base));
    }
    // Every script fetched before the form was usable (index.html's and any chunk loaded on the way).
    let fetchedRaw = 0;
    let fetchedGzip = 0;
    for (const url of new Set(first.scripts)) {
      const body = Buffer.from(await (await fetch(url)).arrayBuffer());
      fetchedRaw += body.length;
      fetchedGzip += gzipSync(body).length;
    }
    const load = os
      .loadavg()
      .map((l) => l.toFixed(2))
      .join(' ');
    return [
      {
        name: 'sign-in page: first-load JS as sent to Chromium, brotli (target ≤ 350 KB)',
        value: kib(initial.br),
        unit: 'KiB',
        detail: `${initial.count} scripts in index.html, ${initial.br} bytes; encodings sent (brotli/gzip client): ${initial.encodings}`,
      },
      {
        name: 'sign-in page: first-load JS as sent to a gzip-only client',
        value: kib(initial.gzip),
        unit: 'KiB',
        detail: `${initial.gzip} bytes`,
      },
      { name: 'sign-in page: first-load JS, raw', value: kib(initial.raw), unit: 'KiB' },
      {
        name: 'sign-in page: all JS fetched before the form is usable, gzip',
        value: kib(fetchedGzip),
        unit: 'KiB',
        detail: `${new Set(first.scripts).size} scripts, ${Math.round(kib(fetchedRaw))} KiB raw`,
      },
      {
        name: 'sign-in usable, empty cache (target ≤ 1 000)',
        value: median(signIn),
        unit: 'ms',
        detail: `median of ${runs}, range ${Math.round(Math.min(...signIn))}–${Math.round(Math.max(...signIn))}`,
      },
      {
        name: '  of which: the last script arrived',
        value: median(arrived.scripts),
        unit: 'ms',
        detail: `last font ${Math.round(median(arrived.fonts))} ms, last API answer ${Math.round(median(arrived.api))} ms (medians, from navigation start)`,
      },
      {
        name: 'signed-in home usable, empty cache (target ≤ 1 200)',
        value: median(home),
        unit: 'ms',
        detail: `median of ${runs}, range ${Math.round(Math.min(...home))}–${Math.round(Math.max(...home))}`,
      },
      {
        name: 'from the home to the site page at once (loads the deferred chunk)',
        value: median(toSite),
        unit: 'ms',
        detail: `median of ${runs}`,
      },
      {
        name: 'from the home to the site page after 2.5 s on the home',
        value: median(toSiteAfterPause),
        unit: 'ms',
        detail: `median of ${runs}`,
      },
      { name: 'from pressing Sign in to the home usable', value: median(signInToHome), unit: 'ms', detail: `median of ${runs}` },
      { name: 'load average (1, 5, 15 min) at the end', value: os.loadavg()[0]!, unit: '', detail: load },
    ];
  } finally {
    await close();
    await new Promise((resolve) => server.close(resolve));
    await db.close();
  }
}
