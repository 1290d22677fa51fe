import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { DEMO_PASSWORD } from '@/server/seeders/demo';
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
