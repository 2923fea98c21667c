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
    ['dispatcher@amberline.example', 'Dispatcher', ['Overview', 'Moves', 'Permit desk', 'Payments', 'Escort vendors', 'Fleet', 'Rulebook']],
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

  it('an outage (503) keeps the session and says the service is unavailable; a real 401 signs out', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    await signIn(page, 'dispatcher@amberline.example');
    await page.getByTestId('current-role').waitFor();
    // the service answers 503 for a while (as it does while its database is down)
    const down = { statusCode: 503, error: 'service_unavailable', message: 'The service is unavailable for the moment (the database cannot be reached); try again shortly' };
    let outage = true;
    await page.route('**/api/**', (r) => (outage ? r.fulfill({ status: 503, contentType: 'application/json', headers: { 'retry-after': '30' }, body: JSON.stringify(down) }) : r.continue()));
    await page.goto(`${BASE_URL}/moves`);
    await page.getByTestId('service-unavailable').waitFor();
    expect(await page.evaluate(() => localStorage.getItem('amberline.token'))).not.toBeNull();
    await screenshot(page, 'sign-in-outage-keeps-session');
    // back up: the notice goes and the user is still signed in
    outage = false;
    await page.reload();
    await page.getByTestId('moves-table').or(page.getByTestId('move-link').first()).first().waitFor({ timeout: 20_000 }).catch(() => undefined);
    await page.getByTestId('current-role').waitFor();
    await page.waitForLoadState('networkidle');
    expect(await page.getByTestId('service-unavailable').count()).toBe(0);
    // a 401 from the server (here: a token it does not accept) really ends the session
    await page.evaluate(() => localStorage.setItem('amberline.token', 'not-a-token'));
    await page.goto(`${BASE_URL}/moves`);
    await page.getByLabel('E-mail').waitFor({ timeout: 15_000 });
    expect(await page.evaluate(() => localStorage.getItem('amberline.token'))).toBeNull();
    await page.close();
  }, 60_000);

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
