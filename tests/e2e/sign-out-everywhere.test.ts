import { browserForFile, eachViewport } from '@/tests/support/browser';
import { e2eUrl, invitePerson, shot, signIn, watchErrors } from '@/tests/support/e2e';

// "Sign out everywhere" on the account page ends the person's session in another
// browser too. A person of its own (invited here), so the demo accounts other
// browser tests use at the same time keep their sessions.

const browser = browserForFile();

eachViewport('on the %s viewport', (viewport) => {
  it('signs the person out in the other browser too', async () => {
    const person = await invitePerson({
      emailPrefix: 'everywhere',
      name: 'Everywhere Person',
      role: 'observer',
      password: 'everywhere-and-nowhere',
    });
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
