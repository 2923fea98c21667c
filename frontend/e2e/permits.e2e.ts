import PDFDocument from 'pdfkit';
import type { Browser, Locator, Page } from 'playwright-core';
import { STEP_DECK_DEFAULTS, TRACTOR_DEFAULTS } from '../../seed/src/builders/fleet';
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { ARTIFACTS, BASE_URL, launch, screenshot, signIn } from './support/browser';
import { apiPost, apiToken, pick } from './support/forms';
import { wideExcavatorArticle } from './support/fixtures';

const stamp = `${Date.now().toString(36)}${process.pid.toString(36)}`.toUpperCase();
const day = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);
const departure = day(12);

function makePdf(): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({ size: 'LETTER', margin: 50 });
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.fontSize(16).text(`Texas single-trip permit TX-${stamp}`);
    doc.fontSize(10).text('Issued for an invented test move.');
    doc.end();
  });
}

/** A viewport-sized shot (the move page is very long; a full-page shot of it is slow and unreadable). */
const shot = async (page: Page, name: string) => {
  mkdirSync(ARTIFACTS, { recursive: true });
  await page.screenshot({ path: join(ARTIFACTS, `${name}.png`) });
};

/** Waits until the permit drawer's title shows this status. */
async function statusIs(page: Page, label: string): Promise<void> {
  await page.getByTestId('permit-drawer-title').getByTestId('permit-status').filter({ hasText: label }).waitFor({ timeout: 15000 });
}

