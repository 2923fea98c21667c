import type { Browser } from 'playwright-core';
import { BASE_URL, launch, screenshot, signIn } from './support/browser';

describe('sign-in in the browser', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launch();
  });
  afterAll(() => browser?.close());

  it.each([
    ['admin@amberline.example', 'Admin', ['Overview', 'Moves', 'Permit desk', 'Payments', 'Escort vendors', 'Fleet', 'Rulebook', 'Users']],
    ['dispatcher@amberline.example', 'Dispatcher', ['Overview', 'Moves', 'Permit desk', 'Escort vendors', 'Fleet', 'Rulebook']],
    ['clerk@amberline.example', 'Permit clerk', ['Overview', 'Moves', 'Permit desk', 'Payments', 'Fleet', 'Rulebook']],
    ['driver@amberline.example', 'Driver', ['Run sheets']],
  ])('%s signs in and sees the navigation of a %s', async (email, roleLabel, nav) => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    const outside: string[] = [];
    page.on('request', (r) => {
      if (!r.url().startsWith(BASE_URL) && !r.url().startsWith('data:')) outside.push(r.url());
    });
    await signIn(page, email);
    await page.getByTestId('current-role').waitFor();
    expect(await page.getByTestId('current-role').textContent()).toBe(roleLabel);
    const items = await page.getByTestId('main-nav').locator('.ant-menu-item').allTextContents();
    expect(items).toEqual(nav);
    expect(await page.evaluate(() => getComputedStyle(document.body).fontFamily)).toContain('Noto Sans');
    await screenshot(page, `sign-in-${roleLabel.toLowerCase().replace(' ', '-')}`);
    expect(outside).toEqual([]); // fonts and scripts ship with the app
    await page.close();
  });

  it('shows the error for a wrong password and stays on the sign-in page', async () => {
    const page = await browser.newPage();
    await signIn(page, 'dispatcher@amberline.example', 'not-the-password');
    await page.getByTestId('sign-in-error').waitFor();
    expect(await page.getByTestId('sign-in-error').textContent()).toContain('Wrong e-mail or password');
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await screenshot(page, 'sign-in-wrong-password');
    await page.close();
  });

  it('lets an admin open the users page, and keeps other roles out of it', async () => {
    const page = await browser.newPage();
    await signIn(page, 'admin@amberline.example');
    await page.getByTestId('main-nav').getByText('Users').click();
    await page.getByPlaceholder('Name or e-mail').fill('amberline.example');
    await page.getByPlaceholder('Name or e-mail').press('Enter');
    await page.getByRole('cell', { name: 'driver@amberline.example', exact: true }).waitFor();
    await screenshot(page, 'admin-users');
    const other = await browser.newPage();
    await signIn(other, 'driver@amberline.example');
    await other.getByTestId('current-role').waitFor();
    await other.goto(`${BASE_URL}/admin/users`);
    await other.getByText('Not here').waitFor();
    await page.close();
    await other.close();
  });
});
