import { randomBytes } from 'node:crypto';
import { browserForFile, eachViewport } from '@/tests/support/browser';
import { e2eUrl, shot, signIn, watchErrors } from '@/tests/support/e2e';
import { DEMO } from '@/tests/support/agents';
import { DEMO_PASSWORD } from '@/server/seeders/demo';

// "Sign out everywhere" on the account page ends the person's session in another
// browser too. A person of its own (invited here), so the demo accounts other
// browser tests use at the same time keep their sessions.

const browser = browserForFile();

/** Invites a new observer through the API and sets their password; returns the e-mail and password. */
async function newPerson() {
  const base = e2eUrl();
  const signedIn = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: DEMO.admin, password: DEMO_PASSWORD }),
  });
  const cookie = signedIn.headers.getSetCookie()[0]!.split(';')[0]!;
  const email = `everywhere.${randomBytes(4).toString('hex')}@demo.kenning.test`;
  const invited = await fetch(`${base}/api/v1/users`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', cookie },
    body: JSON.stringify({ email, name: 'Everywhere Person', role: 'observer' }),
  });
  const { setPasswordUrl } = (await invited.json()) as { setPasswordUrl: string };
  const token = new URL(setPasswordUrl).searchParams.get('token');
  const password = 'everywhere-and-nowhere';
  const set = await fetch(`${base}/api/auth/set-password`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ token, password }),
  });
  if (set.status !== 204) throw new Error(`set-password: ${set.status}`);
  return { email, password };
}

eachViewport('on the %s viewport', (viewport) => {
  it('signs the person out in the other browser too', async () => {
    const person = await newPerson();
    const here = await browser.newPage(viewport);
    const there = await browser.newPage(viewport);
    const errors = watchErrors(here.page);
    try {
      for (const { page } of [here, there]) {
        await signIn(page, person.email, person.password);
        // A new observer lands on their (empty) watch and briefing.
        await page.getByText('No watches').or(page.getByText('Your sites')).first().waitFor();
      }
      await here.page.goto(`${e2eUrl()}/account`);
      await here.page.getByRole('button', { name: 'Sign out everywhere' }).waitFor();
      await shot(here.page, 'account', viewport);
      await here.page.getByRole('button', { name: 'Sign out everywhere' }).click();
      await here.page.getByRole('button', { name: 'Sign in' }).waitFor();

      // The other browser still holds its cookie; the server refuses it.
      await there.page.goto(`${e2eUrl()}/account`);
      await there.page.getByRole('button', { name: 'Sign in' }).waitFor();
      expect(errors).toEqual([]);
    } finally {
      await here.context.close();
      await there.context.close();
    }
  });
});
