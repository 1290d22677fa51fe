import type { Page } from 'playwright-core';
import { DEMO } from '@/tests/support/agents';
import { browserForFile } from '@/tests/support/browser';
import { e2eUrl, openPlace, shot, signIn, watchErrors } from '@/tests/support/e2e';

const browser = browserForFile();

/** Waits until the field-mode worker controls the page and has kept the app shell. */
async function shellKept(page: Page) {
  await page.waitForFunction(
    async () => {
      if (!navigator.serviceWorker?.controller) return false;
      const names = await caches.keys();
      for (const name of names) {
        const cache = await caches.open(name);
        if (await cache.match('/index.html', { ignoreSearch: true })) return true;
      }
      return false;
    },
    null,
    { timeout: 60_000 },
  );
}

/** Whether the device still keeps a copy of the query cache (IndexedDB `kenning-cache`) holding `word` (a query key part). */
const deviceCopyKept = (page: Page, word = 'briefing') =>
  page.evaluate(
    (word) =>
      new Promise<boolean>((resolve) => {
        const open = indexedDB.open('kenning-cache');
        open.onerror = () => resolve(false);
        open.onsuccess = () => {
          const db = open.result;
          if (!db.objectStoreNames.contains('cache')) return resolve(false);
          const get = db.transaction('cache').objectStore('cache').get('queries');
          get.onsuccess = () => resolve(typeof get.result === 'string' && get.result.includes(word));
          get.onerror = () => resolve(false);
        };
      }),
    word,
  );

it('starts with no network on a phone: the briefing from the device’s copy, marked offline, and the quick check computed on the device', async () => {
  const { context, page } = await browser.newPage('phone', { fieldMode: true });
  const errors = watchErrors(page);
  try {
    // Online first: the worker keeps the shell, the app keeps what the observer saw.
    await signIn(page, DEMO.observer);
    await page.waitForURL(/\/briefing$/);
    await page.getByText('What you see from here, over the terrain').first().waitFor();
    // An open course attempt is kept too (its questions are fixed once started): the demo's refresher, again.
    await openPlace(page, 'Training');
    await page
      .getByLabel('Course Horizon and hidden height, season refresher')
      .getByRole('button', { name: /^(Start the course|Take it again)$/ })
      .click();
    await page.waitForURL(/\/training\/attempt\?/);
    const attemptUrl = page.url();
    await page
      .getByText(/Question 1 of \d+/)
      .first()
      .waitFor();
    await shellKept(page);
    await expectEventually(() => deviceCopyKept(page));
    await expectEventually(() => deviceCopyKept(page, 'attempt'));

    // The network goes; the app is started again from cold (a new tab, nothing of the app in memory). The first
    // tab closes only after the new one has loaded: it keeps the worker running, so how fast a loaded machine
    // starts a stopped worker does not decide the test.
    await page.evaluate(async () => {
      await navigator.serviceWorker.ready;
    });
    await context.setOffline(true);
    const cold = await context.newPage();
    const coldErrors = watchErrors(cold);
    await cold.goto(`${e2eUrl()}/briefing`);
    await page.close();
    await cold.getByRole('status', { name: 'Offline' }).waitFor();
    await cold.getByText(/^Offline · showing what this device kept, last updated/).waitFor();
    await cold.getByText('What you see from here, over the terrain').first().waitFor();
    await shot(cold, 'field-mode-offline-briefing', 'phone');

    // The open attempt's questions, from the device's copy.
    await cold.goto(attemptUrl);
    await cold
      .getByText(/Question 1 of \d+/)
      .first()
      .waitFor();
    await shot(cold, 'field-mode-offline-attempt', 'phone');

    // The quick check needs no server: the same core runs on the device and says so.
    await cold.goto(`${e2eUrl()}/check`);
    await cold.getByLabel('Height of eye').fill('30');
    await cold.getByText(/computed on this device with the same formulas/).waitFor();
    await shot(cold, 'field-mode-offline-check', 'phone');

    // Signing out with no network deletes the device's copy at once…
    await cold.goto(`${e2eUrl()}/account`);
    await cold.getByRole('button', { name: 'Sign out', exact: true }).click();
    await cold.getByLabel('E-mail').waitFor();
    await expectEventually(async () => !(await deviceCopyKept(cold)));

    // …and the server's session ends at the first contact: back online, a restart does not sign the person in again.
    await context.setOffline(false);
    await cold.reload();
    await cold.getByLabel('E-mail').waitFor();
    await cold.getByRole('status', { name: 'Offline' }).waitFor({ state: 'detached' });
    expect((await cold.request.get(`${e2eUrl()}/api/me`)).status()).toBe(401);
    // Requests refused while offline are the only errors allowed.
    expect(coldErrors.filter((e) => !/Failed to fetch|ERR_INTERNET_DISCONNECTED|cannot reach its server/i.test(e))).toEqual([]);
    expect(errors).toEqual([]);
  } finally {
    await context.close();
  }
});

/** Polls `check` for up to 10 s (the device's copy is written a second after a change). */
async function expectEventually(check: () => Promise<boolean>) {
  const until = Date.now() + 10_000;
  while (Date.now() < until) {
    if (await check()) return;
    await new Promise((r) => setTimeout(r, 250));
  }
  expect(await check()).toBe(true);
}
