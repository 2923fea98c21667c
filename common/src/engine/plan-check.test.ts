import { planCheck, type PlanInput } from './plan-check';
import { SAMPLE_PLAN } from './sample-plan';

describe('planCheck', () => {
  const r = planCheck(SAMPLE_PLAN);

  it('runs the full plan: 9 axles with all bridge groups, 3 articles, 10 jurisdictions × 5 days', () => {
    expect(r.axles).toHaveLength(9);
    expect(r.federal.groups.filter((g) => g.rule !== 'gross').length).toBeGreaterThanOrEqual(9 + 30);
    expect(r.securement.map((s) => s.articleId)).toEqual(['excavator', 'bucket', 'blade']);
    expect(r.jurisdictions).toHaveLength(10);
    for (const j of r.jurisdictions) expect(j.travel).toHaveLength(5);
  });

  it('textbook statics: the axles carry the whole gross', () => {
    expect(r.axles.reduce((s, a) => s + a.weightLb, 0)).toBeCloseTo(r.axleLoads.grossLb, 6);
    expect(r.axleLoads.grossLb).toBe(12_000 + 14_000 + 30_000 + 60_000 + 4_000 + 2_500);
  });

  it('23 U.S.C. 127 / 23 CFR 658.15: an 11 ft wide 122,500 lb move needs a permit in every jurisdiction', () => {
    expect(r.summary.permitsNeeded).toHaveLength(10);
    const tx = r.jurisdictions.find((j) => j.code === 'TX')!;
    expect(tx.permitReasons.some((x) => x.code === 'over-legal-width')).toBe(true);
    // 43 TAC 219.13: $60 + $225 for 120,001–160,000 lb
    expect(tx.fee!.totalUsd).toBe(285);
  });

  it('jurisdictions without a rulebook record fall back to the federal defaults and say so', () => {
    const la = r.jurisdictions.find((j) => j.code === 'LA')!;
    expect(la.ruleFound).toBe(false);
    expect(r.summary.problems).toContain('LA: no rulebook record; federal defaults used');
  });

  it('24VAC20-82-110: Memorial Day 2027 (Monday 31 May) blocks Virginia from noon Friday; urban curfews apply', () => {
    const va = r.jurisdictions.find((j) => j.code === 'VA')!;
    const byDate = Object.fromEntries(va.travel.map((t) => [t.date, t]));
    expect(byDate['2027-05-28'].intervals.at(-1)!.endLocal).toBe('12:00');
    expect(byDate['2027-05-29'].allowed).toBe(false);
    expect(byDate['2027-05-31'].allowed).toBe(false);
    expect(byDate['2027-05-26'].intervals.map((i) => i.endLocal)).toContain('07:00');
  });

  it('earliest departure is the first legal moment in the origin jurisdiction (Tex. Transp. Code 541.401: 30 min before sunrise)', () => {
    const tx = r.jurisdictions[0];
    expect(r.summary.earliestDeparture).toBe(tx.travel[0].intervals[0].start);
    expect(Date.parse(r.summary.earliestDeparture!)).toBe(Date.parse(tx.travel[0].sunrise!) - 30 * 60_000);
  });

  it('49 CFR 393.87: 15 in side projection each side → side flags; securement passes (393.106, 393.110, 393.130)', () => {
    expect(r.markings.sideFlags).toBe(true);
    expect(r.securement.every((s) => s.ok)).toBe(true);
  });

  it('is deterministic and JSON-serialisable', () => {
    const again = planCheck(SAMPLE_PLAN);
    expect(again).toEqual(r);
    expect(JSON.parse(JSON.stringify(r))).toEqual(r);
  });

  it('a legal load needs no permit and no flags', () => {
    const legal: PlanInput = {
      ...SAMPLE_PLAN,
      articles: [{ ...SAMPLE_PLAN.articles[1], id: 'crate', positionFromTrailerFrontIn: 200, widthIn: 96 }],
      route: [SAMPLE_PLAN.route[0]],
    };
    const x = planCheck(legal);
    expect(x.summary.permitsNeeded).toEqual([]);
    expect(x.markings.flags).toEqual([]);
  });

  it.each([
    [{ route: [] }, /route must list at least one segment/],
    [{ travelDates: ['2027-02-30'] }, /date/],
    [{ tractor: { ...SAMPLE_PLAN.tractor, bumperToSteerIn: -1 } }, /tractor.bumperToSteerIn must be at least 0/],
    [{ articles: [{ ...SAMPLE_PLAN.articles[0], weightLb: Number.NaN }] }, /weightLb must be a finite number/],
  ])('bad input → RangeError (%#)', (patch, msg) => {
    expect(() => planCheck({ ...SAMPLE_PLAN, ...patch } as PlanInput)).toThrow(RangeError);
    expect(() => planCheck({ ...SAMPLE_PLAN, ...patch } as PlanInput)).toThrow(msg);
  });
});
