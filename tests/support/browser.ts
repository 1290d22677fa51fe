import path from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';

/** Debian's Chromium; playwright-core never downloads a browser of its own. */
export const CHROMIUM = process.env.KENNING_CHROMIUM ?? '/usr/bin/chromium';

export const VIEWPORTS = {
  phone: { width: 390, height: 844 },
  wide: { width: 1440, height: 900 },
} as const;
export type ViewportName = keyof typeof VIEWPORTS;

/**
 * Launches headless Chromium (playwright gives every launch a fresh, empty
 * profile) with no background network
 * (the machine's network is closed; Chromium's own connections would be refused).
 * WebGL runs on SwiftShader — no GPU.
 */
export async function launchBrowser(): Promise<{ browser: Browser; close: () => Promise<void> }> {
  const browser = await chromium.launch({
    executablePath: CHROMIUM,
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--enable-unsafe-swiftshader',
      '--use-angle=swiftshader',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  return { browser, close: () => browser.close() };
}

export interface PageOptions {
  /** Lets the field-mode service worker run (every other page blocks it). */
  fieldMode?: boolean;
  /** A touch screen (`hasTouch`): taps, drags and pinches through `page.touchscreen` or the DevTools protocol. */
  touch?: boolean;
}

export async function newPage(
  browser: Browser,
  viewport: ViewportName,
  { fieldMode = false, touch = false }: PageOptions = {},
): Promise<{ context: BrowserContext; page: Page }> {
  // The field-mode service worker would take every page's requests out of Playwright's sight (and precache the
  // whole app in each test): only the tests of field mode let it run.
  const context = await browser.newContext({
    viewport: VIEWPORTS[viewport],
    deviceScaleFactor: 1,
    hasTouch: touch,
    serviceWorkers: fieldMode ? 'allow' : 'block',
  });
  const page = await context.newPage();
  return { context, page };
}

/** The browser of one test file: launched before its tests, closed after them. */
export interface TestBrowser {
  /** A fresh context (its own cookies and storage) and page at the viewport's size. */
  newPage(viewport: ViewportName, options?: PageOptions): Promise<{ context: BrowserContext; page: Page }>;
}

/** Launches Chromium in the file's `beforeAll` and closes it in its `afterAll`. */
export function browserForFile(): TestBrowser {
  let launched: { browser: Browser; close: () => Promise<void> } | undefined;
  beforeAll(async () => {
    launched = await launchBrowser();
  });
  afterAll(() => launched?.close());
  return {
    newPage: (viewport, options) => {
      if (!launched) throw new Error('browserForFile(): the browser is launched in beforeAll; open pages inside tests.');
      return newPage(launched.browser, viewport, options);
    },
  };
}

/** `describe` once for each viewport (phone 390×844, wide 1440×900); `%s` in the title names it. */
export function eachViewport(title: string, tests: (viewport: ViewportName) => void) {
  describe.each(Object.keys(VIEWPORTS) as ViewportName[])(title, tests);
}

/** Where e2e screenshots go (ignored by git). */
export const SCREENSHOT_DIR = path.join(__dirname, '..', 'e2e', 'screenshots');
