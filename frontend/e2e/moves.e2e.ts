import type { Browser, Page } from 'playwright-core';
import { STEP_DECK_DEFAULTS, TRACTOR_DEFAULTS } from '../../seed/src/builders/fleet';
import { BASE_URL, launch, screenshot, signIn } from './support/browser';
import { apiPost, apiSend, apiToken, fill, inputOf, pick } from './support/forms';

const stamp = `${Date.now().toString(36)}${process.pid.toString(36)}`.toUpperCase();
const tractorUnit = `E2E-T${stamp}`;
const trailerUnit = `E2E-S${stamp}`;
const customer = `Brightwater Aggregates ${stamp}`;
const departure = new Date(Date.now() + 12 * 86_400_000).toISOString().slice(0, 10);

async function next(page: Page): Promise<void> {
  await page.getByTestId('step-next').click();
}

describe('moves in the browser', () => {
  let browser: Browser;
  let savedMoveId = '';

  beforeAll(async () => {
    browser = await launch();
    // The test database has the demo users but no fleet: the admin adds a tractor and a 48 ft step deck.
    const admin = await apiToken('admin@amberline.example');
    const tractor = await apiPost<{ id: string }>(admin, '/fleet/tractors', { ...TRACTOR_DEFAULTS, unitNumber: tractorUnit, plate: `E2E${stamp.slice(-5)}` });
    const trailer = await apiPost<{ id: string }>(admin, '/fleet/trailers', { ...STEP_DECK_DEFAULTS, unitNumber: trailerUnit });
    // a second move, opened through the API, for the phone-sized checks
    const dispatcher = await apiToken('dispatcher@amberline.example');
    const saved = await apiPost<{ id: string }>(dispatcher, '/moves', {
      customer: `Harrow Mill Supply ${stamp}`,
      commodity: 'Wheel loader',
      articles: [
        {
          id: 'L1', description: 'Wheel loader', lengthIn: 420, widthIn: 130, heightIn: 140, weightLb: 48_000, weightSource: 'scale_ticket',
          positionFromTrailerFrontIn: 150, lateralOffsetIn: 0, dunnageIn: 4, blockedForward: false, heavyEquipment: true, sharpEdges: false,
          tiedowns: [1, 2, 3, 4, 5].map((n) => ({ label: `chain ${n}`, kind: 'chain', chainSize: '1/2', chainGrade: 70, anchorKind: 'winch_track', path: 'side-to-side' })),
        },
      ],
      tractorId: tractor.id,
      trailerId: trailer.id,
      sliderSettingFt: 39,
      route: [{ order: 1, jurisdiction: 'TX', roads: 'SH 71', miles: 80, roadType: 'two-lane', zip: '78602' }],
      origin: 'Bastrop, TX',
      destination: 'La Grange, TX',
      requestedDeparture: departure,
      travelDays: 1,
    });
    savedMoveId = saved.id;
  });
  afterAll(() => browser?.close());

  it('a dispatcher opens a move through the form and sees its escort requirement and bridge-formula finding', async () => {
    const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
    const consoleErrors: string[] = [];
    page.on('console', (m) => {
      if (m.type() === 'error') consoleErrors.push(m.text());
    });
    await signIn(page, 'dispatcher@amberline.example');
    await page.getByTestId('current-role').waitFor();
    await page.goto(`${BASE_URL}/moves`);
    await page.getByTestId('stage-overview').waitFor();
    await page.getByTestId('stage-count-requested').locator('.ant-statistic-content-value').waitFor();
    await screenshot(page, 'moves-list');

    await page.getByTestId('new-move').click();
    await page.getByTestId('move-steps').waitFor();

    // 1. customer and commodity
    await fill(page, 'f-customer', customer);
    await fill(page, 'f-commodity', 'Tracked excavator');
    await next(page);

    // 2. one piece: 32 ft × 15 ft × 10 ft 6 in, 62,000 lb
    await fill(page, 'f-piece-0-description', 'Tracked excavator, boom folded');
    await fill(page, 'f-piece-0-length', `32'0"`);
    await fill(page, 'f-piece-0-width', `15'`);
    await fill(page, 'f-piece-0-height', `10'6"`);
    await fill(page, 'f-piece-0-weight', '62000');
    await page.getByTestId('f-piece-0-heavy').check();
    await next(page);

    // 3. equipment and placement: the piece's front 12 ft 6 in behind the trailer front, on the lower deck
    await pick(page, 'f-tractor', tractorUnit);
    await pick(page, 'f-trailer', trailerUnit);
    await fill(page, 'f-piece-0-position', `12'6"`);
    await page.getByTestId('slider-readout').waitFor();
    // the slider moves the trailer group: the browser's engine shows the new loads at once
    const before = await page.getByTestId('slider-readout').textContent();
    const handle = page.getByTestId('slider-card').getByRole('slider');
    await handle.focus();
    await page.keyboard.press('ArrowLeft');
    await page.keyboard.press('ArrowLeft');
    await page.getByTestId('slider-readout').filter({ hasText: 'Setting 38 ft:' }).waitFor({ timeout: 2000 });
    expect(await page.getByTestId('slider-readout').textContent()).not.toBe(before);
    await page.getByTestId('axle-bar-trailer').waitFor();
    await next(page);

    // 4. tiedowns: as many as 49 CFR 393.110 asks for the piece
    await page.getByTestId('fill-tiedowns-0').click();
    expect(await page.locator('[data-testid^="tiedown-0-"]').count()).toBeGreaterThanOrEqual(4);
    await next(page);

    // 5. route in Texas: a two-lane segment then the interstate
    await fill(page, 'f-origin', 'Cypress, TX');
    await fill(page, 'f-destination', 'Fredericksburg, TX');
    await pick(page, 'f-seg-0-state', 'Texas');
    await fill(page, 'f-seg-0-roads', 'FM 1960, US 290');
    await fill(page, 'f-seg-0-miles', '60');
    await fill(page, 'f-seg-0-zip', '77429');
    await page.getByTestId('add-segment').click();
    await pick(page, 'f-seg-1-state', 'Texas');
    await fill(page, 'f-seg-1-roads', 'I-10 W');
    await fill(page, 'f-seg-1-miles', '140');
    await fill(page, 'f-seg-1-zip', '78624');
    await pick(page, 'f-seg-1-roadtype', 'Interstate');
    const date = await inputOf(page, 'f-departure');
    const feedback = page.getByTestId('live-feedback');
    // on a loaded machine the date picker can miss the typed date; enter it again if no preview follows
    for (let attempt = 0; attempt < 3; attempt++) {
      await date.click();
      await date.fill(departure);
      await date.press('Enter');
      const shown = await feedback.getByTestId('jurisdiction-assessments').waitFor({ timeout: 15_000 }).then(() => true, () => false);
      if (shown) break;
      const err = page.getByTestId('preview-error');
      if (await err.count()) throw new Error(`preview failed: ${await err.first().textContent()}`);
    }

    // live feedback: the server's preview names Texas with its escorts, the engine the bridge-formula finding
    await feedback.getByTestId('jurisdiction-assessments').waitFor({ timeout: 15000 });
    await feedback.getByTestId('bridge-finding').first().waitFor();
    expect(await feedback.getByTestId('escort-count').first().textContent()).toMatch(/1 front/);
    await screenshot(page, 'move-form-live-feedback');

    await page.getByTestId('save-move').click();
    await page.waitForURL(/\/moves\/[0-9a-f-]{36}$/);
    await page.getByTestId('move-page').waitFor();

    // the move page: assessment with escorts, the bridge-formula finding, the drawing and the chart
    const assessment = page.getByTestId('section-assessment');
    await assessment.getByTestId('jurisdiction-TX').waitFor();
    expect(await assessment.getByTestId('escort-count').first().textContent()).toMatch(/1 front, 1 rear/);
    expect(await assessment.getByTestId('escort-requirement').first().textContent()).toContain('width 15\'0" over 14\'0"');
    const plan = page.getByTestId('section-load-plan');
    await plan.getByTestId('bridge-finding').first().waitFor();
    expect(await plan.getByTestId('bridge-findings').textContent()).toMatch(/bridge formula, L = \d+ ft, N = \d+/);
    await plan.getByTestId('diagram-side').waitFor();
    expect(await plan.getByTestId('diagram-piece').count()).toBe(1);
    expect(await plan.getByTestId('diagram-flag').count()).toBeGreaterThan(0);
    expect(await plan.getByTestId('axle-bar-gross').getAttribute('data-over')).toBe('true');
    expect(await page.getByTestId('caution').first().textContent()).toContain('the permit, a certified scale');
    await page.getByTestId('section-history').getByTestId('history-entry').first().waitFor();
    await screenshot(page, 'move-page');

    // the list finds it, with its flags
    await page.goto(`${BASE_URL}/moves?search=${encodeURIComponent(customer)}`);
    await page.getByTestId('move-link').first().waitFor();
    expect(await page.getByTestId('move-flags').first().textContent()).toMatch(/escort/);
    expect(consoleErrors.filter((e) => !/favicon/.test(e))).toEqual([]);
    await page.close();
  }, 180_000);

  it('keeps the move page, fleet and rulebook usable on a 390 px phone', async () => {
    const page = await browser.newPage({ viewport: { width: 390, height: 844 } });
    await signIn(page, 'dispatcher@amberline.example');
    await page.getByTestId('current-role').waitFor();
    await page.goto(`${BASE_URL}/moves/${savedMoveId}`);
    await page.getByTestId('section-load-plan').getByTestId('diagram-side').waitFor();
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(1);
    await screenshot(page, 'move-page-mobile');
    await page.goto(`${BASE_URL}/rulebook/TX`);
    await page.getByTestId('rulebook-banner').waitFor();
    expect(await page.getByTestId('rule-record').textContent()).toMatch(/read \d{4}-\d{2}-\d{2}|not on file/);
    expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(1);
    await screenshot(page, 'rulebook-state-mobile');
    await page.close();
  }, 60_000);

  it('asks for a reload when someone else changed the move during an edit, and keeps every change in the history', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await signIn(page, 'dispatcher@amberline.example');
    await page.getByTestId('current-role').waitFor();
    await page.goto(`${BASE_URL}/moves/${savedMoveId}/edit`);
    await (await inputOf(page, 'f-customer')).waitFor();
    expect(await (await inputOf(page, 'f-customer')).inputValue()).toContain('Harrow Mill Supply');

    // someone else saves a change first
    const token = await apiToken('dispatcher@amberline.example');
    const current = await apiSend<{ version: number }>(token, 'GET', `/moves/${savedMoveId}`);
    await apiSend(token, 'PATCH', `/moves/${savedMoveId}`, { version: current.version, commodity: 'Wheel loader, bucket removed' });

    await fill(page, 'f-customer', `Harrow Mill Supply ${stamp} (yard 2)`);
    await page.getByTestId('save-move').click();
    await page.getByTestId('stale-edit').waitFor();
    const afterStale = await apiSend<{ customer: string }>(token, 'GET', `/moves/${savedMoveId}`);
    expect(afterStale.customer).toBe(`Harrow Mill Supply ${stamp}`); // nothing overwritten

    // after a reload the form holds the other change, and the save goes through
    await page.reload();
    expect(await (await inputOf(page, 'f-commodity')).inputValue()).toBe('Wheel loader, bucket removed');
    await fill(page, 'f-customer', `Harrow Mill Supply ${stamp} (yard 2)`);
    await page.getByTestId('save-move').click();
    await page.waitForURL(new RegExp(`/moves/${savedMoveId}$`));
    const history = page.getByTestId('section-history');
    await history.getByText(`Harrow Mill Supply ${stamp} (yard 2)`, { exact: false }).first().waitFor();
    expect(await history.getByTestId('history-entry').count()).toBe(3); // opened, edited by the API, edited here

    // a stage the permits do not allow yet is refused with the list of what is missing
    // every step asks for confirmation first
    await page.getByTestId('stage-to-permits_received').click();
    await page.getByRole('dialog').getByText('Every state that needs a permit has it issued').waitFor();
    await screenshot(page, 'move-page-confirm-step');
    await page.getByTestId('stage-confirm').click();
    await page.getByTestId('unmet-conditions').waitFor();
    expect(await page.getByTestId('unmet-conditions').textContent()).toMatch(/TX/);
    // cancelling asks for a reason, which lands in the history
    await page.getByTestId('stage-cancel').click();
    expect(await page.getByTestId('stage-confirm').isDisabled()).toBe(true); // no reason yet
    await page.getByTestId('stage-reason').fill('Customer postponed the job');
    await page.getByRole('button', { name: 'Cancel the move' }).click();
    await page.getByTestId('stage-tag').filter({ hasText: 'Cancelled' }).waitFor();
    await history.getByText('Reason: Customer postponed the job').waitFor();
    await screenshot(page, 'move-page-cancelled');
    // a cancelled move can be reopened, with a reason
    await page.getByTestId('stage-reopen').click();
    expect(await page.getByTestId('stage-confirm').isDisabled()).toBe(true);
    await page.getByTestId('stage-reason').fill('Customer confirmed new dates');
    await page.getByRole('button', { name: 'Reopen the move' }).click();
    await page.getByTestId('stage-tag').filter({ hasText: 'Requested' }).waitFor();
    await history.getByText('Reason: Customer confirmed new dates').waitFor();
    await page.close();
  }, 180_000);
});