describe('the permit desk in the browser', () => {
  let browser: Browser;
  let moveId = '';
  let moveRef = '';

  beforeAll(async () => {
    browser = await launch();
    const admin = await apiToken('admin@amberline.example');
    const tractor = await apiPost<{ id: string }>(admin, '/fleet/tractors', { ...TRACTOR_DEFAULTS, unitNumber: `E2E-PT${stamp}`, plate: `P${stamp.slice(-6)}` });
    const trailer = await apiPost<{ id: string }>(admin, '/fleet/trailers', { ...STEP_DECK_DEFAULTS, unitNumber: `E2E-PS${stamp}` });
    const dispatcher = await apiToken('dispatcher@amberline.example');
    // 15 ft wide excavator: a Texas width permit (23 CFR 658.15: cargo counts toward width)
    const move = await apiPost<{ id: string; reference: string }>(dispatcher, '/moves', {
      customer: `Copperfield Earthworks ${stamp}`,
      commodity: 'Tracked excavator',
      articles: [wideExcavatorArticle()],
      tractorId: tractor.id,
      trailerId: trailer.id,
      sliderSettingFt: 39,
      route: [{ order: 1, jurisdiction: 'TX', roads: 'US 290, I-10 W', miles: 200, roadType: 'interstate', zip: '78624' }],
      origin: 'Cypress, TX',
      destination: 'Fredericksburg, TX',
      requestedDeparture: departure,
      travelDays: 1,
    });
    moveId = move.id;
    moveRef = move.reference;
  });
  afterAll(() => browser?.close());

  it('a clerk takes a permit from to file to issued with its PDF and a payment (after a plain decline); the move can then advance', async () => {
    const page: Page = await browser.newPage({ viewport: { width: 1440, height: 1000 } });
    const consoleErrors: string[] = [];
    page.on('console', (m) => {
      // antd deprecation warnings count too
      if (m.type() === 'error' || (m.type() === 'warning' && /deprecated/i.test(m.text()))) consoleErrors.push(m.text());
    });
    await signIn(page, 'clerk@amberline.example');
    await page.getByTestId('current-role').waitFor();
    page.setDefaultTimeout(15000);
    try {
      await clerkFlow(page);
    } catch (e) {
      await screenshot(page, 'permits-failure');
      throw e;
    }
    expect(consoleErrors).toEqual([]);
    await page.close();
  }, 180_000);

  /** The move page, once its assessment has loaded (it is long: a click before then can land on shifting content). */
  async function openMovePage(page: Page): Promise<void> {
    await page.goto(`${BASE_URL}/moves/${moveId}`);
    await page.getByTestId('move-permits').waitFor();
    await page.waitForLoadState('networkidle');
  }

  async function clerkFlow(page: Page): Promise<void> {
    // the move page: create the permits from the assessment
    await openMovePage(page);
    // wait for the sync call itself, so a click that lands while the long page is still settling is retried
    const sync = page.waitForResponse((r) => r.url().includes('/permits/sync') && r.request().method() === 'POST', { timeout: 10_000 });
    await page.getByTestId('permits-sync').click();
    await sync.catch(async () => {
      await page.getByTestId('permits-sync').scrollIntoViewIfNeeded();
      await Promise.all([page.waitForResponse((r) => r.url().includes('/permits/sync')), page.getByTestId('permits-sync').click()]);
    });
    await page.getByTestId('open-permit-TX').waitFor({ timeout: 30_000 });
    await page.getByTestId('move-permits').getByTestId('permit-status').filter({ hasText: 'To file' }).waitFor();
    await page.getByTestId('move-permits').evaluate((e) => e.scrollIntoView({ block: 'center' }));
    await shot(page, 'permits-1-move-page');

    // the desk shows counters, the lists and the queue
    await page.goto(`${BASE_URL}/permits`);
    await page.getByTestId('permit-counters').waitFor();
    await page.getByRole('columnheader', { name: 'Urgency' }).waitFor();
    await screenshot(page, 'permits-2-desk');

    // back on the move, open the Texas permit and record the filing
    await openMovePage(page);
    const drawer: Locator = page.getByTestId('permit-details');
    // the permits list refetches after the sync; a click that lands on a row being replaced is tried again
    for (let attempt = 0; ; attempt++) {
      await page.getByTestId('open-permit-TX').click();
      const opened = await drawer.waitFor({ timeout: 8_000 }).then(() => true, () => false);
      if (opened) break;
      if (attempt === 2) await drawer.waitFor();
    }
    await statusIs(page, 'To file');
    await drawer.getByTestId('permit-to-filed').click();
    await statusIs(page, 'Filed');

    // the state issued it: number, validity (Texas time), fee
    await drawer.getByLabel('Permit number').fill(`TX-${stamp}`);
    // valid from 00:01 on the departure day, as the state wrote it
    await drawer.getByLabel('Valid from').fill(`${departure}T00:01`);
    await drawer.getByLabel('Valid to').fill(`${day(15)}T23:59`);
    await drawer.getByLabel('Max speed (mph)').fill('45');
    // the permit's own travel hours and weekend rule, which then govern the run sheet
    await pick(page, 'permit-hours-kind', 'Fixed hours');
    await drawer.getByLabel('Travel from').fill('09:00');
    await drawer.getByLabel('Travel to').fill('15:00');
    await pick(page, 'permit-weekends-kind', 'Weekend travel allowed');
    await drawer.getByTestId('permit-travel-fields').scrollIntoViewIfNeeded();
    await shot(page, 'permits-2b-travel-conditions');
    await drawer.getByLabel('Actual fee (USD)').fill('185.00');
    await drawer.getByTestId('permit-to-issued').click();
    await statusIs(page, 'Issued');

    // the PDF, with upload progress
    await drawer.locator('input[type=file]').setInputFiles({ name: `TX permit ${stamp}.pdf`, mimeType: 'application/pdf', buffer: await makePdf() });
    await drawer.getByTestId('permit-documents').getByText(`TX permit ${stamp}.pdf`).waitFor({ timeout: 15000 });

    // a declined test card is said plainly
    await drawer.getByTestId('test-card').getByText('Test card — declined').click();
    await drawer.getByTestId('permit-pay').click();
    await drawer.getByTestId('payment-declined').waitFor();
    expect(await drawer.getByTestId('payment-declined').textContent()).toContain('Your card was declined.');
    await drawer.getByTestId('permit-payment').scrollIntoViewIfNeeded();
    await shot(page, 'permits-3-declined');

    // then the Visa test card; the processor's signed event marks it paid
    await drawer.getByTestId('test-card').getByText('Test Visa — succeeds').click();
    await drawer.getByTestId('permit-pay').click();
    await drawer.getByTestId('permit-payment').locator('[data-testid="payment-status"]').filter({ hasText: 'Paid' }).first().waitFor({ timeout: 20000 });
    await shot(page, 'permits-4-issued-paid');
    await page.keyboard.press('Escape');

    // the move page lists the permit as issued and paid, with its PDF
    await page.getByTestId('move-permits').getByTestId('permit-status').filter({ hasText: 'Issued' }).waitFor();
    await page.getByTestId('move-permits').getByTestId('payment-status').filter({ hasText: 'Paid' }).waitFor();

    // the dispatcher can now advance the move
    const dispatcher = await apiToken('dispatcher@amberline.example');
    const res = await fetch(`${BASE_URL}/api/moves/${moveId}/stage`, {
      method: 'POST', headers: { 'content-type': 'application/json', authorization: `Bearer ${dispatcher}` }, body: JSON.stringify({ to: 'permits_received' }),
    });
    const body = await res.json();
    expect({ status: res.status, stage: body.stage }).toEqual({ status: 201, stage: 'permits_received' });

    // the run sheet shows the permit's hours, not the rulebook's, with the permit as their source
    const desk = await browser.newPage({ viewport: { width: 1440, height: 900 } });
    await signIn(desk, 'dispatcher@amberline.example');
    await desk.goto(`${BASE_URL}/run-sheets/${moveId}`);
    const tx = desk.getByTestId('travel-TX');
    await tx.waitFor({ timeout: 60_000 }).catch(async (e) => {
      await screenshot(desk, 'permits-6-run-sheet-failure');
      throw e;
    });
    expect(await tx.textContent()).toContain('09:00–15:00');
    expect(await tx.getByTestId('travel-restrictions').first().textContent()).toMatch(new RegExp(`travel 09:00–15:00 local time only.*TX permit TX-${stamp}`));
    await screenshot(desk, 'permits-6-run-sheet-permit-hours');
    // and the move page says the permit governs there, and where it differs from the rulebook
    await desk.goto(`${BASE_URL}/moves/${moveId}`);
    const governs = desk.getByTestId('jurisdiction-TX').getByTestId('permit-governs');
    await governs.waitFor();
    expect(await governs.textContent()).toContain('travel hours — permit: 09:00–15:00 local time; rulebook: not on file');
    await desk.close();

    // the ledger shows both attempts for this move
    await page.goto(`${BASE_URL}/payments`);
    await page.getByRole('link', { name: moveRef }).first().waitFor();
    await screenshot(page, 'permits-5-payments');
  }
});
