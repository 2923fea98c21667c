/**
 * "Not on file is not none": a wide load through Georgia, whose rulebook record has no escort rules on file, reads
 * "escorts: not on file for GA — check the permit" on the dispatcher's move page and on the driver's run sheet —
 * never "no escort" — and its fee reads unknown, not $0.
 */
import type { Browser } from 'playwright-core';
import { RULEBOOK_DATA, type MoveDto } from '@amberline/common';
import { STEP_DECK_DEFAULTS, TRACTOR_DEFAULTS } from '../../seed/src/builders/fleet';
import { texasMove } from '../../backend/test/fixtures/moves';
import { BASE_URL, DEMO_PASSWORD, launch, screenshot, signIn } from './support/browser';

const unique = () => `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`.toUpperCase();

async function call<T>(method: string, path: string, token: string | null, body?: unknown): Promise<{ status: number; body: T }> {
  const res = await fetch(`${BASE_URL}/api${path}`, {
    method,
    headers: { ...(token ? { authorization: `Bearer ${token}` } : {}), ...(body !== undefined ? { 'content-type': 'application/json' } : {}) },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const text = await res.text();
  return { status: res.status, body: (text ? JSON.parse(text) : undefined) as T };
}
const tokenOf = async (email: string) => (await call<{ accessToken: string }>('POST', '/auth/login', null, { email, password: DEMO_PASSWORD })).body.accessToken;

describe('a topic not on file reads as such, never as none', () => {
  let browser: Browser;
  let move: MoveDto;

  beforeAll(async () => {
    // the shipped Georgia record has its width escort rules not on file (what this spec relies on)
    expect(RULEBOOK_DATA.GA.escorts.width.status).toBe('unknown');
    expect(RULEBOOK_DATA.GA.fee.status).toBe('unknown');
    browser = await launch();
    const admin = await tokenOf('admin@amberline.example');
    const dispatcher = await tokenOf('dispatcher@amberline.example');
    const tractor = await call<{ id: string }>('POST', '/fleet/tractors', admin, { unitNumber: `NF-T-${unique()}`, plate: `NF${unique().slice(-5)}`, ...TRACTOR_DEFAULTS });
    const trailer = await call<{ id: string }>('POST', '/fleet/trailers', admin, { ...STEP_DECK_DEFAULTS, unitNumber: `NF-S-${unique()}` });
    const driver = (await call<{ id: string; email: string }[]>('GET', '/users/drivers', dispatcher)).body.find((d) => d.email === 'driver@amberline.example');
    const created = await call<MoveDto>(
      'POST',
      '/moves',
      dispatcher,
      texasMove(tractor.body.id, trailer.body.id, {
        driverId: driver!.id,
        customer: `Not On File ${unique()}`,
        route: [{ order: 1, jurisdiction: 'GA', roads: 'US 341', miles: 90, roadType: 'two-lane', zip: '31015' }],
        origin: 'Cordele, GA',
        destination: 'Perry, GA',
      }),
    );
    expect(created.status).toBe(201);
    move = created.body;
  }, 120_000);
  afterAll(() => browser?.close());

  it('the move page shows escorts and the fee for GA as not on file, and lists them among the open questions', async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
    await signIn(page, 'dispatcher@amberline.example');
    await page.getByTestId('current-role').waitFor(); // signed in before the next page is asked for
    await page.goto(`${BASE_URL}/moves/${move.id}`);
    await page.getByTestId('move-page').waitFor();
    const ga = page.getByTestId('jurisdiction-GA');
    await ga.waitFor();
    const escorts = await ga.getByTestId('escort-requirement').textContent();
    expect(escorts).toContain('escorts: not on file for GA');
    expect(escorts).not.toMatch(/No escort|Not required/);
    expect(await ga.getByTestId('fee').textContent()).toMatch(/fee: unknown — not on file for GA/);
    expect(await ga.getByTestId('fee').textContent()).not.toContain('$0');
    const questions = await ga.getByTestId('open-questions').textContent();
    expect(questions).toMatch(/Georgia: escorts for width not on file — check the permit/);
    expect(questions).toMatch(/Georgia: permit fee not on file/);
    // the not-on-file style is its own (dashed amber), not the green of an answer
    const style = await ga.getByTestId('not-on-file').first().evaluate((el) => getComputedStyle(el).borderStyle);
    expect(style).toBe('dashed');
    await screenshot(page, 'not-on-file-1-move-page');
    await page.close();
  }, 120_000);

  it('the driver’s run sheet says escorts are not on file for GA and lists the open questions', async () => {
    const page = await browser.newPage({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    await signIn(page, 'driver@amberline.example');
    await page.getByTestId('run-sheets-page').or(page.getByTestId('current-role')).first().waitFor();
    await page.goto(`${BASE_URL}/run-sheets/${move.id}`);
    await page.getByTestId('run-sheet-page').waitFor();
    const escorts = await page.getByTestId('section-escorts').textContent();
    expect(escorts).toContain('escorts: not on file for GA — check the permit');
    const open = await page.getByTestId('open-questions').textContent();
    expect(open).toMatch(/Georgia: escorts for width not on file/);
    expect(await page.getByTestId('travel-GA').textContent()).toMatch(/not on file — check the permit/);
    await screenshot(page, 'not-on-file-2-run-sheet-phone');
    await page.close();
  }, 120_000);
});
