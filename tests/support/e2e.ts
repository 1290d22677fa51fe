import { randomBytes } from 'node:crypto';
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { CDPSession, Locator, Page } from 'playwright-core';
import type { z } from 'zod';
import type { Role } from '@/shared/schemas/auth';
import type { Plan, PlanInputSchema } from '@/shared/schemas/plan';
import { DEMO_PASSWORD } from '@/server/seeders/demo';
import { DEMO } from './agents';
import { SCREENSHOT_DIR, type ViewportName } from './browser';

/** The server `npm test` started, serving the built web app against a seeded database. */
export function e2eUrl(): string {
  const url = process.env.KENNING_E2E_URL;
  if (!url) throw new Error('End-to-end tests need the server `npm test` starts (KENNING_E2E_URL).');
  return url;
}

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto(`${e2eUrl()}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

/** Saves a full-page screenshot to tests/e2e/screenshots/<name>-<viewport>.png. */
export async function shot(page: Page, name: string, viewport: ViewportName) {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  await page.screenshot({ path: path.join(SCREENSHOT_DIR, `${name}-${viewport}.png`), fullPage: true });
}

/** Collects page errors so a test can assert there were none. */
export function watchErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  return errors;
}

/** The API as the signed-in page (its session cookie), answering JSON or failing loudly with the status and body. */
export async function apiJson<T>(page: Page, method: 'GET' | 'POST' | 'PATCH', path: string, body?: unknown): Promise<T> {
  const res = await page.request.fetch(`${e2eUrl()}/api/v1${path}`, { method, data: body });
  if (!res.ok()) throw new Error(`${method} ${path}: ${res.status()} ${await res.text()}`);
  return (await res.json()) as T;
}

/** Goes to a place of the main navigation: its link on the bar or rail, or under "More" on a phone's bar. */
export async function openPlace(page: Page, name: string) {
  const nav = page.getByRole('navigation', { name: 'Main' });
  await nav.waitFor();
  const link = nav.getByRole('link', { name, exact: true });
  if ((await link.count()) > 0) return link.click();
  await nav.getByRole('button', { name: 'More' }).click();
  await page.getByRole('navigation', { name: 'More places' }).getByRole('link', { name, exact: true }).click();
}

/** Signs `email` in on `page` and waits for the lookout's watch page it opens on. */
export async function signInToWatch(page: Page, email: string) {
  await signIn(page, email);
  await page
    .getByText(/My watch|Your watches/)
    .first()
    .waitFor();
}

/**
 * Opens a new incident `title` in the site `siteName` from the incidents page
 * and waits for its own page; `onForm` runs once the form shows (a screenshot).
 * @returns the incident's id
 */
export async function openIncident(page: Page, siteName: string, title: string, onForm?: () => Promise<void>): Promise<string> {
  await openPlace(page, 'Incidents');
  await page.getByRole('button', { name: 'Open an incident' }).click();
  const openForm = page.getByLabel('Open an incident');
  await openForm.waitFor();
  await onForm?.();
  await openForm.getByRole('checkbox', { name: siteName }).click();
  await openForm.getByLabel('Title').fill(title);
  await openForm.getByRole('button', { name: 'Open', exact: true }).click();
  await page.waitForURL(/\/incidents\/[0-9a-f-]{36}$/);
  return page.url().split('/').pop()!;
}

/** The first plan the plan list finds for `title` (a demo plan by its title), failing if there is none. */
export async function findPlan(page: Page, title: string): Promise<Plan> {
  const { items } = await apiJson<{ items: Plan[] }>(page, 'GET', `/plans?q=${encodeURIComponent(title)}`);
  if (!items[0]) throw new Error(`No plan titled like “${title}” (the demo seed has changed?).`);
  return items[0];
}

/** Creates a draft plan through the API as the signed-in page. */
export async function createPlan(page: Page, input: z.input<typeof PlanInputSchema>): Promise<Plan> {
  return (await apiJson<{ plan: Plan }>(page, 'POST', '/plans', input)).plan;
}

/**
 * A person of the test's own: the demo admin invites them with `role` through the API and they set `password`
 * through their link, so the demo accounts other browser tests use at the same time are left alone.
 */
export async function invitePerson({
  emailPrefix,
  name,
  role,
  password,
}: {
  emailPrefix: string;
  name: string;
  role: Role;
  password: string;
}): Promise<{ email: string; password: string }> {
  const base = e2eUrl();
  const signedIn = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: DEMO.admin, password: DEMO_PASSWORD }),
  });
  const cookie = signedIn.headers.getSetCookie()[0]!.split(';')[0]!;
  const email = `${emailPrefix}.${randomBytes(4).toString('hex')}@demo.kenning.test`;
  const invited = await fetch(`${base}/api/v1/users`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', cookie },
    body: JSON.stringify({ email, name, role }),
  });
  const { setPasswordUrl } = (await invited.json()) as { setPasswordUrl: string };
  const token = new URL(setPasswordUrl).searchParams.get('token');
  const set = await fetch(`${base}/api/auth/set-password`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ token, password }),
  });
  if (set.status !== 204) throw new Error(`set-password: ${set.status}`);
  return { email, password };
}

/** Signs in and opens a site's map from its page; answers the map, drawn and waiting for gestures. */
export async function openSiteMap(page: Page, email: string, siteName: string): Promise<Locator> {
  await signIn(page, email);
  await page.getByRole('link', { name: siteName }).click();
  await page.getByRole('link', { name: 'Open the map' }).click();
  const map = page.getByRole('application', { name: /^Map: drag to pan/ });
  await map.waitFor();
  return map;
}

type Point = { x: number; y: number };

/**
 * Touch drags through the DevTools protocol, one finger per path (two for a pinch), each from its first point to its
 * second in `steps` moves; Chromium turns them into pointer events.
 */
export async function touchGesture(cdp: CDPSession, paths: [Point, Point][], steps = 8) {
  const at = (i: number) =>
    paths.map(([from, to]) => ({ x: from.x + ((to.x - from.x) * i) / steps, y: from.y + ((to.y - from.y) * i) / steps }));
  await cdp.send('Input.dispatchTouchEvent', { type: 'touchStart', touchPoints: at(0) });
  for (let i = 1; i <= steps; i++) {
    await cdp.send('Input.dispatchTouchEvent', { type: 'touchMove', touchPoints: at(i) });
    await new Promise((r) => setTimeout(r, 30));
  }
  await cdp.send('Input.dispatchTouchEvent', { type: 'touchEnd', touchPoints: [] });
}

/** A tap on a touch screen, a click with the mouse otherwise. */
export async function tapAt(page: Page, touch: boolean, p: Point) {
  if (touch) await page.touchscreen.tap(p.x, p.y);
  else await page.mouse.click(p.x, p.y);
}

/** A drag: one finger through the DevTools protocol on a touch screen, the mouse (in 8 moves) otherwise. */
export async function drag(page: Page, cdp: CDPSession, touch: boolean, from: Point, to: Point) {
  if (touch) return touchGesture(cdp, [[from, to]]);
  await page.mouse.move(from.x, from.y);
  await page.mouse.down();
  await page.mouse.move(to.x, to.y, { steps: 8 });
  await page.mouse.up();
}
