import type { Role } from '@amberline/common';
import { seedPermit, seedTractor, seedTrailer } from '@amberline/seed';
import { dateIn, daysFromNow, texasMove } from './fixtures/moves';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { embeddedFonts, pdfText } from './utils/pdf-text';

describe('run sheets and departure checks', () => {
  let t: TestApp;
  const tokens = {} as Record<Role, string>;
  let driverId: string;
  let otherDriver: string;
  let tractorId: string;
  let trailerId: string;
  beforeAll(async () => {
    t = await createTestApp();
    const users = await t.signedInAll();
    for (const role of Object.keys(users) as Role[]) {
      tokens[role] = users[role].token;
    }
    driverId = users.driver.id;
    otherDriver = (await t.signedIn({ role: 'driver' })).token;
    tractorId = (await seedTractor(t.ds)).id;
    trailerId = (await seedTrailer(t.ds)).id;
  });
  afterAll(() => t.close());
  const as = (role: Role) => ({ authorization: `Bearer ${tokens[role]}` });

  /** A move assigned to the test driver, at escorts_booked (the permit and escort guards are tested in their own files). */
  async function readyMove(departingToday = false) {
    // a move runs only from its earliest legal departure: one that is to run now departs today (Texas time)
    const m = (await t.http().post('/api/moves').set(as('dispatcher')).send(texasMove(tractorId, trailerId, { driverId, ...(departingToday ? { requestedDeparture: dateIn('America/Chicago') } : {}) }))).body;
    await t.ds.query(`UPDATE moves SET stage = 'escorts_booked' WHERE id = $1`, [m.id]);
    const sheet = (await t.http().get(`/api/moves/${m.id}/run-sheet`).set(as('driver'))).body;
    return { m, sheet };
  }
  /** The gauge pressure that reads the planned trailer-group weight on the seeded calibration (12 psi → 9,800 lb, 62 psi → 33,900 lb). */
  const psiForPlan = (lb: number) => Math.round((12 + (lb - 9_800) / 482) * 2) / 2;
  const goodChecks = (sheet: { checkAgainst: { heightIn: number; widthIn: number; lengthIn: number }; axles: { trailerLb: number } }) => ({
    measuredHeightIn: sheet.checkAgainst.heightIn,
    measuredWidthIn: sheet.checkAgainst.widthIn,
    measuredLengthIn: sheet.checkAgainst.lengthIn - 2,
    sliderPinsLocked: true,
    tiresInflated: true,
    markingsInPlace: true,
    permitsOnBoard: true,
    gaugeReadings: [{ group: 'trailer', psi: psiForPlan(sheet.axles.trailerLb) }],
  });

  it('shows the run sheet to the assigned driver and the office, 403 to another driver', async () => {
    const { m, sheet } = await readyMove();
    expect(sheet.move.reference).toBe(m.reference);
    expect(sheet.fingerprint).toMatch(/^[0-9a-f]{64}$/);
    expect(sheet.travel[0].jurisdiction).toBe('TX');
    expect(sheet.cautions.join(' ')).toMatch(/certified scale/);
    expect(sheet.markings.flags.length).toBeGreaterThan(0); // 15 ft wide on a 102 in deck: 39 in each side, more than 4 in (49 CFR 393.87)
    expect((await t.http().get(`/api/moves/${m.id}/run-sheet`).set({ authorization: `Bearer ${otherDriver}` })).status).toBe(403);
    expect((await t.http().get(`/api/moves/${m.id}/run-sheet`).set(as('permit_clerk'))).status).toBe(200);
    expect((await t.http().get(`/api/moves/${m.id}/run-sheet`).set(as('dispatcher'))).status).toBe(200);
  });

  it('role matrix for the driver-only writes', async () => {
    const { m, sheet } = await readyMove();
    for (const role of ['admin', 'dispatcher', 'permit_clerk'] as Role[]) {
      expect((await t.http().post(`/api/moves/${m.id}/departure-checks`).set(as(role)).send(goodChecks(sheet))).status).toBe(403);
      expect((await t.http().post(`/api/moves/${m.id}/run-sheet/acknowledgement`).set(as(role)).send({ fingerprint: sheet.fingerprint })).status).toBe(403);
    }
    expect((await t.http().post(`/api/moves/${m.id}/departure-checks`).set({ authorization: `Bearer ${otherDriver}` }).send(goodChecks(sheet))).status).toBe(403);
  });

  it('a measured height over the plan beyond the tolerance blocks departure and tells the dispatcher', async () => {
    const { m, sheet } = await readyMove();
    const res = await t.http().post(`/api/moves/${m.id}/departure-checks`).set(as('driver')).send({ ...goodChecks(sheet), measuredHeightIn: sheet.checkAgainst.heightIn + 2 });
    expect(res.status).toBe(201);
    expect(res.body.outcome).toBe('blocked');
    expect(res.body.findings[0]).toMatchObject({ code: 'height_over', blocking: true });
    const ack = await t.http().post(`/api/moves/${m.id}/run-sheet/acknowledgement`).set(as('driver')).send({ fingerprint: sheet.fingerprint });
    expect(ack.status).toBe(409);
    const hist = (await t.http().get(`/api/moves/${m.id}/history`).set(as('dispatcher'))).body;
    expect(hist.some((h: { action: string }) => h.action === 'departure_blocked')).toBe(true);
    // and an e-mail to the dispatcher who opened the move is in the outbox, written with the checks
    const [dispatcherEmail] = await t.ds.query(`SELECT u.email FROM users u JOIN moves m ON m.created_by = u.id WHERE m.id = $1`, [m.id]);
    const mails = await t.ds.query(`SELECT to_addresses, subject, text_body FROM mail_outbox WHERE related_entity = 'departure_checks' AND related_id = $1`, [res.body.id]);
    expect(mails).toHaveLength(1);
    expect(mails[0].to_addresses).toContain(dispatcherEmail.email);
    expect(mails[0].subject).toBe(`Departure blocked: ${m.reference} (${m.customer})`);
    expect(mails[0].text_body).toMatch(/measured height .* over the planned/);
    const run = await t.http().post(`/api/moves/${m.id}/stage`).set(as('dispatcher')).send({ to: 'running' });
    expect(run.status).toBe(409);
    expect(run.body.details.unmet.map((u: { code: string }) => u.code)).toContain('run_sheet_not_acknowledged');
  });

  it('passing checks, then the acknowledgement, lets the dispatcher start the move; the gauge gives an estimate', async () => {
    const { m, sheet } = await readyMove(true);
    // calibration 12 psi → 9,800 lb and 62 psi → 33,900 lb: 60 psi → 9,800 + 48 × 482 = 32,936 lb (affine fit, two points);
    // the driver also weighed the group, so an estimate off the plan does not hold the move
    const checks = await t.http().post(`/api/moves/${m.id}/departure-checks`).set(as('driver')).send({ ...goodChecks(sheet), gaugeReadings: [{ group: 'trailer', psi: 60 }], scaleWeights: [{ group: 'trailer', lb: 32_800 }] });
    expect(checks.body.outcome).toBe('passed');
    expect(checks.body.gaugeEstimates[0].loadLb).toBeCloseTo(32_936, 0);
    const wrong = await t.http().post(`/api/moves/${m.id}/run-sheet/acknowledgement`).set(as('driver')).send({ fingerprint: 'f'.repeat(64) });
    expect(wrong.status).toBe(409);
    const ack = await t.http().post(`/api/moves/${m.id}/run-sheet/acknowledgement`).set(as('driver')).send({ fingerprint: sheet.fingerprint });
    expect(ack.status).toBe(201);
    expect(ack.body.acknowledgement).toMatchObject({ current: true, fingerprint: sheet.fingerprint });
    const run = await t.http().post(`/api/moves/${m.id}/stage`).set(as('dispatcher')).send({ to: 'running' });
    expect(run.status).toBe(201);
    expect(run.body.stage).toBe('running');
  });

  describe('a gauge estimate far off the plan (more than 15 %, common practice, no published source)', () => {
    // calibration 12 psi → 9,800 lb and 62 psi → 33,900 lb: 20 psi → 9,800 + 8 × 482 = 13,656 lb, far under the plan
    const farOff = (sheet: Parameters<typeof goodChecks>[0]) => ({ ...goodChecks(sheet), gaugeReadings: [{ group: 'trailer', psi: 20 }] });

    it('blocks the checks until the driver records a certified scale weight', async () => {
      const { m, sheet } = await readyMove();
      expect(Math.abs(13_656 - sheet.axles.trailerLb) / sheet.axles.trailerLb).toBeGreaterThan(0.15);
      const blocked = await t.http().post(`/api/moves/${m.id}/departure-checks`).set(as('driver')).send(farOff(sheet));
      expect(blocked.body.outcome).toBe('blocked');
      expect(blocked.body.findings).toEqual([expect.objectContaining({ code: 'gauge_differs', blocking: true, message: expect.stringMatching(/^gauge estimate 13,656 lb on the trailer group is \d+ % off the planned .* \(limit 15 %, common practice\): weigh the group/) })]);
      const weighed = await t.http().post(`/api/moves/${m.id}/departure-checks`).set(as('driver')).send({ ...farOff(sheet), scaleWeights: [{ group: 'trailer', lb: 31_200, ticket: 'CAT-55120' }] });
      expect(weighed.body.outcome).toBe('passed');
      expect(weighed.body.findings).toEqual([expect.objectContaining({ code: 'gauge_differs_scaled', blocking: false, message: expect.stringMatching(/certified scale weight recorded: 31,200 lb \(ticket CAT-55120\)$/) })]);
      expect(weighed.body.scaleWeights).toEqual([{ group: 'trailer', lb: 31_200, ticket: 'CAT-55120' }]);
    });

    it('or until a dispatcher overrides with a reason; nothing else can be overridden, and only by the office', async () => {
      const { m, sheet } = await readyMove();
      const blocked = (await t.http().post(`/api/moves/${m.id}/departure-checks`).set(as('driver')).send(farOff(sheet))).body;
      const url = `/api/moves/${m.id}/departure-checks/${blocked.id}/override`;
      expect((await t.http().post(url).set(as('driver')).send({ reason: 'scale ticket seen' })).status).toBe(403);
      const noReason = await t.http().post(url).set(as('dispatcher')).send({});
      expect(noReason.status).toBe(400);
      expect(noReason.body.details[0].field).toBe('reason');
      const ok = await t.http().post(url).set(as('dispatcher')).send({ reason: 'scale ticket from the shipper: 31,150 lb on the trailer group' });
      expect(ok.status).toBe(201);
      expect(ok.body).toMatchObject({ outcome: 'passed', override: { reason: 'scale ticket from the shipper: 31,150 lb on the trailer group' } });
      const ack = await t.http().post(`/api/moves/${m.id}/run-sheet/acknowledgement`).set(as('driver')).send({ fingerprint: sheet.fingerprint });
      expect(ack.status).toBe(201);
      const hist = (await t.http().get(`/api/moves/${m.id}/history`).set(as('dispatcher'))).body as { action: string; reason: string | null }[];
      expect(hist.find((h) => h.action === 'departure_checks_overridden')?.reason).toMatch(/scale ticket from the shipper/);
      // a height over the plan is never overridden
      const tall = (await t.http().post(`/api/moves/${m.id}/departure-checks`).set(as('driver')).send({ ...farOff(sheet), measuredHeightIn: sheet.checkAgainst.heightIn + 3 })).body;
      const refused = await t.http().post(`/api/moves/${m.id}/departure-checks/${tall.id}/override`).set(as('dispatcher')).send({ reason: 'looks fine' });
      expect(refused.status).toBe(409);
      expect(refused.body.message).toMatch(/Only a gauge finding can be overridden; still blocking: measured height/);
    });
  });

  it('a change to the plan after the acknowledgement voids it and asks for a new one', async () => {
    const { m, sheet } = await readyMove();
    await t.http().post(`/api/moves/${m.id}/departure-checks`).set(as('driver')).send(goodChecks(sheet)).expect(201);
    await t.http().post(`/api/moves/${m.id}/run-sheet/acknowledgement`).set(as('driver')).send({ fingerprint: sheet.fingerprint }).expect(201);
    const cur = (await t.http().get(`/api/moves/${m.id}`).set(as('dispatcher'))).body;
    await t.http().patch(`/api/moves/${m.id}`).set(as('dispatcher')).send({ version: cur.version, sliderSettingFt: 36 }).expect(200);
    const after = (await t.http().get(`/api/moves/${m.id}/run-sheet`).set(as('driver'))).body;
    expect(after.fingerprint).not.toBe(sheet.fingerprint);
    expect(after.acknowledgement).toBeNull();
    const run = await t.http().post(`/api/moves/${m.id}/stage`).set(as('dispatcher')).send({ to: 'running' });
    expect(run.status).toBe(409);
    expect(run.body.details.unmet.map((u: { code: string }) => u.code)).toContain('run_sheet_not_acknowledged');
  });

  it('lists the move\'s permits with number and validity; a permit issued after the acknowledgement voids it', async () => {
    const { m, sheet } = await readyMove();
    await t.http().post(`/api/moves/${m.id}/departure-checks`).set(as('driver')).send(goodChecks(sheet)).expect(201);
    await t.http().post(`/api/moves/${m.id}/run-sheet/acknowledgement`).set(as('driver')).send({ fingerprint: sheet.fingerprint }).expect(201);
    const p = await seedPermit(t.ds, { moveId: m.id, jurisdiction: 'TX', status: 'issued', permitNumber: `TX-RS-${Date.now()}`, validFrom: `${daysFromNow(9)}T06:00:00Z`, validTo: `${daysFromNow(10)}T18:00:00Z` });
    const after = (await t.http().get(`/api/moves/${m.id}/run-sheet`).set(as('driver'))).body;
    expect(after.permits).toEqual([expect.objectContaining({ jurisdiction: 'TX', number: p.permitNumber, status: 'issued' })]);
    // valid until noon (Central) on the travel day: it ends before the planned exit from Texas
    expect(after.permits[0].warning).toMatch(/before the planned exit/);
    expect(after.fingerprint).not.toBe(sheet.fingerprint);
    expect(after.acknowledgement.current).toBe(false);
    const pdf = await t.http().get(`/api/moves/${m.id}/run-sheet.pdf`).set(as('driver')).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(await pdfText(pdf.body as Buffer)).toContain(p.permitNumber!);
  });

  it.each([
    ['a height of zero', { measuredHeightIn: 0 }, 'measuredHeightIn'],
    ['a width as text', { measuredWidthIn: 'wide' }, 'measuredWidthIn'],
    ['an absurd gauge pressure', { gaugeReadings: [{ group: 'trailer', psi: 900 }] }, 'gaugeReadings[0].psi'],
    ['a missing check', { tiresInflated: undefined }, 'tiresInflated'],
  ])('rejects %s with 400 naming the field', async (_l, over, field) => {
    const { m, sheet } = await readyMove();
    const res = await t.http().post(`/api/moves/${m.id}/departure-checks`).set(as('driver')).send({ ...goodChecks(sheet), ...over });
    expect(res.status).toBe(400);
    expect(res.body.details.map((d: { field: string }) => d.field)).toContain(field);
  });

  it('prints a PDF with Noto Sans embedded, holding the move reference, the route and the cautions', async () => {
    const { m } = await readyMove();
    const res = await t.http().get(`/api/moves/${m.id}/run-sheet.pdf`).set(as('driver')).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const pdf = res.body as Buffer;
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    const text = await pdfText(pdf);
    expect(text).toContain(`Run sheet ${m.reference}`);
    expect(text).toContain('FM 1960, US 290');
    expect(text).toMatch(/certified scale/);
    const fonts = await embeddedFonts(pdf);
    expect(fonts.some((f) => /NotoSans/.test(f))).toBe(true);
  });
});
