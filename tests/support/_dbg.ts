import { launchBrowser, newPage } from '@/tests/support/browser';
(async () => {
  const { browser, close } = await launchBrowser();
  const { page } = await newPage(browser, 'phone');
  page.on('console', (m) => console.log('console:', m.type(), m.text()));
  page.on('response', (r) => r.url().includes('/api') && console.log('resp', r.status(), r.url()));
  await page.goto('http://127.0.0.1:8080/sign-in');
  await page.getByLabel('E-mail').fill('admin@demo.kenning.test');
  await page.getByLabel('Password').fill('kenning-demo');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForTimeout(3000);
  console.log(page.url());
  await page.screenshot({ path: `/tmp/after-phone.png` });
  await close();
})();
