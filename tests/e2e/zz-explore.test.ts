import { launchBrowser, newPage } from '@/tests/support/browser';
import { DEMO } from '@/tests/support/agents';
import { e2eUrl, signIn, watchErrors } from '@/tests/support/e2e';

test('explore', async () => {
  const { browser, close } = await launchBrowser();
  for (const vp of ['phone', 'wide'] as const) {
    const { page } = await newPage(browser, vp);
    const errors = watchErrors(page);
    page.on('console', (m) => { if (m.type() === 'error') console.log('console', m.text()); });
    await signIn(page, DEMO.planner);
    await page.getByRole('link', { name: 'Harrowmere Forest District' }).click();
    await page.getByRole('link', { name: 'Open the map' }).click();
    await page.waitForTimeout(2500);
    await page.screenshot({ path: `/tmp/shots/map-${vp}.png` });
    const box = (await page.getByRole('application').boundingBox())!;
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await page.mouse.click(box.x + box.width * 0.6, box.y + box.height * 0.45);
    await page.waitForTimeout(2500);
    await page.screenshot({ path: `/tmp/shots/map-tap-${vp}.png` });
    console.log(vp, errors);
  }
  await close();
});
