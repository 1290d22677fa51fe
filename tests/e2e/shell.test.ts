import { browserForFile, eachViewport, VIEWPORTS } from '@/tests/support/browser';
import { e2eUrl, openPlace, shot, signIn, watchErrors } from '@/tests/support/e2e';
import { DEMO } from '@/tests/support/agents';

const browser = browserForFile();

eachViewport('on the %s viewport', (viewport) => {
  it('signs in, shows the shell and the sites, and signs out', async () => {
    const { context, page } = await browser.newPage(viewport);
    const errors = watchErrors(page);
    try {
      await page.goto(`${e2eUrl()}/`);
      // Signed out, the root sends you to sign-in.
      await page.getByRole('button', { name: 'Sign in' }).waitFor();
      await shot(page, 'sign-in', viewport);

      await signIn(page, DEMO.planner, 'definitely-wrong');
      await page.getByText('The e-mail address or password is not right.').waitFor();
      await shot(page, 'sign-in-error', viewport);

      await signIn(page, DEMO.planner);
      await page.getByText('Your sites').first().waitFor();
      // The demo scenario's sites are listed.
      await page.getByText('Harrowmere Forest District').waitFor();
      await page.getByText('Tallow Strand').waitFor();
      const nav = page.getByRole('navigation', { name: 'Main' });
      const box = await nav.boundingBox();
      expect(box).not.toBeNull();
      if (viewport === 'phone') {
        // A bottom bar spanning the width.
        expect(box!.y + box!.height).toBeGreaterThan(VIEWPORTS.phone.height - 2);
        expect(box!.width).toBeGreaterThan(VIEWPORTS.phone.width - 2);
      } else {
        // A side rail on the left, full height.
        expect(box!.x).toBeLessThan(1);
        expect(box!.width).toBeLessThan(300);
        expect(box!.height).toBeGreaterThan(VIEWPORTS.wide.height - 2);
      }
      // Planners see no user administration in the navigation.
      expect(await nav.getByRole('link', { name: 'Users' }).count()).toBe(0);
      await shot(page, 'home', viewport);

      // On a phone a planner's Account is under More (six places, five slots).
      await openPlace(page, 'Account');
      await page.getByText('Harrowmere Lookout Service').first().waitFor();
      await page.getByRole('button', { name: 'Sign out', exact: true }).click();
      await page.getByRole('button', { name: 'Sign in' }).waitFor();
      expect(errors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('lets an admin manage users, and keeps an observer out of administration', async () => {
    const { context, page } = await browser.newPage(viewport);
    try {
      await signIn(page, DEMO.admin);
      await page.getByText('Your sites').first().waitFor();
      await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Users' }).click();
      await page.getByText('Invite someone').waitFor();
      await page.getByText(DEMO.reviewer).first().waitFor();
      for (const email of [DEMO.admin, DEMO.planner, DEMO.reviewer, DEMO.observer]) {
        expect(await page.getByText(email, { exact: false }).count()).toBeGreaterThan(0);
      }
      expect(await page.getByText(DEMO.otherAdmin).count()).toBe(0);
      await shot(page, 'users', viewport);

      // Invite someone: the set-password link is shown and e-mailed (to the local catcher).
      const email = `new.${viewport}@demo.kenning.test`;
      await page.getByLabel('Name').fill(`New ${viewport} watcher`);
      await page.getByLabel('E-mail').fill(email);
      await page.getByRole('button', { name: 'Create invitation' }).click();
      await page.getByText('We e-mailed this one-time link').waitFor();

      // Changing a role and deactivating ask first and say what will happen; Cancel changes nothing.
      const name = `New ${viewport} watcher`;
      const roles = page.getByRole('radiogroup', { name: `Role of ${name}` });
      await roles.waitFor();
      await roles.getByRole('radio', { name: 'reviewer' }).click();
      const roleDialog = page.getByRole('dialog', { name: `Make ${name} a reviewer?` });
      await roleDialog.getByText(/approve and return plans other people submitted/).waitFor();
      await shot(page, 'role-change-dialog', viewport);
      await roleDialog.getByRole('button', { name: 'Cancel' }).click();
      await roleDialog.waitFor({ state: 'detached' });
      expect(await roles.getByRole('radio', { name: 'reviewer' }).getAttribute('aria-checked')).toBe('false');
      await roles.getByRole('radio', { name: 'reviewer' }).click();
      await page
        .getByRole('dialog', { name: `Make ${name} a reviewer?` })
        .getByRole('button', { name: 'Make reviewer' })
        .click();
      await roles.locator('[role="radio"][aria-checked="true"]', { hasText: 'reviewer' }).waitFor();
      const row = viewport === 'wide' ? page.getByRole('row').filter({ hasText: email }) : page.getByLabel(name, { exact: true });
      await row.getByRole('button', { name: 'Deactivate' }).click();
      const off = page.getByRole('dialog', { name: `Deactivate ${name}?` });
      await off.getByText(/signed out at once and can no longer sign in/).waitFor();
      await off.getByRole('button', { name: 'Deactivate' }).click();
      await row.getByRole('button', { name: 'Reactivate' }).waitFor();
      await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Mail' }).click();
      await page.getByText('Set up your Kenning account for Harrowmere Lookout Service').first().waitFor();
      await page.getByText(`To ${email}`, { exact: false }).first().click();
      await page
        .getByText(/set-password\?token=/)
        .first()
        .waitFor();
      await shot(page, 'mail', viewport);
    } finally {
      await context.close();
    }

    const observer = await browser.newPage(viewport);
    try {
      await signIn(observer.page, DEMO.observer);
      await observer.page.waitForURL(/\/briefing$/);
      await observer.page.goto(`${e2eUrl()}/admin/users`);
      await observer.page.getByText('Not available to your role').waitFor();
      await shot(observer.page, 'observer-admin', viewport);
    } finally {
      await observer.context.close();
    }
  });
});

describe('the web app as served', () => {
  it('sends the entry bundle gzip-compressed', async () => {
    const html = await (await fetch(`${e2eUrl()}/`)).text();
    const src = /src="(\/_expo\/static\/js\/web\/entry-[^"]+\.js)"/.exec(html)?.[1];
    expect(src).toBeDefined();
    const res = await fetch(`${e2eUrl()}${src}`, { headers: { 'Accept-Encoding': 'gzip' } });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-encoding')).toBe('gzip');
    expect(res.headers.get('cache-control')).toMatch(/immutable/);
  });
});
