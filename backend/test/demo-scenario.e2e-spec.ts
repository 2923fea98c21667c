import { DEMO_MOVES, DEMO_TRACTORS, DEMO_TRAILERS, demoDeparture, type DemoMove } from '@amberline/seed';
import { createTestApp, type TestApp } from './utils/create-test-app';

/**
 * The demo moves, entered through the API on fresh units, checked against figures worked out by hand.
 * Each expectation names its source.
 */
describe('demo scenario assessments', () => {
  let t: TestApp;
  let admin: string;
  let dispatcher: string;
  const units = new Map<string, string>();
  const suffix = `${process.pid}${Date.now().toString(36)}`;
  beforeAll(async () => {
    t = await createTestApp();
    admin = (await t.signedIn({ role: 'admin' })).token;
    dispatcher = (await t.signedIn({ role: 'dispatcher' })).token;
    for (const tr of DEMO_TRACTORS) {
      const r = await t.http().post('/api/fleet/tractors').set('authorization', `Bearer ${admin}`).send({ ...tr, unitNumber: `${tr.unitNumber}-${suffix}` });
      units.set(tr.unitNumber, r.body.id);
    }
    for (const tl of DEMO_TRAILERS) {
      const r = await t.http().post('/api/fleet/trailers').set('authorization', `Bearer ${admin}`).send({ ...tl, unitNumber: `${tl.unitNumber}-${suffix}` });
      units.set(tl.unitNumber, r.body.id);
    }
  });
  afterAll(() => t.close());

  async function assess(key: string) {
    const d = DEMO_MOVES.find((m) => m.key === key) as DemoMove;
    const { tractor, trailer, departure, stage, stageReason, purpose, driver, key: _k, ...rest } = d;
    void stage; void stageReason; void purpose; void driver; void _k;
    const today = new Date().toISOString().slice(0, 10);
    const created = await t.http().post('/api/moves').set('authorization', `Bearer ${dispatcher}`).send({
      ...rest, tractorId: units.get(tractor), trailerId: units.get(trailer), requestedDeparture: demoDeparture(departure, today),
    });
    expect(created.status).toBe(201);
    const a = await t.http().get(`/api/moves/${created.body.id}/assessment`).set('authorization', `Bearer ${dispatcher}`);
    expect(a.status).toBe(200);
    return a.body.result;
  }

  it('excavator in Texas: 15 ft wide → permit; one front escort on the two-lane part, one rear on the interstate (TxDMV escort table, width over 14 ft to 16 ft)', async () => {
    const r = await assess('excavator-tx');
    expect(r.dimensions.widthIn).toBe(180); // load width 180 in > trailer 102 in (23 CFR 658.15: cargo counts toward width)
    const tx = r.jurisdictions.find((j: { code: string }) => j.code === 'TX');
    expect(tx.permitRequired).toBe(true);
    expect(tx.escorts.front).toBe(1);
    expect(tx.escorts.rear).toBe(1);
    expect(tx.escorts.heightPole).toBe(false);
  });

  it('transformer in Virginia: 36 in lower deck + 4 in dunnage + 142 in = 182 in (15 ft 2 in) > 14 ft 5 in → front car with height pole (24VAC20-81-180)', async () => {
    const r = await assess('transformer-va');
    expect(r.dimensions.heightIn).toBe(182);
    const va = r.jurisdictions.find((j: { code: string }) => j.code === 'VA');
    expect(va.escorts.heightPole).toBe(true);
    expect(va.escorts.front).toBeGreaterThanOrEqual(1);
    // 24VAC20-82-110: no travel from noon the weekday before Christmas; the planned days include Dec 24 and 25
    const windows = va.travel.map((d: { date?: string; allowed: boolean }) => d.allowed);
    expect(windows).toContain(false);
  });

  it('press through Ohio and Pennsylvania: gross 12,400 + 10,300 + 15,800 + 64,000 = 102,500 lb > 80,000 lb, with bridge-formula findings (23 U.S.C. 127)', async () => {
    const r = await assess('press-oh-pa');
    expect(r.axleLoads.grossLb).toBeCloseTo(102_500, 0);
    expect(r.federal.legal).toBe(false);
    expect(r.federal.violations.some((v: { rule: string }) => v.rule === 'bridge-formula')).toBe(true);
    expect(r.summary.permitsNeeded).toEqual(['OH', 'PA']);
  });

  it('girders in Maryland: 47 ft long, not blocked → 2 + 4 = 6 tiedowns needed, 3 planned; direct chains on 5,000 lb stake pockets credit 3 × 2,500 = 7,500 lb < 19,000 lb (49 CFR 393.110, 393.106, 393.108)', async () => {
    const r = await assess('beams-md');
    const s = r.securement[0];
    expect(s.requiredCount).toBe(6);
    expect(s.aggregateLb).toBe(7_500);
    expect(s.requiredAggregateLb).toBe(19_000);
    expect(s.ok).toBe(false);
  });

  it('vessel section in Pennsylvania: 204 in (17 ft) wide is over the sample superload width of 16 ft', async () => {
    const r = await assess('vessel-pa-superload');
    expect(r.summary.superloads).toEqual(['PA']);
  });
});
