import type { Browser, Page } from 'playwright-core';
import { STEP_DECK_DEFAULTS, TRACTOR_DEFAULTS } from '../../seed/src/builders/fleet';
import { vendorDefaults } from '../../seed/src/builders/vendor';
import { BASE_URL, launch, screenshot, signIn } from './support/browser';
import { apiPost, apiToken, pick } from './support/forms';
import { wideExcavatorArticle } from './support/fixtures';

const stamp = `${Date.now().toString(36)}${process.pid.toString(36)}`.toUpperCase();
const day = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);
/** The web inbox test.sh starts for the browser-test server (maildev's REST API). */
const INBOX = `http://127.0.0.1:${process.env.MAILDEV_WEB_PORT ?? 1180}`;

type InboxMail = { subject: string; text: string; to: { address: string }[] };

/** Waits for the e-mail to `to` whose subject starts with `subject`, as caught by the inbox. */
async function waitForMail(to: string, subject: string, timeoutMs = 40_000): Promise<InboxMail> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const res = await fetch(`${INBOX}/email`).catch(() => null);
    if (res?.ok) {
      const all = (await res.json()) as InboxMail[];
      const hit = all.find((m) => m.to.some((a) => a.address.toLowerCase() === to.toLowerCase()) && m.subject.startsWith(subject));
      if (hit) return hit;
    }
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`no "${subject}" e-mail to ${to} within ${timeoutMs} ms (is the inbox on ${INBOX}?)`);
}

describe('escort booking in the browser', () => {
  let browser: Browser;
  let moveId = '';
  let moveRef = '';
  let vendor: { id: string; company: string; email: string };

  beforeAll(async () => {
    browser = await launch();
    const admin = await apiToken('admin@amberline.example');
    const tractor = await apiPost<{ id: string }>(admin, '/fleet/tractors', { ...TRACTOR_DEFAULTS, unitNumber: `E2E-ET${stamp}`, plate: `E${stamp.slice(-6)}` });
    const trailer = await apiPost<{ id: string }>(admin, '/fleet/trailers', { ...STEP_DECK_DEFAULTS, unitNumber: `E2E-ES${stamp}` });
    const dispatcher = await apiToken('dispatcher@amberline.example');
    vendor = await apiPost(dispatcher, '/vendors', { ...vendorDefaults(), company: `Cedar Bend Pilot Cars ${stamp}`, email: `dispatch.${stamp.toLowerCase()}@cedarbend.test.amberline.example` });
    // 15 ft wide on a Texas two-lane road: one front escort (TxDMV, width over 14 ft to 16 ft)
    const move = await apiPost<{ id: string; reference: string }>(dispatcher, '/moves', {
      customer: `Larkspur Aggregates ${stamp}`,
      commodity: 'Tracked excavator',
      articles: [wideExcavatorArticle()],
      tractorId: tractor.id,
      trailerId: trailer.id,
      sliderSettingFt: 39,
      route: [{ order: 1, jurisdiction: 'TX', roads: 'FM 1960, US 290', miles: 60, roadType: 'two-lane', zip: '77429' }],
      origin: 'Cypress, TX',
      destination: 'Fredericksburg, TX',
      requestedDeparture: day(11),
      travelDays: 1,
    });
    moveId = move.id;
    moveRef = move.reference;
  });
  afterAll(() => browser?.close());

  it('the dispatcher requests an escort, the vendor confirms through the e-mailed link, and the dispatcher sees it', async () => {
    const desk: Page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await signIn(desk, 'dispatcher@amberline.example');
    await desk.getByTestId('current-role').waitFor();

    await desk.goto(`${BASE_URL}/vendors`);
    await desk.getByTestId('vendors-table').getByText(vendor.company).waitFor();
    await screenshot(desk, 'escorts-1-vendors');
    await desk.getByTestId('add-vendor').click();
    await desk.getByTestId('vendor-form').waitFor();
    await screenshot(desk, 'escorts-1b-vendor-form');
    await desk.keyboard.press('Escape');

    await desk.goto(`${BASE_URL}/moves/${moveId}`);
    const section = desk.getByTestId('move-escorts');
    await section.waitFor();
    await section.getByTestId('coverage-TX-open').waitFor();
    await section.getByTestId('request-escort').click();
    const drawer = desk.getByTestId('request-escort-drawer');
    await drawer.waitFor();
    await pick(desk, 'request-vendor', vendor.company);
    await drawer.getByLabel('Meeting point').fill('Cypress yard, gate 2');
    await drawer.getByLabel('Meeting time (local, 24-hour)').fill('05:30');
    await screenshot(desk, 'escorts-2-request-form');
    await drawer.getByTestId('send-escort-request').click();
    await section.getByTestId('coverage-TX-requested').waitFor();
    await section.getByTestId('booking-status-requested').waitFor();
    await screenshot(desk, 'escorts-3-requested');

    // the vendor's e-mail, sent by the server's outbox worker to the local inbox
    const mail = await waitForMail(vendor.email, `Escort request ${moveRef}`);
    expect(mail.text).toContain('Meeting point: Cypress yard, gate 2 at 05:30 local time');
    const link = mail.text.match(/\/escort-response\/([A-Za-z0-9_-]{43})/);
    expect(link).not.toBeNull();

    // the vendor has no account: a fresh browser context with nothing stored
    const vendorCtx = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const vp = await vendorCtx.newPage();
    expect(await vp.evaluate(() => localStorage.length).catch(() => 0)).toBe(0);
    await vp.goto(`${BASE_URL}/escort-response/${link![1]}`);
    await vp.getByTestId('escort-request').waitFor();
    expect(await vp.getByTestId('escort-request').textContent()).toContain(moveRef);
    await vp.getByLabel('Operator').fill('Rosalind Quade');
    await vp.getByLabel('Vehicle').fill('White pickup with pole, PLT-0001');
    await vp.getByLabel('Phone on the road').fill('+1 512 555 0142');
    // a typed certificate number goes as one certificate for its state, not one a character
    await vp.getByLabel('TX certificate number').fill('TX-EC 40417');
    await screenshot(vp, 'escorts-4-vendor-page-phone');
    await vp.getByTestId('send-answer').click();
    await vp.getByTestId('answer-result').waitFor();
    expect(await vp.getByTestId('answer-result').textContent()).toContain('Confirmed');
    await screenshot(vp, 'escorts-5-vendor-confirmed-phone');

    // the dispatcher's page picks the answer up by itself
    await section.getByTestId('coverage-TX-confirmed').waitFor({ timeout: 15_000 });
    await section.getByTestId('answer-operator').filter({ hasText: 'Rosalind Quade' }).waitFor();
    expect(await section.textContent()).toContain('Certificates: TX TX-EC 40417');
    await screenshot(desk, 'escorts-6-dispatcher-sees-confirmation');

    // the link has done its one job; an altered one reveals nothing
    await vp.goto(`${BASE_URL}/escort-response/${link![1]}`);
    await vp.getByTestId('link-problem').getByText('This request has already been answered', { exact: true }).waitFor();
    await screenshot(vp, 'escorts-7-link-used-phone');
    await vp.goto(`${BASE_URL}/escort-response/${link![1].slice(0, 42)}x`);
    await vp.getByTestId('link-problem').getByText('This link is not valid', { exact: true }).waitFor();
    expect(await vp.content()).not.toContain(moveRef);
    await vendorCtx.close();
    await desk.close();
  }, 120_000);
});
